export * from "./auth";
export * from "./api-keys";
