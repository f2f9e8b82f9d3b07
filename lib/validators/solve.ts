import { z } from "zod";

/** Largest circuit the public solve endpoint takes. */
export const MAX_SOLVE_COMPONENTS = 5000;
export const MAX_SOLVE_BYTES = 4 * 1024 * 1024;

/** POST /api/v1/solve body; the circuit itself is read by loadCircuit (which migrates older versions). */
export const solveRequest = z.strictObject({
  circuit: z.record(z.string(), z.unknown(), { error: "circuit must be a circuit document (a JSON object)" }),
  state: z.string().min(1).max(64).default("base"),
});
