import { db } from "@/db";
import { deleteJob, getJob, listCircuits, updateJob } from "@/db/queries/work";
import { workRights, workRoute } from "@/lib/api/work";
import { updateJobInput } from "@/lib/validators/work";

// GET /api/v1/jobs/:jobId - a job with its circuits and their readings summary
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target, membership, user }) => {
  const [job, circuits] = await Promise.all([getJob(db, target.jobId), listCircuits(db, target.jobId)]);
  return Response.json({ job: { ...job, canEdit: workRights(membership.role, target.ownerId === user.id).edit }, circuits });
});

// PATCH /api/v1/jobs/:jobId - change the title, vehicle, system voltage, complaint or status
export const PATCH = workRoute({ resource: "job", need: "edit", body: updateJobInput }, async ({ target, user, body }) => {
  await updateJob(db, { jobId: target.jobId, organizationId: target.organizationId, userId: user.id, changes: body });
  return Response.json({ job: { ...(await getJob(db, target.jobId)), canEdit: true } });
});

// DELETE /api/v1/jobs/:jobId - delete a job with its circuits, revisions and readings
export const DELETE = workRoute({ resource: "job", need: "edit" }, async ({ target, user }) => {
  await deleteJob(db, { jobId: target.jobId, organizationId: target.organizationId, userId: user.id });
  return new Response(null, { status: 204 });
});
