"use client";

import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useEffect, useState } from "react";
import { formatWhen } from "@/lib/format";
import { useJobs, type Job, type JobListParams } from "@/lib/hooks/jobs";
import { JOB_STATUSES, type JobStatus } from "@/lib/validators/work";
import { STATUS_LABELS } from "@/lib/format";
import { NewJobForm } from "./new-job-form";
import { StatusBadge } from "./status-badge";

const col = createColumnHelper<Job>();
/** Columns a phone can do without (the job's own page has them). */
const wideOnly = { className: "hidden md:table-cell" };
type SortKey = JobListParams["sort"];

const columns = [
  col.accessor("title", {
    id: "title",
    header: "Job",
    cell: (c) => (
      <div>
        <Link href={`/jobs/${c.row.original.id}`} className="font-semibold text-copper-700 underline-offset-2 hover:underline" data-testid="job-link">
          {c.getValue()}
        </Link>
        {c.row.original.complaint ? <p className="mt-0.5 line-clamp-1 text-sm text-graphite-700">{c.row.original.complaint}</p> : null}
        {c.row.original.vehicle ? <p className="mt-0.5 text-xs text-graphite-500 md:hidden">{c.row.original.vehicle}</p> : null}
      </div>
    ),
  }),
  col.accessor("vehicle", { header: "Vehicle", enableSorting: false, meta: wideOnly, cell: (c) => <span className="text-sm">{c.getValue() || "-"}</span> }),
  col.accessor("status", { id: "status", header: "Status", cell: (c) => <StatusBadge status={c.getValue()} /> }),
  col.accessor("circuitCount", { header: "Circuits", enableSorting: false, meta: wideOnly, cell: (c) => <span className="tabular-nums">{c.getValue() ?? 0}</span> }),
  col.accessor("ownerName", { header: "Whose", enableSorting: false, meta: wideOnly, cell: (c) => <span className="text-sm">{c.getValue() ?? "(left)"}</span> }),
  col.accessor("updatedAt", {
    id: "updated",
    header: "Last change",
    cell: (c) => (
      <span className="text-sm text-graphite-700" title={c.row.original.updatedByName ? `by ${c.row.original.updatedByName}` : undefined}>
        {formatWhen(c.getValue())}
      </span>
    ),
  }),
  col.accessor("createdAt", { id: "created", header: "Opened", meta: wideOnly, cell: (c) => <span className="text-sm text-graphite-700">{formatWhen(c.getValue())}</span> }),
];

const metaClass = (meta: unknown) => (meta as { className?: string } | undefined)?.className ?? "";

