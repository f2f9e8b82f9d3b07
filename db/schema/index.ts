export * from "./meta";
export * from "./organizations";
export * from "./vehicles";
export * from "./auth";
export * from "./mail";
export * from "./work";
