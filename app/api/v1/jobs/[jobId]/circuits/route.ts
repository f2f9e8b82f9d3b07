import { db } from "@/db";
import { createCircuit, getCircuit, getJob, listCircuits } from "@/db/queries/work";
import { workRoute } from "@/lib/api/work";
import { etagOf } from "@/lib/api/work-responses";
import { emptyCircuit } from "@/lib/circuit";
import { createCircuitInput, MAX_WORK_BYTES } from "@/lib/validators/work";

// GET /api/v1/jobs/:jobId/circuits - the job's circuits, with sizes and reading counts
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target }) => {
  return Response.json({ circuits: await listCircuits(db, target.jobId) });
});

// POST /api/v1/jobs/:jobId/circuits - add a circuit, empty (name) or from a document; it starts at version 1
export const POST = workRoute({ resource: "job", need: "edit", body: createCircuitInput, maxBytes: MAX_WORK_BYTES }, async ({ target, user, body }) => {
  const job = await getJob(db, target.jobId);
  const base = body.document ?? emptyCircuit(body.name ?? "Circuit", job?.systemVoltage ?? 12);
  const document = body.name ? { ...base, name: body.name } : base;
  const id = await createCircuit(db, { jobId: target.jobId, organizationId: target.organizationId, userId: user.id, document, message: body.message });
  const circuit = await getCircuit(db, id);
  return Response.json({ circuit }, { status: 201, headers: { etag: etagOf(1), location: `/api/v1/circuits/${id}` } });
});
