export * from "./accounts";
export * from "./projects";
export * from "./mail";
export * from "./audit";
export * from "./drafts";
export * from "./revisions";
export * from "./vendor";
export * from "./commissioning";
