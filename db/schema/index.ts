export * from "./auth";
export * from "./api-keys";
export * from "./datasets";
export * from "./fits";
