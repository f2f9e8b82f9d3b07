"use client";

import { useState } from "react";
import { formatWhen } from "@/lib/format";
import type { CircuitSummary, Job } from "@/lib/hooks/jobs";
import { useCreateShareLink, useRevokeShareLink, useShareLinks, type ShareLink } from "@/lib/hooks/sharing";
import { IssueList } from "./job-detail";

const box = "rounded-lg border border-graphite-100 bg-paper-raised";
const secondary = "rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100 disabled:opacity-50";
const EXPIRY = [
  { days: 1, label: "1 day" },
  { days: 7, label: "7 days" },
  { days: 30, label: "30 days" },
  { days: 0, label: "Until revoked" },
];

function linkState(l: ShareLink): { word: string; live: boolean } {
  if (l.revokedAt) return { word: `revoked ${formatWhen(l.revokedAt)}`, live: false };
  if (l.expiresAt && new Date(l.expiresAt).getTime() <= Date.now()) return { word: `expired ${formatWhen(l.expiresAt)}`, live: false };
  return { word: l.expiresAt ? `works until ${formatWhen(l.expiresAt)}` : "works until revoked", live: true };
}

/** Read-only links to the job's report (or one circuit) for people without an account; each can be revoked. */
export function ShareLinks({ job, circuits }: { job: Job; circuits: CircuitSummary[] }) {
  const { data } = useShareLinks(job.id);
  const create = useCreateShareLink(job.id);
  const revoke = useRevokeShareLink(job.id);
  const [what, setWhat] = useState("");
  const [days, setDays] = useState(7);
  const [label, setLabel] = useState("");
  const links = data?.links ?? [];
  const made = create.data?.link;
  return (
    <section className="mt-8" aria-labelledby="share-h" data-testid="share-links">
      <h2 id="share-h" className="text-xl font-semibold">
        Report and share links
      </h2>
      <p className="mt-1 text-sm text-graphite-700">
        A share link opens the report read-only without signing in, and shows nothing else of your organisation. Only people you give it to can open it.
      </p>
      {job.canEdit ? (
        <form
          className={`${box} mt-3 flex flex-wrap items-end gap-3 p-4`}
          onSubmit={(e) => {
            e.preventDefault();
            create.mutate({ circuitId: what || undefined, expiresInDays: days || null, label });
          }}
        >
          <label className="text-sm font-medium">
            Share
            <select className="mt-1 block rounded-md border border-graphite-300 bg-white px-2 py-2" value={what} onChange={(e) => setWhat(e.target.value)} data-testid="share-what">
              <option value="">The whole job report</option>
              {circuits.map((c) => (
                <option key={c.id} value={c.id}>
                  Only {c.name}
                </option>
              ))}
            </select>
          </label>
          <label className="text-sm font-medium">
            Works for
            <select className="mt-1 block rounded-md border border-graphite-300 bg-white px-2 py-2" value={days} onChange={(e) => setDays(Number(e.target.value))} data-testid="share-days">
              {EXPIRY.map((x) => (
                <option key={x.days} value={x.days}>
                  {x.label}
                </option>
              ))}
            </select>
          </label>
          <label className="min-w-48 flex-1 text-sm font-medium">
            For (optional)
            <input className="mt-1 block w-full rounded-md border border-graphite-300 bg-white px-3 py-2" value={label} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. the customer" maxLength={200} />
          </label>
          <button type="submit" disabled={create.isPending} className="rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-700 disabled:opacity-50" data-testid="share-create">
            Make a link
          </button>
          <div className="basis-full">
            <IssueList error={create.error} />
          </div>
        </form>
      ) : null}
      {made?.url ? (
        <div className="mt-3 rounded-md border border-within/40 bg-within-soft p-3 text-sm" role="status">
          <p className="font-semibold">Copy this link now: it is shown only once.</p>
          <div className="mt-1 flex flex-wrap items-center gap-2">
            <input readOnly value={made.url} className="min-w-0 flex-1 rounded border border-graphite-300 bg-white px-2 py-1 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} data-testid="share-url" />
            <button type="button" className={secondary} onClick={() => void navigator.clipboard?.writeText(made.url!)}>
              Copy
            </button>
          </div>
        </div>
      ) : null}
      {links.length ? (
        <ul className={`${box} mt-3 divide-y divide-graphite-100 text-sm`}>
          {links.map((l) => {
            const s = linkState(l);
            return (
              <li key={l.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-3" data-testid="share-row">
                <div>
                  <p className="font-medium">
                    {l.circuitName ? `Circuit: ${l.circuitName}` : "Whole job report"}
                    {l.label ? <span className="font-normal text-graphite-700"> · {l.label}</span> : null}
                  </p>
                  <p className={s.live ? "text-graphite-700" : "text-graphite-500"}>
                    {s.word} · opened {l.openCount} {l.openCount === 1 ? "time" : "times"}
                    {l.lastOpenedAt ? `, last ${formatWhen(l.lastOpenedAt)}` : ""} · made {formatWhen(l.createdAt)}
                    {l.createdByName ? ` by ${l.createdByName}` : ""}
                  </p>
                </div>
                {job.canEdit && s.live ? (
                  <button type="button" className={secondary} disabled={revoke.isPending} onClick={() => revoke.mutate(l.id)} data-testid="share-revoke">
                    Revoke
                  </button>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : null}
    </section>
  );
}
