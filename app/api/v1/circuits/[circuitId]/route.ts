import { db } from "@/db";
import { deleteCircuit, saveCircuit } from "@/db/queries/work";
import { errorResponse } from "@/lib/api/errors";
import { workRights, workRoute } from "@/lib/api/work";
import { etagOf, expectedVersion } from "@/lib/api/work-responses";
import { MAX_WORK_BYTES, replaceCircuitInput } from "@/lib/validators/work";

// GET /api/v1/circuits/:circuitId - the circuit document and its version (ETag "N")
export const GET = workRoute({ resource: "circuit", need: "read", withCircuit: true }, async ({ target, membership, user, circuit }) => {
  if (!circuit) return errorResponse(404, "not-found", "There is no such circuit.");
  const canEdit = workRights(membership.role, target.ownerId === user.id).edit;
  const meta = { id: circuit.id, jobId: circuit.jobId, name: circuit.name, version: circuit.version, createdAt: circuit.createdAt, updatedAt: circuit.updatedAt, updatedByName: circuit.updatedByName, jobTitle: circuit.jobTitle };
  // The stored document goes out as the database holds it: a large circuit is not parsed and re-serialised here.
  const body = `{"circuit":${JSON.stringify(meta).slice(0, -1)},"document":${circuit.documentJson}},"canEdit":${canEdit}}`;
  return new Response(body, {
    headers: { "content-type": "application/json", etag: etagOf(circuit.version), "cache-control": "private, no-cache" },
  });
});

// PUT /api/v1/circuits/:circuitId - replace the document (If-Match: the version edited; 412 when someone saved since)
export const PUT = workRoute({ resource: "circuit", need: "edit", body: replaceCircuitInput, maxBytes: MAX_WORK_BYTES }, async ({ req, target, user, body }) => {
  const expected = expectedVersion(req);
  const outcome = await saveCircuit(db, {
    circuitId: target.circuitId!,
    organizationId: target.organizationId,
    userId: user.id,
    expectedVersion: expected,
    document: body.document,
    message: body.message,
  });
  if (!outcome.ok) {
    const cur = outcome.current;
    return Response.json(
      {
        error: {
          code: "stale-version",
          message: `This circuit was saved as version ${cur.version}${cur.updatedByName ? ` by ${cur.updatedByName}` : ""} after the version ${expected} you edited. Compare, then reload or save over it.`,
        },
        current: cur,
      },
      { status: 412, headers: { etag: etagOf(cur.version), "cache-control": "no-store" } },
    );
  }
  return Response.json({ version: outcome.version }, { headers: { etag: etagOf(outcome.version) } });
});

// DELETE /api/v1/circuits/:circuitId - delete a circuit with its revisions and readings
export const DELETE = workRoute({ resource: "circuit", need: "edit" }, async ({ target, user }) => {
  await deleteCircuit(db, { circuitId: target.circuitId!, organizationId: target.organizationId, userId: user.id });
  return new Response(null, { status: 204 });
});
