"use client";

import { Unavailable } from "@/components/ui/unavailable";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { FormError } from "@/components/ui/field";
import { describeProtection } from "@/lib/conductors/protection";
import { formatWhen, STATUS_LABELS } from "@/lib/format";
import { useCreateCircuit, useImportCircuit } from "@/lib/hooks/circuits";
import { useDeleteJob, useDeleteSizing, useJob, useSizings, useUpdateJob, type Job } from "@/lib/hooks/jobs";
import type { ApiClientError } from "@/lib/query/client";
import { JOB_STATUSES, type JobStatus } from "@/lib/validators/work";
import { JobFiles } from "./attachments";
import { JobOutcome } from "./job-outcome";
import { ShareLinks } from "./share-links";
import { StatusBadge } from "./status-badge";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const input = "mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2";
const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100 disabled:opacity-50";

/** The issues of an API error, as a list a person can act on. */
export function IssueList({ error }: { error: { message: string; issues?: ApiClientError["issues"] } | null }) {
  if (!error) return null;
  return (
    <div className="rounded-md border border-over/30 bg-over-soft px-3 py-2 text-sm text-over" role="alert" data-testid="api-error">
      <p>{error.message}</p>
      {error.issues?.length ? (
        <ul className="mt-1 list-disc pl-5">
          {error.issues.slice(0, 8).map((i) => (
            <li key={`${i.path}-${i.message}`}>
              <code className="font-mono text-xs">{i.path}</code>: {i.message}
            </li>
          ))}
          {error.issues.length > 8 ? <li>and {error.issues.length - 8} more</li> : null}
        </ul>
      ) : null}
    </div>
  );
}

/** One job: its details and status, its circuits with their readings, and the ways to add more. */
export function JobDetail({ id }: { id: string }) {
  const { data, error, isPending } = useJob(id);
  if (isPending) return <p className="text-graphite-500">Loading the job...</p>;
  if (error) return <Unavailable title="This job cannot be shown" message={error.message} testId="job-missing" />;
  const { job, circuits } = data;
  const readings = circuits.reduce((n, c) => n + c.readingCount, 0);
  return (
    <div>
      <p className="text-sm">
        <Link href="/jobs" className="font-medium text-copper-700 underline-offset-2 hover:underline">
          Jobs
        </Link>{" "}
        <span className="text-graphite-500">/ {job.title}</span>
      </p>
      <JobHeader job={job} />

      <section className="mt-8" aria-labelledby="circuits-h">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="circuits-h" className="text-xl font-semibold">
            Circuits
          </h2>
          <p className="text-sm text-graphite-700" data-testid="readings-summary">
            {circuits.length} {circuits.length === 1 ? "circuit" : "circuits"}, {readings} {readings === 1 ? "reading" : "readings"} taken
          </p>
        </div>
        {circuits.length === 0 ? (
          <p className={`${box} mt-3 px-5 py-6 text-graphite-700`} data-testid="circuits-empty">
            No circuit yet. Add the one you are going to test (the charging or the starting circuit), then record readings on it.
          </p>
        ) : (
          <ul className={`${box} mt-3 divide-y divide-graphite-100`} data-testid="circuit-list">
            {circuits.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-4">
                <div>
                  <Link href={`/circuits/${c.id}`} className="font-semibold text-copper-700 underline-offset-2 hover:underline" data-testid="circuit-link">
                    {c.name}
                  </Link>
                  <p className="text-sm text-graphite-700">
                    {c.components} parts, {c.wires} cables · version {c.version}, {formatWhen(c.updatedAt)}
                    {c.updatedByName ? ` by ${c.updatedByName}` : ""}
                  </p>
                </div>
                <div className="text-right text-sm">
                  <p className="font-medium tabular-nums">
                    {c.readingCount} {c.readingCount === 1 ? "reading" : "readings"}
                  </p>
                  {c.lastReadingAt ? <p className="text-graphite-500">last {formatWhen(c.lastReadingAt)}</p> : null}
                  <Link href={`/circuits/${c.id}/history`} className="text-copper-700 underline-offset-2 hover:underline">
                    History
                  </Link>
                </div>
              </li>
            ))}
          </ul>
        )}
        {job.canEdit ? <AddCircuit jobId={job.id} /> : null}
      </section>

      <JobOutcome job={job} />
      <JobFiles jobId={job.id} canEdit={job.canEdit} />
      <JobSizings job={job} />
      <ShareLinks job={job} circuits={circuits} />

      {job.canEdit ? <DeleteJob job={job} /> : null}
    </div>
  );
}

