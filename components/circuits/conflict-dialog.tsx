"use client";

import { useEffect, useRef } from "react";
import { diffDocuments, formatDocument, type CircuitDocument, type IdDiff } from "@/lib/circuit";
import { formatWhen } from "@/lib/format";
import type { StaleVersion } from "@/lib/hooks/circuits";

function Changes({ what, d }: { what: string; d: IdDiff }) {
  const rows = [
    ["only in yours", d.added],
    ["only in theirs", d.removed],
    ["different", d.changed],
  ] as const;
  if (!rows.some(([, ids]) => ids.length)) return null;
  return (
    <li>
      <span className="font-medium">{what}:</span>{" "}
      {rows
        .filter(([, ids]) => ids.length)
        .map(([label, ids]) => `${label} ${ids.join(", ")}`)
        .join("; ")}
    </li>
  );
}

/**
 * Someone saved the circuit while you were editing it: both versions side by side, and a knowing choice between
 * taking theirs (your edits are dropped) and saving yours over it (theirs stays in the history).
 */
export function ConflictDialog(props: { mine: CircuitDocument; baseVersion: number; theirs: StaleVersion; onReload: () => void; onOverwrite: () => void; busy?: boolean }) {
  const { mine, theirs } = props;
  const d = diffDocuments(theirs.document, mine);
  const first = useRef<HTMLButtonElement>(null);
  useEffect(() => first.current?.focus(), []);
  return (
    <div className="fixed inset-0 z-50 flex items-end justify-center bg-graphite-950/50 p-0 sm:items-center sm:p-6">
      <div role="dialog" aria-modal="true" aria-labelledby="conflict-title" className="max-h-[92dvh] w-full max-w-5xl overflow-auto rounded-t-xl bg-paper-raised p-5 shadow-xl sm:rounded-xl" data-testid="conflict-dialog">
        <h2 id="conflict-title" className="text-xl font-semibold">
          Someone saved this circuit while you were editing
        </h2>
        <p className="mt-1 text-graphite-700">
          You edited version {props.baseVersion}. Version {theirs.version} was saved {formatWhen(theirs.updatedAt)}
          {theirs.updatedByName ? ` by ${theirs.updatedByName}` : ""}. Nothing is lost either way: every saved version stays in the history.
        </p>
        {d.same ? (
          <p className="mt-3 text-sm">The two documents are the same.</p>
        ) : (
          <ul className="mt-3 list-disc space-y-1 pl-5 text-sm" data-testid="conflict-summary">
            {d.fields.map((f) => (
              <li key={f.field}>
                <span className="font-medium">{f.field}</span>: theirs {JSON.stringify(f.from)}, yours {JSON.stringify(f.to)}
              </li>
            ))}
            <Changes what="Parts" d={d.components} />
            <Changes what="Cables" d={d.wires} />
            <Changes what="Operating states" d={d.states} />
          </ul>
        )}
        <div className="mt-4 grid gap-3 md:grid-cols-2">
          <figure>
            <figcaption className="text-sm font-semibold">Theirs, version {theirs.version}</figcaption>
            <pre className="mt-1 max-h-72 overflow-auto rounded-md border border-graphite-100 bg-white p-3 font-mono text-xs" data-testid="conflict-theirs">
              {formatDocument(theirs.document)}
            </pre>
          </figure>
          <figure>
            <figcaption className="text-sm font-semibold">Yours, not saved</figcaption>
            <pre className="mt-1 max-h-72 overflow-auto rounded-md border border-graphite-100 bg-white p-3 font-mono text-xs" data-testid="conflict-mine">
              {formatDocument(mine)}
            </pre>
          </figure>
        </div>
        <div className="mt-4 flex flex-wrap gap-3">
          <button ref={first} type="button" onClick={props.onReload} className="rounded-md border border-graphite-300 px-4 py-2 font-semibold hover:bg-graphite-100" data-testid="conflict-reload">
            Take theirs (drop my edits)
          </button>
          <button type="button" onClick={props.onOverwrite} disabled={props.busy} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700 disabled:opacity-60" data-testid="conflict-overwrite">
            Save mine as version {theirs.version + 1}
          </button>
        </div>
      </div>
    </div>
  );
}
