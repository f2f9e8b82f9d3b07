import { workRoute } from "@/lib/api/work";
import { finishUpload } from "@/lib/storage/attachments";

// POST /api/v1/attachments/:attachmentId/complete - check the uploaded bytes (type, size), record them, make a thumbnail
export const POST = workRoute({ resource: "attachment", need: "edit" }, async ({ target, user }) => {
  const attachment = await finishUpload({ id: target.attachmentId!, organizationId: target.organizationId, jobId: target.jobId, userId: user.id });
  return Response.json({ attachment });
});
