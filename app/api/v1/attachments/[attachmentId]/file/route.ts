import { db } from "@/db";
import { attachmentKeys } from "@/db/queries/attachments";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { downloadHeaders } from "@/lib/report/files";
import { presignDownload, streamObject } from "@/lib/storage/s3";

// GET /api/v1/attachments/:attachmentId/file - after the permission check: a photo as a redirect to a short-lived
// presigned URL (?variant=thumbnail for its thumbnail, ?download=1 to save rather than view); any other file (a PDF)
// streamed from here as a download, never shown inline, with nosniff and a sandbox
export const GET = workRoute({ resource: "attachment", need: "read" }, async ({ target, req }) => {
  const keys = await attachmentKeys(db, target.attachmentId!);
  if (!keys || keys.status !== "ready") throw new ApiError(404, "not-found", "This upload was not finished, so there is no file to show.");
  const q = new URL(req.url).searchParams;
  const thumb = q.get("variant") === "thumbnail";
  if (thumb && !keys.thumbnailKey) throw new ApiError(404, "not-found", "This file has no thumbnail (only JPEG, PNG and WebP photos get one).");
  if (thumb || keys.contentType.startsWith("image/")) {
    const url = thumb
      ? await presignDownload(keys.thumbnailKey!, { fileName: `${keys.fileName}.webp`, contentType: "image/webp", inline: true })
      : await presignDownload(keys.objectKey, { fileName: keys.fileName, contentType: keys.contentType, inline: q.get("download") !== "1" });
    return new Response(null, { status: 302, headers: { location: url, "cache-control": "private, max-age=240" } });
  }
  const file = await streamObject(keys.objectKey);
  if (!file) throw new ApiError(404, "not-found", "The stored file is missing; attach it again.");
  return new Response(file.body, {
    headers: {
      ...downloadHeaders(keys.contentType, keys.fileName, false),
      ...(file.length !== undefined ? { "content-length": String(file.length) } : {}),
      "content-security-policy": "sandbox; default-src 'none'",
    },
  });
});
