import { db } from "@/db";
import { getAttachment } from "@/db/queries/attachments";
import { workRoute } from "@/lib/api/work";
import { removeAttachment } from "@/lib/storage/attachments";

// GET /api/v1/attachments/:attachmentId - one attachment's record (size, type from its bytes, SHA-256, who and when)
export const GET = workRoute({ resource: "attachment", need: "read" }, async ({ target }) => {
  return Response.json({ attachment: await getAttachment(db, target.attachmentId!) });
});

// DELETE /api/v1/attachments/:attachmentId - remove the file from storage and the job
export const DELETE = workRoute({ resource: "attachment", need: "edit" }, async ({ target, user }) => {
  await removeAttachment({ id: target.attachmentId!, organizationId: target.organizationId, jobId: target.jobId, userId: user.id });
  return new Response(null, { status: 204 });
});
