"use client";

import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { memo, useState } from "react";
import type { WireFigures } from "@/lib/workspace/analysis";

const col = createColumnHelper<WireFigures>();
const FIRST_ROWS = 60;
const num = (digits: number, unit: string) => (v: number | undefined) => (v === undefined ? "-" : `${v.toFixed(digits)} ${unit}`);

const columns = [
  col.accessor("id", {
    header: "Id",
    // A button, so the keyboard can choose a row as the mouse does (Tab to it, Enter).
    cell: (c) => (
      <button
        type="button"
        className="font-mono underline-offset-2 hover:underline"
        aria-label={`Choose ${c.getValue()} on the canvas`}
        onClick={(e) => {
          e.stopPropagation();
          (c.table.options.meta as { onPick: (id: string) => void }).onPick(c.getValue());
        }}
        data-testid="ws-result-pick"
      >
        {c.getValue()}
      </button>
    ),
  }),
  col.accessor("label", { header: "What", cell: (c) => `${c.getValue()}${c.row.original.kind === "joint" ? " (connection)" : ""}` }),
  col.accessor((r) => Math.abs(r.current), { id: "current", header: "Current", cell: (c) => num(1, "A")(c.getValue()) }),
  col.accessor((r) => r.resistance * 1000, { id: "resistance", header: "Resistance", cell: (c) => num(3, "mΩ")(c.getValue()) }),
  col.accessor((r) => Math.abs(r.drop), { id: "drop", header: "Drop", cell: (c) => num(3, "V")(c.getValue()) }),
  col.accessor("dropPercent", { header: "Drop %", cell: (c) => num(2, "%")(c.getValue()) }),
  col.accessor("power", { header: "Heat", cell: (c) => num(2, "W")(c.getValue()) }),
  col.accessor("ampacityA", { header: "Ampacity", cell: (c) => num(0, "A")(c.getValue()) }),
  col.accessor("usePercent", { header: "Use", cell: (c) => num(0, "%")(c.getValue()) }),
  col.accessor((r) => r.over.join(", "), {
    id: "limit",
    header: "Limit",
    cell: (c) => (c.getValue() ? <span className="font-semibold text-over">▲ over: {c.getValue()}</span> : <span className="text-within">within</span>),
  }),
];

/** Every cable and connection with its figures, sortable; a row click picks it on the canvas. */
export const ResultsTable = memo(function ResultsTable({ rows, onPick }: { rows: WireFigures[]; onPick: (id: string) => void }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "drop", desc: true }]);
  // A large circuit lists its worst rows first (by the chosen sort); the rest on request, so each edit stays quick.
  const [all, setAll] = useState(false);
  const table = useReactTable({ data: rows, columns, meta: { onPick }, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
  return (
    <div className="mt-2 max-h-80 overflow-auto rounded border border-graphite-100 bg-white">
      <table className="w-full min-w-[760px] text-sm" data-testid="ws-results">
        <thead className="sticky top-0 bg-graphite-100">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} className="px-2 py-1.5 text-left font-semibold" aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : undefined}>
                  <button type="button" onClick={h.column.getToggleSortingHandler()} className="hover:text-copper-700">
                    {flexRender(h.column.columnDef.header, h.getContext())} {h.column.getIsSorted() === "asc" ? "▲" : h.column.getIsSorted() === "desc" ? "▼" : ""}
                  </button>
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {(all ? table.getRowModel().rows : table.getRowModel().rows.slice(0, FIRST_ROWS)).map((r) => (
            <tr key={r.id} onClick={() => onPick(r.original.id)} className="cursor-pointer hover:bg-copper-50" data-testid="ws-result-row" data-row-id={r.original.id}>
              {r.getVisibleCells().map((c) => (
                <td key={c.id} className="whitespace-nowrap px-2 py-1 tabular-nums">
                  {flexRender(c.column.columnDef.cell, c.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length > FIRST_ROWS ? (
        <button type="button" onClick={() => setAll(!all)} className="w-full border-t border-graphite-100 px-3 py-2 text-left text-sm text-copper-700 underline" data-testid="ws-results-all">
          {all ? `Show the first ${FIRST_ROWS} rows only` : `Show all ${rows.length} rows (the first ${FIRST_ROWS} by the chosen order are shown)`}
        </button>
      ) : null}
      {rows.length === 0 ? <p className="px-3 py-3 text-sm text-graphite-500">No cables yet: join two terminals to draw one.</p> : null}
    </div>
  );
});
