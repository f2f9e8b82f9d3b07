"use client";

import { useState } from "react";
import { useUpdateJob, type Job } from "@/lib/hooks/jobs";
import { IssueList } from "./job-detail";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2";

/** What the tests found and what was done about it, in words for the service writer and the customer (both go in the report). */
export function JobOutcome({ job }: { job: Job }) {
  const update = useUpdateJob(job.id);
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState({ findings: job.findings, repair: job.repair });
  if (!job.canEdit && !job.findings && !job.repair) return null;
  return (
    <section className="mt-8" aria-labelledby="outcome-h" data-testid="job-outcome">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="outcome-h" className="text-xl font-semibold">
          Found and repaired
        </h2>
        {job.canEdit && !editing ? (
          <button
            type="button"
            className="rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100"
            onClick={() => {
              setDraft({ findings: job.findings, repair: job.repair });
              setEditing(true);
            }}
            data-testid="outcome-edit"
          >
            {job.findings || job.repair ? "Edit" : "Write it up"}
          </button>
        ) : null}
      </div>
      {editing ? (
        <form
          className={`${box} mt-3 grid gap-3 p-5`}
          onSubmit={(e) => {
            e.preventDefault();
            update.mutate(draft, { onSuccess: () => setEditing(false) });
          }}
        >
          <label className="text-sm font-medium">
            Found
            <textarea className={input} rows={3} value={draft.findings} onChange={(e) => setDraft({ ...draft, findings: e.target.value })} placeholder="Where the fault is and the readings that prove it" data-testid="outcome-findings" />
          </label>
          <label className="text-sm font-medium">
            Repair
            <textarea className={input} rows={3} value={draft.repair} onChange={(e) => setDraft({ ...draft, repair: e.target.value })} placeholder="What was done, and the reading after the repair" data-testid="outcome-repair" />
          </label>
          <div className="flex gap-2">
            <button type="submit" className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700" data-testid="outcome-save">
              Save
            </button>
            <button type="button" className="rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100" onClick={() => setEditing(false)}>
              Cancel
            </button>
          </div>
          <IssueList error={update.error} />
        </form>
      ) : job.findings || job.repair ? (
        <dl className={`${box} mt-3 grid gap-3 p-5 text-sm`}>
          {job.findings ? (
            <div>
              <dt className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Found</dt>
              <dd className="mt-1 whitespace-pre-line" data-testid="outcome-findings-text">{job.findings}</dd>
            </div>
          ) : null}
          {job.repair ? (
            <div>
              <dt className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Repair</dt>
              <dd className="mt-1 whitespace-pre-line">{job.repair}</dd>
            </div>
          ) : null}
        </dl>
      ) : (
        <p className={`${box} mt-3 px-5 py-4 text-sm text-graphite-700`}>Nothing written yet. When the readings have found the fault, say where it is and what was done; both go in the report.</p>
      )}
    </section>
  );
}
