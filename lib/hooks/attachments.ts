"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ApiClientError, apiFetch } from "@/lib/query/client";
import { ATTACHMENT_TYPES, isAttachmentType, MAX_ATTACHMENT_BYTES } from "@/lib/validators/attachments";

export type Attachment = {
  id: string;
  jobId: string;
  readingId: string | null;
  status: "pending" | "ready";
  fileName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  hasThumbnail: boolean;
  uploadedByName: string | null;
  createdAt: string;
};

type Started = { attachment: { id: string }; upload: { method: "PUT"; url: string; headers: Record<string, string> }; complete: string };

export const attachmentKeys = { job: (jobId: string) => ["jobs", "attachments", jobId] as const };

/** Where the browser shows a file (or its thumbnail): a permission-checked redirect to a short-lived URL. */
export const fileUrl = (id: string, variant?: "thumbnail" | "download") =>
  `/api/v1/attachments/${id}/file${variant === "thumbnail" ? "?variant=thumbnail" : variant === "download" ? "?download=1" : ""}`;

export function useAttachments(jobId: string) {
  return useQuery({ queryKey: attachmentKeys.job(jobId), queryFn: () => apiFetch<{ attachments: Attachment[] }>(`/api/v1/jobs/${jobId}/attachments`) });
}

/**
 * The browser's type for a file, or the one its name suggests when the browser gives none (some phones leave HEIC
 * photos untyped). The server reads the real type from the bytes either way.
 */
function typeOf(file: File): string {
  if (file.type) return file.type;
  const ext = file.name.split(".").pop()?.toLowerCase() ?? "";
  const byExt: Record<string, string> = { jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", webp: "image/webp", heic: "image/heic", heif: "image/heif", pdf: "application/pdf" };
  return byExt[ext] ?? "application/octet-stream";
}

/** Checks made before anything is sent, with the same words the server uses. */
export function fileProblem(file: File): string | null {
  if (file.size === 0) return `"${file.name}" is empty; choose the file again.`;
  if (file.size > MAX_ATTACHMENT_BYTES) return `"${file.name}" is ${(file.size / 1024 / 1024).toFixed(1)} MB; files are at most 15 MB. Shrink the photo or split the PDF.`;
  if (!isAttachmentType(typeOf(file))) return `"${file.name}" is not a photo or a PDF. Attach one of: ${Object.values(ATTACHMENT_TYPES).join(", ")}.`;
  return null;
}

/** Upload one file: start it (a record and a presigned URL), PUT the bytes straight to storage, then finish it. */
export function useUploadAttachment(jobId: string) {
  const qc = useQueryClient();
  return useMutation<{ attachment: Attachment }, ApiClientError, { file: File; readingId?: string }>({
    mutationFn: async ({ file, readingId }) => {
      const problem = fileProblem(file);
      if (problem) throw new ApiClientError(422, "invalid-file", problem);
      const started = await apiFetch<Started>(`/api/v1/jobs/${jobId}/attachments`, {
        method: "POST",
        json: { fileName: file.name, contentType: typeOf(file), sizeBytes: file.size, ...(readingId ? { readingId } : {}) },
      });
      let put: Response;
      try {
        put = await fetch(started.upload.url, { method: "PUT", headers: started.upload.headers, body: file });
      } catch {
        throw new ApiClientError(0, "network", "The file could not reach storage. Check the connection and attach it again.");
      }
      if (!put.ok) throw new ApiClientError(put.status, "storage", `Storage refused the file (${put.status}). Attach it again; if it keeps failing, tell whoever runs Ampwright.`);
      return apiFetch<{ attachment: Attachment }>(started.complete, { method: "POST" });
    },
    onSettled: () => qc.invalidateQueries({ queryKey: attachmentKeys.job(jobId) }),
  });
}

export function useRemoveAttachment(jobId: string) {
  const qc = useQueryClient();
  return useMutation<unknown, ApiClientError, string>({
    mutationFn: (id) => apiFetch(`/api/v1/attachments/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: attachmentKeys.job(jobId) }),
  });
}
