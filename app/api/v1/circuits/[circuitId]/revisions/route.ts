import { db } from "@/db";
import { listRevisions } from "@/db/queries/work";
import { workRoute } from "@/lib/api/work";

// GET /api/v1/circuits/:circuitId/revisions - every saved version, newest first, with who and when
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target }) => {
  return Response.json({ revisions: await listRevisions(db, target.circuitId!) });
});
