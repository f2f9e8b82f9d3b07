export { solveCircuit, type AlternatorMode } from "./solve";
export * from "./types";