/** Cable and fuse sizings kept with the job, each reopening on the sizing page as it was typed. */
function JobSizings({ job }: { job: Job }) {
  const { data } = useSizings(job.id);
  const remove = useDeleteSizing(job.id);
  const list = data?.sizings ?? [];
  if (!list.length && !job.canEdit) return null;
  return (
    <section className="mt-8" aria-labelledby="sizings-h" data-testid="job-sizings">
      <h2 id="sizings-h" className="text-xl font-semibold">
        Cable sizings
      </h2>
      {list.length === 0 ? (
        <p className={`${box} mt-3 px-5 py-4 text-sm text-graphite-700`}>
          None yet. Size a feed on the{" "}
          <Link href="/size" className="text-copper-700 underline">
            sizing page
          </Link>{" "}
          and keep it with this job.
        </p>
      ) : (
        <ul className={`${box} mt-3 divide-y divide-graphite-100`}>
          {list.map((z) => (
            <li key={z.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-3" data-testid="sizing-row">
              <div>
                <Link href={`/size?${new URLSearchParams(z.inputs)}`} className="font-semibold text-copper-700 underline-offset-2 hover:underline">
                  {z.title}
                </Link>
                <p className="text-sm text-graphite-700">
                  {z.request.currentA} A over {z.request.lengthM} m one way at {z.request.systemVoltage} V · {formatWhen(z.createdAt)}
                  {z.createdByName ? ` by ${z.createdByName}` : ""}
                </p>
              </div>
              <div className="flex items-center gap-3 text-sm">
                <span className="font-mono font-semibold" data-testid="sizing-answer">
                  {z.answer.size ?? "no size fits"}
                  {z.answer.protection ? `, ${describeProtection(z.answer.protection)}` : ""}
                </span>
                {job.canEdit ? (
                  <button type="button" className={secondary} disabled={remove.isPending} onClick={() => remove.mutate(z.id)} aria-label={`Remove ${z.title}`}>
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

function JobHeader({ job }: { job: Job }) {
  const update = useUpdateJob(job.id);
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState({ title: job.title, vehicle: job.vehicle, complaint: job.complaint });
  return (
    <header className="mt-3">
      {editing ? (
        <form
          className={`${box} grid gap-3 p-5`}
          onSubmit={(e) => {
            e.preventDefault();
            update.mutate(draft, { onSuccess: () => setEditing(false) });
          }}
          data-testid="job-edit-form"
        >
          <label className="text-sm font-medium">
            Title
            <input className={input} value={draft.title} onChange={(e) => setDraft({ ...draft, title: e.target.value })} data-testid="job-edit-title" />
          </label>
          <label className="text-sm font-medium">
            Vehicle
            <input className={input} value={draft.vehicle} onChange={(e) => setDraft({ ...draft, vehicle: e.target.value })} />
          </label>
          <label className="text-sm font-medium">
            Complaint
            <textarea className={input} rows={3} value={draft.complaint} onChange={(e) => setDraft({ ...draft, complaint: e.target.value })} />
          </label>
          <div className="flex gap-2">
            <button type="submit" className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700" data-testid="job-edit-save">
              Save
            </button>
            <button type="button" className={secondary} onClick={() => setEditing(false)}>
              Cancel
            </button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap items-start justify-between gap-4">
          <div className="min-w-0">
            <h1 className="text-3xl font-semibold tracking-tight" data-testid="job-heading">
              {job.title}
            </h1>
            <p className="mt-1 text-graphite-700">{job.vehicle || "Vehicle not described"} · {job.systemVoltage} V system</p>
          </div>
          <div className="flex items-center gap-3">
            <Link href={`/jobs/${job.id}/report`} className="rounded-md bg-copper-600 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-700" data-testid="job-report-link">
              Report
            </Link>
            <StatusBadge status={job.status} />
            {job.canEdit ? (
              <label className="text-sm">
                <span className="sr-only">Status</span>
                <select
                  value={job.status}
                  onChange={(e) => update.mutate({ status: e.target.value as JobStatus })}
                  className="rounded-md border border-graphite-300 bg-white px-2 py-1.5"
                  data-testid="job-status"
                >
                  {JOB_STATUSES.map((s) => (
                    <option key={s} value={s}>
                      {STATUS_LABELS[s]}
                    </option>
                  ))}
                </select>
              </label>
            ) : null}
            {job.canEdit ? (
              <button
                type="button"
                className={secondary}
                onClick={() => {
                  setDraft({ title: job.title, vehicle: job.vehicle, complaint: job.complaint });
                  setEditing(true);
                }}
                data-testid="job-edit"
              >
                Edit
              </button>
            ) : null}
          </div>
        </div>
      )}
      {job.complaint && !editing ? (
        <div className={`${box} mt-4 p-4`}>
          <p className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Complaint</p>
          <p className="mt-1 whitespace-pre-line">{job.complaint}</p>
        </div>
      ) : null}
      <p className="mt-2 text-xs text-graphite-500">
        Opened {formatWhen(job.createdAt)}
        {job.ownerName ? ` by ${job.ownerName}` : ""} · last change {formatWhen(job.updatedAt)}
        {job.updatedByName ? ` by ${job.updatedByName}` : ""}
      </p>
      <div className="mt-2">
        <IssueList error={update.error} />
      </div>
    </header>
  );
}

function AddCircuit({ jobId }: { jobId: string }) {
  const router = useRouter();
  const create = useCreateCircuit(jobId);
  const importer = useImportCircuit(jobId);
  const [name, setName] = useState("");
  const [fileError, setFileError] = useState<string | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  return (
    <div className={`${box} mt-4 grid gap-4 p-5 md:grid-cols-2`}>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          create.mutate({ name: name.trim() || "Charging circuit" }, { onSuccess: (res) => router.push(`/circuits/${res.circuit.id}`) });
        }}
      >
        <label className="text-sm font-medium" htmlFor="new-circuit-name">
          Add a circuit
        </label>
        <div className="mt-1 flex gap-2">
          <input id="new-circuit-name" className="w-full rounded-md border border-graphite-300 bg-white px-3 py-2" placeholder="Charging circuit" value={name} onChange={(e) => setName(e.target.value)} data-testid="new-circuit-name" />
          <button type="submit" className="shrink-0 rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700" disabled={create.isPending} data-testid="new-circuit">
            Add
          </button>
        </div>
        <div className="mt-2">
          <IssueList error={create.error} />
        </div>
      </form>
      <div>
        <label className="text-sm font-medium" htmlFor="import-file">
          Or bring one in from a file
        </label>
        <p className="text-xs text-graphite-500">An Ampwright circuit file (with its readings) or a circuit document, .json</p>
        <input
          id="import-file"
          ref={fileRef}
          type="file"
          accept="application/json,.json"
          className="mt-1 block w-full text-sm"
          data-testid="import-file"
          onChange={async (e) => {
            setFileError(null);
            const file = e.target.files?.[0];
            if (!file) return;
            let json: unknown;
            try {
              json = JSON.parse(await file.text());
            } catch {
              setFileError(`${file.name} is not a JSON file. Choose a file exported from Ampwright.`);
              return;
            }
            importer.mutate(json, {
              onSuccess: (res) => router.push(`/circuits/${res.circuit.id}`),
              onSettled: () => {
                if (fileRef.current) fileRef.current.value = "";
              },
            });
          }}
        />
        <div className="mt-2 space-y-2">
          <FormError message={fileError} />
          <IssueList error={importer.error} />
        </div>
      </div>
    </div>
  );
}

function DeleteJob({ job }: { job: Job }) {
  const router = useRouter();
  const del = useDeleteJob(job.id);
  const [confirming, setConfirming] = useState(false);
  return (
    <section className="mt-10 border-t border-graphite-100 pt-6" aria-label="Delete">
      {confirming ? (
        <div className="rounded-lg border border-over/30 bg-over-soft p-4">
          <p className="font-medium">Delete &ldquo;{job.title}&rdquo; with its circuits, their history and every reading? This cannot be undone.</p>
          <div className="mt-3 flex gap-2">
            <button type="button" className="rounded-md bg-over px-4 py-2 font-semibold text-white" onClick={() => del.mutate(undefined, { onSuccess: () => router.push("/jobs") })} data-testid="job-delete-confirm">
              Delete the job
            </button>
            <button type="button" className={secondary} onClick={() => setConfirming(false)}>
              Keep it
            </button>
          </div>
          <IssueList error={del.error} />
        </div>
      ) : (
        <button type="button" className="text-sm font-medium text-over underline-offset-2 hover:underline" onClick={() => setConfirming(true)} data-testid="job-delete">
          Delete this job
        </button>
      )}
    </section>
  );
}
