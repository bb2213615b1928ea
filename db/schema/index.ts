export * from "./auth";
export * from "./workspaces";
export * from "./facilities";
export * from "./revisions";
export * from "./ops";
export * from "./energy";
