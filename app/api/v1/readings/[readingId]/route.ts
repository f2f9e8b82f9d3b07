import { db } from "@/db";
import { deleteReading, getCircuit, getReading, updateReading } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { probeIssues } from "@/lib/circuit";
import { implausibleReading } from "@/lib/diagnosis/plausibility";
import { updateReadingInput } from "@/lib/validators/work";

// PATCH /api/v1/readings/:readingId - correct a reading (value, unit, probes, state, current, note, time)
export const PATCH = workRoute({ resource: "reading", need: "edit", body: updateReadingInput }, async ({ target, user, body }) => {
  const [before, circuit] = await Promise.all([getReading(db, target.readingId!), getCircuit(db, target.circuitId!)]);
  if (before && circuit) {
    const merged = { positive: body.positive ?? before.positive, negative: body.negative ?? before.negative, stateId: body.stateId ?? before.stateId };
    // Only the fields being changed must fit the circuit as it is now; an old reading may name a part since removed.
    const changed = probeIssues(circuit.document, merged).filter((i) => i.path in body || (i.path === "negative" && "positive" in body));
    if (changed.length) throw new ApiError(422, "invalid-request", "The change does not fit this circuit; see issues.", changed);
    if (["value", "unit", "positive", "negative", "stateId"].some((k) => k in body)) {
      const implausible = implausibleReading(circuit.document, { ...merged, value: body.value ?? before.value, unit: body.unit ?? (before.unit as "V" | "mV") });
      if (implausible.length) throw new ApiError(422, "implausible-reading", `Nothing was changed: ${implausible[0].message}`, implausible.map(({ path, message }) => ({ path, message })));
    }
  }
  await updateReading(db, { readingId: target.readingId!, jobId: target.jobId, organizationId: target.organizationId, userId: user.id, changes: body });
  return Response.json({ reading: await getReading(db, target.readingId!) });
});

// DELETE /api/v1/readings/:readingId - remove a reading taken in error
export const DELETE = workRoute({ resource: "reading", need: "edit" }, async ({ target, user }) => {
  await deleteReading(db, { readingId: target.readingId!, jobId: target.jobId, organizationId: target.organizationId, userId: user.id });
  return new Response(null, { status: 204 });
});
