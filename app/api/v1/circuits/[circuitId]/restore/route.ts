import { db } from "@/db";
import { getCircuit, getRevision, saveCircuit } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { etagOf, expectedVersion } from "@/lib/api/work-responses";
import { loadCircuit } from "@/lib/circuit";
import { restoreCircuitInput } from "@/lib/validators/work";

// POST /api/v1/circuits/:circuitId/restore - save an earlier version as the newest one (nothing is lost)
export const POST = workRoute({ resource: "circuit", need: "edit", body: restoreCircuitInput }, async ({ req, target, user, body }) => {
  const revision = await getRevision(db, target.circuitId!, body.version);
  if (!revision) throw new ApiError(422, "invalid-request", `This circuit has no version ${body.version}.`, [{ path: "version", message: "no such version" }]);
  // An old revision may be of an older document version: bring it up to date as an import would.
  const loaded = loadCircuit(revision.document);
  if (!loaded.ok) throw new ApiError(422, "invalid-circuit", `Version ${body.version} can no longer be read; see issues.`, loaded.issues);
  // If-Match is optional here (a restore loses nothing), but when sent it is read as for a save.
  const expected = req.headers.get("if-match") ? expectedVersion(req) : (await getCircuit(db, target.circuitId!))!.version;
  const outcome = await saveCircuit(db, {
    circuitId: target.circuitId!,
    organizationId: target.organizationId,
    userId: user.id,
    expectedVersion: expected,
    document: loaded.document,
    message: body.message ?? `Restored version ${body.version}`,
    action: "circuit.restore",
  });
  if (!outcome.ok) {
    return Response.json(
      { error: { code: "stale-version", message: `Someone saved version ${outcome.current.version} meanwhile; look at it before restoring.` }, current: outcome.current },
      { status: 412, headers: { etag: etagOf(outcome.current.version) } },
    );
  }
  return Response.json({ version: outcome.version, restoredFrom: body.version }, { headers: { etag: etagOf(outcome.version) } });
});
