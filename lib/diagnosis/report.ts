import type { CircuitDocument } from "@/lib/circuit";
import { checkReadings, type Reading, type ReadingCheck } from "./compare";
import type { Limits } from "./limits";
import { locateFault, type Location } from "./locate";
import { runPlan, type Plan, type PlanVerdict, type StepResult } from "./plans";

/**
 * A circuit's diagnosis as data: each reading against the model, and where the readings put extra resistance. What
 * the circuit page, the canvas and the API show is this, so they cannot disagree.
 */
export function diagnose(doc: CircuitDocument, readings: Reading[]): { readings: ReadingCheck[]; location: Location } {
  return { readings: checkReadings(doc, readings), location: locateFault(doc, readings) };
}

/** A plan's checks and verdict on a circuit, shaped for the API (the plan's own text stays with the plan). */
export function planVerdict(plan: Plan, doc: CircuitDocument, readings: Reading[], limits?: Limits): { plan: { id: string; name: string }; steps: (Omit<StepResult, "step"> & { id: string; title: string })[]; verdict: PlanVerdict } {
  const run = runPlan(plan, doc, readings, limits);
  return {
    plan: { id: plan.id, name: plan.name },
    steps: run.steps.map(({ step, ...rest }) => ({ id: step.id, title: step.title, ...rest })),
    verdict: run.verdict,
  };
}
