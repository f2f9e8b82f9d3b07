import { db } from "@/db";
import { getRevision } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";

// GET /api/v1/circuits/:circuitId/revisions/:version - one saved version's document
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target, params }) => {
  const version = /^\d{1,9}$/.test(params.version ?? "") ? Number(params.version) : NaN;
  if (!Number.isInteger(version) || version < 1) throw new ApiError(422, "invalid-request", "A version is a whole number from 1.", [{ path: "version", message: "a whole number from 1" }]);
  const revision = await getRevision(db, target.circuitId!, version);
  if (!revision) throw new ApiError(404, "not-found", `This circuit has no version ${version}.`);
  return Response.json({ revision });
});
