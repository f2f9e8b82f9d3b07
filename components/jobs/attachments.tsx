"use client";

import { useId, useRef } from "react";
import { formatWhen } from "@/lib/format";
import { fileUrl, useAttachments, useRemoveAttachment, useUploadAttachment, type Attachment } from "@/lib/hooks/attachments";
import { IssueList } from "./job-detail";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100 disabled:opacity-50";
/** What the file picker offers: photos (with HEIC from phones) and PDFs. The server checks the bytes again. */
const ACCEPT = "image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif,application/pdf";

const size = (n: number) => (n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(n / 1024))} kB`);

/** A file's picture: its thumbnail when it has one, else a plain tile naming the kind of file. */
function Tile({ a, small = false }: { a: Attachment; small?: boolean }) {
  const dim = small ? "h-12 w-16" : "h-28 w-full";
  return (
    <a href={fileUrl(a.id)} target="_blank" rel="noopener" className={`block overflow-hidden rounded-md border border-graphite-100 bg-graphite-100/60 ${dim}`} title={`Open ${a.fileName}`}>
      {a.hasThumbnail ? (
        // eslint-disable-next-line @next/next/no-img-element -- a presigned redirect, not an asset next/image can optimise
        <img src={fileUrl(a.id, "thumbnail")} alt={a.fileName} className="h-full w-full object-cover" loading="lazy" data-testid="attachment-thumbnail" />
      ) : (
        <span className="flex h-full w-full items-center justify-center font-mono text-xs font-semibold text-graphite-700">{a.contentType === "application/pdf" ? "PDF" : "PHOTO"}</span>
      )}
    </a>
  );
}

/** A button that opens the file picker and uploads what is chosen. */
function AttachButton({ jobId, readingId, label, testId }: { jobId: string; readingId?: string; label: string; testId: string }) {
  const upload = useUploadAttachment(jobId);
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <input
        id={id}
        ref={input}
        type="file"
        accept={ACCEPT}
        className="sr-only"
        data-testid={`${testId}-input`}
        onChange={async (e) => {
          const files = [...(e.target.files ?? [])];
          e.target.value = "";
          for (const file of files) await upload.mutateAsync({ file, readingId }).catch(() => undefined);
        }}
      />
      <button type="button" className={secondary} disabled={upload.isPending} onClick={() => input.current?.click()} data-testid={testId}>
        {upload.isPending ? "Uploading..." : label}
      </button>
      {upload.error ? (
        <div className="mt-2 max-w-md">
          <IssueList error={upload.error} />
        </div>
      ) : null}
    </div>
  );
}

/** Photos and PDFs kept with a job: meter screens, corroded lugs, the parts invoice. */
export function JobFiles({ jobId, canEdit }: { jobId: string; canEdit: boolean }) {
  const { data, error } = useAttachments(jobId);
  const remove = useRemoveAttachment(jobId);
  const list = data?.attachments ?? [];
  if (!list.length && !canEdit) return null;
  return (
    <section className="mt-8" aria-labelledby="files-h" data-testid="job-files">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="files-h" className="text-xl font-semibold">
          Photos and files
        </h2>
        {canEdit ? <AttachButton jobId={jobId} label="Attach a photo or PDF" testId="attach-file" /> : null}
      </div>
      <p className="mt-1 text-sm text-graphite-700">The meter&apos;s screen at each check, the joint before and after cleaning, a parts receipt. Photos and PDFs up to 15 MB.</p>
      <IssueList error={error ?? remove.error} />
      {list.length === 0 ? (
        <p className={`${box} mt-3 px-5 py-4 text-sm text-graphite-700`}>Nothing attached yet.</p>
      ) : (
        <ul className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" data-testid="file-grid">
          {list.map((a) => (
            <li key={a.id} className={`${box} p-2`} data-testid="file-card">
              <Tile a={a} />
              <p className="mt-2 truncate text-sm font-medium" title={a.fileName}>
                {a.fileName}
              </p>
              <p className="text-xs text-graphite-700">
                {size(a.sizeBytes)} · {formatWhen(a.createdAt)}
                {a.uploadedByName ? ` · ${a.uploadedByName}` : ""}
                {a.readingId ? " · with a reading" : ""}
              </p>
              <div className="mt-1 flex gap-3 text-xs">
                <a href={fileUrl(a.id, "download")} className="text-copper-700 underline-offset-2 hover:underline">
                  Download
                </a>
                {canEdit ? (
                  <button type="button" className="text-over underline-offset-2 hover:underline" disabled={remove.isPending} onClick={() => remove.mutate(a.id)} aria-label={`Remove ${a.fileName}`}>
                    Remove
                  </button>
                ) : null}
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The photos of one reading, beside it in the readings table, and a control to add one. */
export function ReadingPhotos({ jobId, readingId, canEdit }: { jobId: string; readingId: string; canEdit: boolean }) {
  const { data } = useAttachments(jobId);
  const mine = (data?.attachments ?? []).filter((a) => a.readingId === readingId);
  return (
    <div className="flex flex-wrap items-center gap-2" data-testid="reading-photos">
      {mine.map((a) => (
        <Tile key={a.id} a={a} small />
      ))}
      {canEdit ? <AttachButton jobId={jobId} readingId={readingId} label={mine.length ? "Add" : "Attach photo"} testId="attach-reading-photo" /> : null}
    </div>
  );
}