/** The organisation's jobs: search, status filter and sort run on the server; pages follow its cursor. */
export function JobsTable() {
  const [search, setSearch] = useState("");
  const [q, setQ] = useState("");
  const [status, setStatus] = useState<JobStatus | "">("");
  const [sorting, setSorting] = useState<SortingState>([{ id: "updated", desc: true }]);
  const [limit, setLimit] = useState(25);
  const [cursors, setCursors] = useState<string[]>([]); // the cursor of each page after the first
  const [creating, setCreating] = useState(false);

  // Typing stays smooth: the list asks the server a moment after the last key.
  useEffect(() => {
    const t = setTimeout(() => setQ(search.trim()), 250);
    return () => clearTimeout(t);
  }, [search]);
  useEffect(() => setCursors([]), [q, status, sorting, limit]);

  const sort = (sorting[0]?.id ?? "updated") as SortKey;
  const params: JobListParams = { q, status, sort, dir: sorting[0]?.desc ? "desc" : "asc", limit, cursor: cursors[cursors.length - 1] };
  const { data, error, isPending, isFetching } = useJobs(params);

  // TanStack Table returns fresh functions each render; nothing below is memoised, so the compiler's skip is fine.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data?.jobs ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    manualSorting: true,
    enableMultiSort: false,
    sortDescFirst: false,
    getCoreRowModel: getCoreRowModel(),
  });

  const filtered = q !== "" || status !== "";
  const page = cursors.length + 1;

  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold tracking-tight">Jobs</h1>
          <p className="mt-1 text-graphite-700" data-testid="jobs-org">
            {data ? (
              <>
                {data.organization.name}
                {data.canCreate && data.organization.kind === "class" && data.organization.role === "student" ? " (your own work)" : ""}
              </>
            ) : (
              " "
            )}
          </p>
        </div>
        {data?.canCreate ? (
          <button
            type="button"
            onClick={() => setCreating((c) => !c)}
            className="rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700"
            aria-expanded={creating}
            data-testid="new-job"
          >
            New job
          </button>
        ) : null}
      </div>

      {creating && data ? (
        <section className="mt-6 rounded-lg border border-graphite-100 bg-paper-raised p-5" aria-label="New job">
          <NewJobForm organizationId={data.organization.id} onCancel={() => setCreating(false)} />
        </section>
      ) : null}

      <div className="mt-6 flex flex-wrap items-end gap-3">
        <label className="min-w-0 flex-1 basis-56 text-sm">
          <span className="font-medium text-graphite-800">Search</span>
          <input
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="Title, vehicle or complaint"
            className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2"
            data-testid="jobs-search"
          />
        </label>
        <label className="text-sm">
          <span className="font-medium text-graphite-800">Status</span>
          <select value={status} onChange={(e) => setStatus(e.target.value as JobStatus | "")} className="mt-1 block rounded-md border border-graphite-300 bg-white px-3 py-2" data-testid="jobs-status">
            <option value="">Any</option>
            {JOB_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          <span className="font-medium text-graphite-800">Per page</span>
          <select value={limit} onChange={(e) => setLimit(Number(e.target.value))} className="mt-1 block rounded-md border border-graphite-300 bg-white px-3 py-2">
            {[10, 25, 50].map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
      </div>

      {error ? (
        <p className="mt-6 rounded-md border border-over/30 bg-over-soft px-3 py-2 text-sm text-over" role="alert">
          {error.message}
        </p>
      ) : null}

      <div className="mt-4 overflow-x-auto rounded-lg border border-graphite-100 bg-paper-raised" aria-busy={isFetching}>
        <table className="w-full border-collapse text-left md:min-w-[720px]" data-testid="jobs-table">
          <thead className="bg-graphite-100/60 text-sm">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th key={h.id} scope="col" className={`px-4 py-2.5 font-semibold ${metaClass(h.column.columnDef.meta)}`} aria-sort={sorted ? (sorted === "asc" ? "ascending" : "descending") : undefined}>
                      {h.column.getCanSort() ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-copper-700" data-testid={`sort-${h.column.id}`}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true" className="text-xs text-graphite-500">
                            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                          </span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="align-top hover:bg-copper-50/60" data-testid="job-row">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-4 py-3 ${metaClass(cell.column.columnDef.meta)}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {!isPending && data && data.jobs.length === 0 ? (
          <div className="px-5 py-8 text-center" data-testid="jobs-empty">
            {filtered ? (
              <>
                <p className="font-medium">No job matches {q ? `"${q}"` : "this filter"}{status ? ` with status ${STATUS_LABELS[status]}` : ""}.</p>
                <button
                  type="button"
                  className="mt-3 rounded-md border border-graphite-300 px-3 py-1.5 text-sm font-medium hover:bg-graphite-100"
                  onClick={() => {
                    setSearch("");
                    setStatus("");
                  }}
                >
                  Clear the search and filter
                </button>
              </>
            ) : (
              <>
                <p className="font-medium">No jobs here yet.</p>
                <p className="mx-auto mt-1 max-w-lg text-sm text-graphite-700">
                  {data.canCreate
                    ? "Open one for the vehicle in the bay: its complaint first, then the circuits you will test and the readings you take."
                    : "Jobs appear here when someone in this organisation opens one."}
                </p>
              </>
            )}
          </div>
        ) : null}
        {isPending ? <p className="px-5 py-8 text-center text-graphite-500">Loading jobs...</p> : null}
      </div>

      <nav className="mt-3 flex items-center justify-between text-sm" aria-label="Pages">
        <button
          type="button"
          disabled={cursors.length === 0}
          onClick={() => setCursors((c) => c.slice(0, -1))}
          className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium enabled:hover:bg-graphite-100 disabled:opacity-40"
          data-testid="jobs-prev"
        >
          Previous
        </button>
        <span className="text-graphite-700" data-testid="jobs-page">
          Page {page}
        </span>
        <button
          type="button"
          disabled={!data?.nextCursor}
          onClick={() => data?.nextCursor && setCursors((c) => [...c, data.nextCursor!])}
          className="rounded-md border border-graphite-300 px-3 py-1.5 font-medium enabled:hover:bg-graphite-100 disabled:opacity-40"
          data-testid="jobs-next"
        >
          Next
        </button>
      </nav>
    </div>
  );
}
