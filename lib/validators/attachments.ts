import { z } from "zod";
import { idText, plainText } from "./text";

/** Largest file Ampwright keeps: a phone photo or a scanned PDF fits well inside it. */
export const MAX_ATTACHMENT_BYTES = 15 * 1024 * 1024;

/** What may be attached, by the type read from the file's own bytes: photos and PDFs. */
export const ATTACHMENT_TYPES = {
  "image/jpeg": "JPEG photo",
  "image/png": "PNG image",
  "image/webp": "WebP image",
  "image/heic": "HEIC photo",
  "image/heif": "HEIF photo",
  "application/pdf": "PDF",
} as const;
export type AttachmentType = keyof typeof ATTACHMENT_TYPES;
export const isAttachmentType = (t: string): t is AttachmentType => t in ATTACHMENT_TYPES;

const allowed = Object.keys(ATTACHMENT_TYPES).join(", ");

export const startUploadInput = z.strictObject({
  fileName: plainText("fileName", 200).min(1, "give the file a name"),
  contentType: z.string({ error: "contentType must be text" }).refine(isAttachmentType, { message: `attach a photo or a PDF (one of ${allowed})` }),
  sizeBytes: z
    .number({ error: "sizeBytes must be the file's size in bytes" })
    .int()
    .min(1, "the file is empty")
    .max(MAX_ATTACHMENT_BYTES, `files are at most 15 MB; shrink the photo or split the PDF`),
  /** A reading of this job the file is evidence for. */
  readingId: idText("readingId").optional(),
});
export type StartUploadInput = z.input<typeof startUploadInput>;
