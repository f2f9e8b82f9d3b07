"use client";

import { ViewportPortal } from "@xyflow/react";
import { useMemo } from "react";
import { terminalLabel } from "@/components/circuits/describe";
import type { CircuitDocument } from "@/lib/circuit";
import { checkReadings, type Reading } from "@/lib/diagnosis/compare";
import { formatVolts } from "@/lib/format";
import type { PartNode } from "./nodes";

const TONE: Record<string, string> = {
  "as-predicted": "border-within bg-within-soft text-within",
  higher: "border-over bg-over-soft text-over",
  lower: "border-caution bg-caution-soft text-caution",
  "no-model": "border-graphite-300 bg-white text-graphite-700",
};

/**
 * Meter readings of the operating state on show, drawn on the canvas: a red and a black dot on the probed parts and,
 * between them, the reading with the model's prediction, coloured by how far apart they are.
 */
export function ReadingMarkers({ doc, readings, stateId, nodes }: { doc: CircuitDocument; readings: Reading[]; stateId: string; nodes: PartNode[] }) {
  const shown = useMemo(() => readings.filter((r) => r.stateId === stateId), [readings, stateId]);
  const checks = useMemo(() => new Map(checkReadings(doc, shown).map((c) => [c.id, c])), [doc, shown]);
  const byId = useMemo(() => new Map(nodes.map((n) => [n.id, n])), [nodes]);
  const centre = (terminal: string) => {
    const n = byId.get(terminal.slice(0, terminal.lastIndexOf(".")));
    if (!n) return undefined;
    return { x: n.position.x + (n.measured?.width ?? 120) / 2, y: n.position.y + (n.measured?.height ?? 60) / 2, top: n.position.y };
  };
  if (!shown.length) return null;
  return (
    <ViewportPortal>
      {shown.map((r, i) => {
        const a = centre(r.positive);
        const b = centre(r.negative);
        const c = checks.get(r.id);
        if (!a || !b || !c) return null;
        // Stacked a little apart, so readings between the same parts do not cover each other.
        const same = r.positive.slice(0, r.positive.lastIndexOf(".")) === r.negative.slice(0, r.negative.lastIndexOf("."));
        // Across one part: above it (the canvas draws parts over this layer); between two parts: halfway.
        const mid = same ? { x: a.x, y: a.top - 22 - (i % 2) * 24 } : { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 + (i % 4) * 26 - 13 };
        const title = `Red on ${terminalLabel(doc, r.positive)}, black on ${terminalLabel(doc, r.negative)}`;
        return (
          <div key={r.id} className="pointer-events-none" data-testid="canvas-reading">
            <span className="absolute h-3 w-3 rounded-full border-2 border-white bg-over shadow" style={{ transform: `translate(${a.x - 12}px, ${a.top - 6}px)` }} />
            <span className="absolute h-3 w-3 rounded-full border-2 border-white bg-graphite-900 shadow" style={{ transform: `translate(${b.x + 2}px, ${b.top - 6}px)` }} />
            <span
              className={`pointer-events-auto absolute whitespace-nowrap rounded border px-1.5 py-0.5 font-mono text-[11px] font-semibold shadow-sm ${TONE[c.verdict]}`}
              style={{ transform: `translate(-50%, -50%) translate(${mid.x}px, ${mid.y}px)` }}
              title={title}
            >
              {formatVolts(c.measuredV)}
              {c.expectedV !== undefined ? <span className="font-normal"> · model {formatVolts(c.expectedV)}</span> : null}
            </span>
          </div>
        );
      })}
    </ViewportPortal>
  );
}
