import { db } from "@/db";
import { getLimits } from "@/db/queries/limits";
import { listOwnPlans } from "@/db/queries/plans";
import { getCircuit, listReadings } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { loadCircuit } from "@/lib/circuit";
import { BUILT_IN_PLANS } from "@/lib/diagnosis/plans";
import { planVerdict } from "@/lib/diagnosis/report";

// GET /api/v1/circuits/:circuitId/plans/:planId/verdict - a test plan's checks and verdict on this circuit, judged by the organisation's limits
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target, params }) => {
  const [circuit, readings, limits, own] = await Promise.all([
    getCircuit(db, target.circuitId!),
    listReadings(db, target.circuitId!),
    getLimits(db, target.organizationId),
    listOwnPlans(db, target.organizationId),
  ]);
  if (!circuit) throw new ApiError(404, "not-found", "There is no such circuit.");
  const plan = [...BUILT_IN_PLANS, ...own.map((p) => p.plan)].find((p) => p.id === params.planId);
  if (!plan) throw new ApiError(404, "not-found", `There is no test plan "${params.planId}" here (built in: ${BUILT_IN_PLANS.map((p) => p.id).join(", ")}).`);
  const loaded = loadCircuit(circuit.document);
  if (!loaded.ok) throw new ApiError(409, "invalid-document", "The stored circuit no longer loads; open it in the workspace and save it again.");
  return Response.json({ circuit: { id: circuit.id, version: circuit.version }, ...planVerdict(plan, loaded.document, readings, limits.limits) });
});
