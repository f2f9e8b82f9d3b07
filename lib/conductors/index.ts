export * from "./ampacity";
export * from "./devices";
export * from "./insulation";
export * from "./materials";
export * from "./protection";
export * from "./resistance";
export * from "./sizes";
export * from "./sizing";
