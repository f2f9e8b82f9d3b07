export * from "./load";
export * from "./schema";
export * from "./terminals";
export * from "./diff";
