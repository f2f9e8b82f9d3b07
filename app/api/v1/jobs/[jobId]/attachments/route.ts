import { db } from "@/db";
import { createPendingAttachment, listAttachments, readingInJob } from "@/db/queries/attachments";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { presignUpload, UPLOAD_URL_SECONDS } from "@/lib/storage/s3";
import { startUploadInput } from "@/lib/validators/attachments";

// GET /api/v1/jobs/:jobId/attachments - the job's photos and PDFs (finished uploads), each with the reading it belongs to
export const GET = workRoute({ resource: "job", need: "read" }, async ({ target }) => {
  return Response.json({ attachments: await listAttachments(db, target.jobId) });
});

// POST /api/v1/jobs/:jobId/attachments - start an upload: a record and a presigned URL the browser PUTs the file to
export const POST = workRoute({ resource: "job", need: "edit", body: startUploadInput }, async ({ target, user, body }) => {
  if (body.readingId && !(await readingInJob(db, body.readingId, target.jobId))) {
    throw new ApiError(422, "invalid-request", "Some fields need fixing; see issues.", [{ path: "readingId", message: "this job has no such reading" }]);
  }
  const made = await createPendingAttachment(db, {
    organizationId: target.organizationId,
    jobId: target.jobId,
    readingId: body.readingId ?? null,
    fileName: body.fileName,
    contentType: body.contentType,
    sizeBytes: body.sizeBytes,
    userId: user.id,
  });
  const url = await presignUpload(made.objectKey, body.contentType);
  return Response.json(
    { attachment: { id: made.id, status: "pending" }, upload: { method: "PUT", url, headers: { "content-type": body.contentType }, expiresInSeconds: UPLOAD_URL_SECONDS }, complete: `/api/v1/attachments/${made.id}/complete` },
    { status: 201 },
  );
});
