export * from "./meta";
export * from "./organizations";
export * from "./vehicles";
