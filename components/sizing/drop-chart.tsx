"use client";

import { memo } from "react";
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { dropAtLength, longestRun, type Candidate, type SizingAnswer } from "@/lib/conductors";

/** Up to four sizes worth comparing: the one below the answer (why not smaller), the answer, and two above it. */
export function chartCandidates(answer: SizingAnswer): Candidate[] {
  const list = answer.candidates;
  const at = answer.recommended ? list.findIndex((c) => c.size === answer.recommended!.size) : list.length - 1;
  return list.slice(Math.max(0, at - 1), at + 3);
}

// Each line has its own stroke pattern as well as its own colour, so they can be told apart without colour.
const LINES = [
  { colour: "var(--color-graphite-500)", dash: "6 4" },
  { colour: "var(--color-copper-600)", dash: undefined },
  { colour: "var(--color-graphite-800)", dash: "2 3" },
  { colour: "var(--color-within)", dash: "10 3 2 3" },
];

const POINTS = 41;

/** The length axis: past the run typed and past where the chosen size reaches the limit, so the margin shows. */
export function chartSpan(answer: SizingAnswer, shown: Candidate[]): number {
  const chosen = answer.recommended ?? shown[shown.length - 1];
  const reach = chosen ? longestRun(answer, chosen) : 0;
  const want = Math.max(answer.basis.lengthM * 1.5, Number.isFinite(reach) ? reach * 1.15 : 0);
  const span = Math.min(want, answer.basis.lengthM * 6);
  // A round end for the axis: 1, 2 or 5 times a power of ten.
  const step = 10 ** Math.floor(Math.log10(span));
  const nice = [1, 2, 2.5, 5, 10].map((k) => k * step).find((n) => n >= span) ?? span;
  return nice;
}

/** Drop against one-way length for the candidates around the answer, with the limit and the run typed drawn in. */
export const DropChart = memo(function DropChart({ answer }: { answer: SizingAnswer }) {
  const shown = chartCandidates(answer);
  const span = chartSpan(answer, shown);
  const data = Array.from({ length: POINTS }, (_, i) => {
    const lengthM = (span * i) / (POINTS - 1);
    const row: Record<string, number> = { lengthM };
    for (const c of shown) row[c.size] = dropAtLength(answer, c, lengthM);
    return row;
  });
  const yMax = Math.max(answer.limitV * 1.6, ...shown.map((c) => Math.min(dropAtLength(answer, c, span), answer.limitV * 3)));
  const summary = shown
    .map((c) => {
      const reach = longestRun(answer, c);
      return `${c.size} reaches the limit at ${Number.isFinite(reach) ? `${reach.toFixed(1)} m` : "no length"}`;
    })
    .join("; ");
  return (
    <figure className="rounded-lg border border-graphite-100 bg-paper-raised p-4" data-testid="size-chart">
      <figcaption className="text-sm font-medium text-graphite-800">Drop against run length</figcaption>
      <p className="mt-1 text-xs text-graphite-500">
        At {answer.basis.currentA.toFixed(answer.basis.currentA < 10 ? 1 : 0)} A. The dashed red line is the {answer.limitV.toFixed(2)} V limit; the
        upright line is your {answer.basis.lengthM.toFixed(1)} m run.
      </p>
      <div className="mt-3 h-72 w-full" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
            <CartesianGrid stroke="var(--color-graphite-100)" />
            <XAxis
              dataKey="lengthM"
              type="number"
              domain={[0, span]}
              tickFormatter={(v: number) => `${Number(v.toFixed(1))}`}
              label={{ value: "one-way length, m", position: "insideBottom", offset: -2, fontSize: 12 }}
              fontSize={12}
              height={40}
            />
            <YAxis domain={[0, Number(yMax.toPrecision(2))]} allowDataOverflow tickFormatter={(v: number) => v.toFixed(2)} fontSize={12} width={64} unit=" V" />
            <Tooltip
              formatter={(value) => `${Number(value).toFixed(3)} V`}
              labelFormatter={(label) => `${Number(label).toFixed(1)} m one way`}
              contentStyle={{ fontSize: 12 }}
            />
            <Legend verticalAlign="top" height={28} wrapperStyle={{ fontSize: 12 }} />
            <ReferenceLine y={answer.limitV} stroke="var(--color-over)" strokeDasharray="4 4" label={{ value: `limit ${answer.limitV.toFixed(2)} V`, position: "insideTopRight", fontSize: 11, fill: "var(--color-over)" }} />
            <ReferenceLine x={answer.basis.lengthM} stroke="var(--color-graphite-700)" label={{ value: "your run", position: "insideTopLeft", fontSize: 11 }} />
            {shown.map((c, i) => (
              <Line
                key={c.size}
                dataKey={c.size}
                name={c.size === answer.recommended?.size ? `${c.size} (chosen)` : c.size}
                stroke={LINES[i % LINES.length].colour}
                strokeDasharray={LINES[i % LINES.length].dash}
                strokeWidth={c.size === answer.recommended?.size ? 3 : 1.5}
                dot={false}
                isAnimationActive={false}
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="mt-2 text-sm text-graphite-700" data-testid="size-chart-summary">
        {summary}.
      </p>
    </figure>
  );
});
