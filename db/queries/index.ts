export * from "./workspaces";
export * from "./api-keys";
export * from "./users";
export * from "./health";
export * from "./memberships";
