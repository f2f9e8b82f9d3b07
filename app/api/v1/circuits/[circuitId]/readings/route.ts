import { db } from "@/db";
import { createReading, getCircuit, getReading, listReadings } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { probeIssues } from "@/lib/circuit";
import { implausibleReading } from "@/lib/diagnosis/plausibility";
import { createReadingInput } from "@/lib/validators/work";

// GET /api/v1/circuits/:circuitId/readings - the meter readings taken on this circuit, oldest first
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target }) => {
  return Response.json({ readings: await listReadings(db, target.circuitId!) });
});

// POST /api/v1/circuits/:circuitId/readings - record a reading between two terminals in one operating state
export const POST = workRoute({ resource: "circuit", need: "edit", body: createReadingInput }, async ({ target, user, body }) => {
  const circuit = await getCircuit(db, target.circuitId!);
  const issues = circuit ? probeIssues(circuit.document, body) : [];
  if (issues.length) throw new ApiError(422, "invalid-request", "The reading does not fit this circuit; see issues.", issues);
  const implausible = circuit ? implausibleReading(circuit.document, body) : [];
  if (implausible.length) throw new ApiError(422, "implausible-reading", `Nothing was saved: ${implausible[0].message}`, implausible.map(({ path, message }) => ({ path, message })));
  const id = await createReading(db, { circuitId: target.circuitId!, jobId: target.jobId, organizationId: target.organizationId, userId: user.id, reading: body });
  return Response.json({ reading: await getReading(db, id) }, { status: 201 });
});
