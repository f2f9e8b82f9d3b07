import { db } from "@/db";
import { createCircuit, getCircuit } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { etagOf } from "@/lib/api/work-responses";
import { probeIssues } from "@/lib/circuit";
import { importInput, MAX_WORK_BYTES } from "@/lib/validators/work";

// POST /api/v1/jobs/:jobId/import - add a circuit from an export file (with its readings) or a bare document
export const POST = workRoute({ resource: "job", need: "edit", body: importInput, maxBytes: MAX_WORK_BYTES }, async ({ target, user, body }) => {
  const document = "format" in body ? body.circuit.document : body.document;
  const readings = "format" in body ? body.readings : [];
  const issues = readings.flatMap((r, i) => probeIssues(document, r, `readings.${i}.`));
  if (issues.length) throw new ApiError(422, "invalid-request", "Some readings do not fit the circuit in the file; see issues.", issues);
  const id = await createCircuit(db, {
    jobId: target.jobId,
    organizationId: target.organizationId,
    userId: user.id,
    document,
    message: "Imported from a file",
    action: "circuit.import",
    // Who took an imported reading is kept in its note: the people of another organisation are not ours to link.
    readings: readings.map(({ takenBy, id: _id, ...r }) => {
      void _id;
      return { ...r, note: takenBy ? `${r.note}${r.note ? " " : ""}(taken by ${takenBy})`.slice(0, 2000) : r.note };
    }),
  });
  return Response.json({ circuit: await getCircuit(db, id), readings: readings.length }, { status: 201, headers: { etag: etagOf(1), location: `/api/v1/circuits/${id}` } });
});
