"use client";

import Link from "next/link";
import { useState } from "react";
import { IssueList } from "@/components/jobs/job-detail";
import { diffDocuments, formatDocument, type CircuitDocument } from "@/lib/circuit";
import { formatWhen } from "@/lib/format";
import { useCircuit, useRestore, useRevision, useRevisions } from "@/lib/hooks/circuits";

function ChangeList({ from, to }: { from: CircuitDocument; to: CircuitDocument }) {
  const d = diffDocuments(from, to);
  if (d.same) return <p className="text-sm text-graphite-700">No change to the circuit (a restore or a save of the same document).</p>;
  const line = (what: string, x: { added: string[]; removed: string[]; changed: string[] }) =>
    [x.added.length ? `added ${x.added.join(", ")}` : "", x.removed.length ? `removed ${x.removed.join(", ")}` : "", x.changed.length ? `changed ${x.changed.join(", ")}` : ""]
      .filter(Boolean)
      .map((t) => `${what} ${t}`);
  const rows = [...d.fields.map((f) => `${f.field}: ${JSON.stringify(f.from)} → ${JSON.stringify(f.to)}`), ...line("Parts", d.components), ...line("Cables", d.wires), ...line("States", d.states)];
  return (
    <ul className="list-disc space-y-0.5 pl-5 text-sm" data-testid="revision-changes">
      {rows.map((r) => (
        <li key={r}>{r}</li>
      ))}
    </ul>
  );
}

/** Every saved version of a circuit: who saved it and when, what changed from the one before, and a way back. */
export function CircuitHistory({ id }: { id: string }) {
  const current = useCircuit(id);
  const revisions = useRevisions(id);
  const [selected, setSelected] = useState<number | undefined>(undefined);
  const shown = selected ?? revisions.data?.[0]?.version;
  const rev = useRevision(id, shown);
  const prev = useRevision(id, shown && shown > 1 ? shown - 1 : undefined);
  const restore = useRestore(id);

  if (current.error || revisions.error) return <IssueList error={current.error ?? revisions.error} />;
  if (!current.data || !revisions.data) return <p className="text-graphite-500">Loading the history...</p>;
  const { circuit, canEdit } = current.data;

  return (
    <div>
      <p className="text-sm">
        <Link href={`/jobs/${circuit.jobId}`} className="font-medium text-copper-700 underline-offset-2 hover:underline">
          {circuit.jobTitle}
        </Link>{" "}
        /{" "}
        <Link href={`/circuits/${id}`} className="font-medium text-copper-700 underline-offset-2 hover:underline">
          {circuit.name}
        </Link>{" "}
        <span className="text-graphite-500">/ history</span>
      </p>
      <h1 className="mt-3 text-3xl font-semibold tracking-tight">History of {circuit.name}</h1>
      <p className="mt-1 text-graphite-700">Every save is kept. Restoring an old version saves it again as the newest; nothing is overwritten.</p>

      <div className="mt-6 grid gap-6 lg:grid-cols-[minmax(0,22rem)_1fr]">
        <ol className="divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="revision-list">
          {revisions.data.map((r) => (
            <li key={r.version}>
              <button
                type="button"
                onClick={() => setSelected(r.version)}
                aria-current={r.version === shown ? "true" : undefined}
                className={`block w-full px-4 py-3 text-left hover:bg-copper-50 ${r.version === shown ? "bg-copper-50" : ""}`}
                data-testid="revision-item"
              >
                <span className="font-semibold">Version {r.version}</span>
                {r.version === circuit.version ? <span className="ml-2 rounded bg-within-soft px-1.5 py-0.5 text-xs font-semibold text-within">current</span> : null}
                <span className="block text-sm text-graphite-700">{r.message ?? "Saved"}</span>
                <span className="block text-xs text-graphite-500">
                  {formatWhen(r.createdAt)}
                  {r.createdByName ? ` · ${r.createdByName}` : ""} · {r.components} parts, {r.wires} cables
                </span>
              </button>
            </li>
          ))}
        </ol>

        <section className="rounded-lg border border-graphite-100 bg-paper-raised p-5" aria-live="polite" data-testid="revision-detail">
          {rev.data ? (
            <>
              <div className="flex flex-wrap items-start justify-between gap-3">
                <div>
                  <h2 className="text-xl font-semibold">Version {rev.data.version}</h2>
                  <p className="text-sm text-graphite-700">
                    {rev.data.message ?? "Saved"} · {formatWhen(rev.data.createdAt)}
                    {rev.data.createdByName ? ` by ${rev.data.createdByName}` : ""}
                  </p>
                </div>
                {canEdit && rev.data.version !== circuit.version ? (
                  <button
                    type="button"
                    onClick={() => restore.mutate({ version: rev.data!.version }, { onSuccess: (res) => setSelected(res.version) })}
                    disabled={restore.isPending}
                    className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60"
                    data-testid="restore"
                  >
                    Restore version {rev.data.version}
                  </button>
                ) : null}
              </div>
              <h3 className="mt-4 text-sm font-semibold uppercase tracking-wider text-graphite-500">{rev.data.version > 1 ? `Changes from version ${rev.data.version - 1}` : "First version"}</h3>
              <div className="mt-1">{prev.data ? <ChangeList from={prev.data.document} to={rev.data.document} /> : rev.data.version > 1 ? null : <p className="text-sm">{rev.data.document.components.length} parts drawn.</p>}</div>
              <details className="mt-4">
                <summary className="cursor-pointer text-sm font-medium">The document of version {rev.data.version}</summary>
                <pre className="mt-2 max-h-96 overflow-auto rounded-md border border-graphite-100 bg-white p-3 font-mono text-xs">{formatDocument(rev.data.document)}</pre>
              </details>
              <div className="mt-3">
                <IssueList error={restore.error} />
              </div>
            </>
          ) : (
            <p className="text-graphite-500">Loading version {shown}...</p>
          )}
        </section>
      </div>
    </div>
  );
}
