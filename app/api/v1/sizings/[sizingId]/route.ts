import { db } from "@/db";
import { deleteSizing, getSizing } from "@/db/queries/work";
import { workRoute } from "@/lib/api/work";

// GET /api/v1/sizings/:sizingId - one saved sizing
export const GET = workRoute({ resource: "sizing", need: "read" }, async ({ target }) => {
  return Response.json({ sizing: await getSizing(db, target.sizingId!) });
});

// DELETE /api/v1/sizings/:sizingId - remove a sizing from its job
export const DELETE = workRoute({ resource: "sizing", need: "edit" }, async ({ target, user }) => {
  await deleteSizing(db, { sizingId: target.sizingId!, jobId: target.jobId, organizationId: target.organizationId, userId: user.id });
  return new Response(null, { status: 204 });
});
