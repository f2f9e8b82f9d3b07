export * from "./load";
export * from "./schema";
