import "server-only";
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import { db } from "@/db";
import { attachmentKeys, deleteAttachmentRow, getAttachment, markAttachmentReady } from "@/db/queries/attachments";
import { ApiError } from "@/lib/api/errors";
import { ATTACHMENT_TYPES, isAttachmentType, MAX_ATTACHMENT_BYTES } from "@/lib/validators/attachments";
import { thumbnailKeyOf, thumbnailOf } from "./client";
import { pdfActiveContent } from "./pdf-safety";
import { deleteObject, readObjectLimited, writeObject } from "./s3";

/** Types sharp (as shipped on npm) can read for a thumbnail; HEIC is kept without one. */
const THUMBNAILED = new Set(["image/jpeg", "image/png", "image/webp"]);

const mb = (n: number) => `${(n / 1024 / 1024).toFixed(1)} MB`;

/** Where a finished file lives: a key no upload URL was ever signed for. */
export function finalKeyOf(stagingKey: string): string {
  return stagingKey.replace(/^staging\//, "files/");
}

/**
 * Finishes an upload: reads the object the browser put at its staging key (stopping past 15 MB), works out its
 * type from its bytes (never from the name or the declared type), refuses anything too large, not a photo or PDF,
 * or a PDF that would run a script or a program (deleting the object and the record), then moves the checked bytes
 * to the final key, which the upload URL cannot write: replaying that URL later changes nothing anyone can open.
 */
export async function finishUpload(p: { id: string; organizationId: string; jobId: string; userId: string }) {
  const keys = await attachmentKeys(db, p.id);
  if (!keys) throw new ApiError(404, "not-found", "There is no such attachment.");
  if (keys.status === "ready") return getAttachment(db, p.id);
  const stagingKey = keys.objectKey;
  const read = await readObjectLimited(stagingKey, MAX_ATTACHMENT_BYTES);
  if ("missing" in read) throw new ApiError(409, "not-uploaded", "The file has not reached storage yet: upload it to the URL you were given, then finish the upload.");
  const refuse = async (code: string, message: string): Promise<never> => {
    await deleteObject(stagingKey);
    await deleteAttachmentRow(db, { ...p, reason: "refused" });
    throw new ApiError(422, code, message);
  };
  if ("tooLarge" in read) return refuse("too-large", `The file is over 15 MB (${mb(read.tooLarge)} or more); files are at most 15 MB. Shrink the photo or split the PDF, then attach it again.`);
  const bytes = read.bytes;
  if (bytes.length === 0) await refuse("empty", "The file is empty; choose the file again.");
  const sniffed = await fileTypeFromBuffer(bytes);
  if (!sniffed || !isAttachmentType(sniffed.mime)) {
    const what = sniffed ? `a ${sniffed.ext.toUpperCase()} file (${sniffed.mime})` : "not a file type Ampwright recognises";
    await refuse("wrong-type", `"${keys.fileName}" is ${what}, whatever its name says. Attach a photo (${Object.values(ATTACHMENT_TYPES).slice(0, 5).join(", ")}) or a PDF.`);
  }
  const type = sniffed!.mime;
  if (type === "application/pdf") {
    const active = pdfActiveContent(bytes);
    if (active) await refuse("active-pdf", `"${keys.fileName}" was not kept: ${active}. Print it to a new PDF (or save it as a photo) and attach that.`);
  }
  const finalKey = finalKeyOf(stagingKey);
  await writeObject(finalKey, bytes, type);
  await deleteObject(stagingKey);
  let thumbnailKey: string | null = null;
  if (THUMBNAILED.has(type)) {
    try {
      const thumb = await thumbnailOf(bytes);
      thumbnailKey = thumbnailKeyOf(finalKey);
      await writeObject(thumbnailKey, thumb, "image/webp");
    } catch {
      // A photo sharp cannot read (a damaged file) is still kept; it shows as a file without a picture.
      thumbnailKey = null;
    }
  }
  await markAttachmentReady(db, { ...p, objectKey: finalKey, contentType: type, sizeBytes: bytes.length, sha256: createHash("sha256").update(bytes).digest("hex"), thumbnailKey, fileName: keys.fileName });
  return getAttachment(db, p.id);
}

/** Removes an attachment's objects and its record. */
export async function removeAttachment(p: { id: string; organizationId: string; jobId: string; userId: string }) {
  const keys = await attachmentKeys(db, p.id);
  if (!keys) return;
  await deleteObject(keys.objectKey);
  if (keys.thumbnailKey) await deleteObject(keys.thumbnailKey);
  await deleteAttachmentRow(db, { ...p, reason: "removed" });
}
