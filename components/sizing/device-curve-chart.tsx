"use client";

import { memo } from "react";
import { CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { bandAt, DEVICE_FAMILIES, type SizingAnswer } from "@/lib/conductors";

const POINTS = 60;
const T_MIN = 0.001;
const T_MAX = 100_000;

const clampT = (t: number) => (Number.isFinite(t) ? Math.min(T_MAX, Math.max(T_MIN, t)) : undefined);
const fmtTime = (s: number) => (s >= 3600 ? `${+(s / 3600).toPrecision(2)} h` : s >= 60 ? `${+(s / 60).toPrecision(2)} min` : s >= 1 ? `${+s.toPrecision(2)} s` : `${+(s * 1000).toPrecision(2)} ms`);
const fmtAmps = (a: number) => (a >= 1000 ? `${+(a / 1000).toPrecision(3)} kA` : `${+a.toPrecision(3)} A`);

/**
 * The chosen device's time-current band (log-log) against what it must do: carry the load's peak for its on-time
 * (the point must sit left of and below the band's fast edge), and clear a short before the cable's withstand line
 * (the band's slow edge must sit under that line across the fault currents of the run).
 */
export const DeviceCurveChart = memo(function DeviceCurveChart({ answer }: { answer: SizingAnswer }) {
  const p = answer.protection;
  if (!p) return null;
  const family = DEVICE_FAMILIES[p.family];
  const { fault, peak, inrush } = p.checks;
  const lo = Math.max(1, Math.min(p.ratingA, peak.currentA) * 0.8);
  const hi = Math.max(fault.maxA * 1.2, p.ratingA * 12);
  const data = Array.from({ length: POINTS }, (_, i) => {
    const amps = lo * (hi / lo) ** (i / (POINTS - 1));
    const band = bandAt(family, amps / p.ratingA);
    const inFaultRange = amps >= fault.minA * 0.999 && amps <= fault.maxA * 1.001;
    return {
      amps,
      fastest: clampT(band.minS),
      slowest: clampT(band.maxS),
      withstand: inFaultRange ? clampT(fault.withstandI2t / (amps * amps)) : undefined,
    };
  });
  // Ticks at 1, 2 and 5 of each decade in view.
  const ticks: number[] = [];
  for (let d = 10 ** Math.floor(Math.log10(lo)); d <= hi; d *= 10) for (const m of [1, 2, 5]) if (d * m >= lo && d * m <= hi) ticks.push(d * m);
  // A continuous load has no on-time to draw: only a peak held for a while, or an inrush, is a point on the chart.
  const points = [...(peak.forS > 0 ? [{ amps: peak.currentA, time: peak.forS, name: "peak" }] : []), ...(inrush ? [{ amps: inrush.currentA, time: inrush.forS, name: "inrush" }] : [])];
  const withstandKA2s = fault.withstandI2t / 1e6;
  const letKA2s = fault.letThroughI2t / 1e6;
  return (
    <figure className="rounded-lg border border-graphite-100 bg-paper-raised p-4" data-testid="device-chart">
      <figcaption className="text-sm font-medium text-graphite-800">{p.name}: time against current</figcaption>
      <p className="mt-1 text-xs text-graphite-500">
        The band between the two lines is where a {family.name.toLowerCase()} may open. The load&apos;s peak must sit to the left of the fast edge; across the run&apos;s fault
        currents ({fmtAmps(fault.minA)} to {fmtAmps(fault.maxA)}) the slow edge must stay under the cable&apos;s withstand line.
      </p>
      <div className="mt-3 h-80 w-full" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
            <CartesianGrid stroke="var(--color-graphite-100)" />
            <XAxis
              dataKey="amps"
              type="number"
              scale="log"
              domain={[lo, hi]}
              allowDataOverflow
              ticks={ticks}
              tickFormatter={(v: number) => fmtAmps(v)}
              label={{ value: "current", position: "insideBottom", offset: -2, fontSize: 12 }}
              fontSize={12}
              height={40}
            />
            <YAxis type="number" scale="log" domain={[T_MIN, T_MAX]} allowDataOverflow ticks={[0.001, 0.01, 0.1, 1, 10, 100, 1000, 10000, 100000]} tickFormatter={(v: number) => fmtTime(v)} fontSize={12} width={64} />
            <Tooltip formatter={(value) => fmtTime(Number(value))} labelFormatter={(label) => fmtAmps(Number(label))} contentStyle={{ fontSize: 12 }} />
            <Legend verticalAlign="bottom" wrapperStyle={{ fontSize: 12, paddingTop: 8 }} />
            <Line dataKey="fastest" name="may open as soon as" stroke="var(--color-copper-600)" strokeWidth={2} dot={false} isAnimationActive={false} connectNulls={false} />
            <Line dataKey="slowest" name="clears no later than" stroke="var(--color-graphite-800)" strokeDasharray="6 3" strokeWidth={2} dot={false} isAnimationActive={false} connectNulls={false} />
            <Line dataKey="withstand" name="cable withstand" stroke="var(--color-over)" strokeDasharray="2 3" strokeWidth={2} dot={false} isAnimationActive={false} connectNulls={false} />
            {points.length ? <Scatter data={points} dataKey="time" name="load's peak" fill="var(--color-within)" shape="diamond" isAnimationActive={false} /> : null}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <ul className="mt-2 space-y-1 text-sm text-graphite-700" data-testid="device-checks">
        <li>
          {peak.forS > 0
            ? `Carries ${fmtAmps(peak.currentA)} for ${fmtTime(peak.forS)}: it may open no sooner than ${Number.isFinite(peak.opensNoSoonerThanS) ? fmtTime(peak.opensNoSoonerThanS) : "never at that current"}.`
            : `Carries ${fmtAmps(peak.currentA)} continuously: ${Number.isFinite(peak.opensNoSoonerThanS) ? `it may open after ${fmtTime(peak.opensNoSoonerThanS)} at that current` : "below any current it opens at"}.`}
        </li>
        {inrush ? (
          <li>
            Carries the {fmtAmps(inrush.currentA)} inrush for {fmtTime(inrush.forS)}: it may open no sooner than {Number.isFinite(inrush.opensNoSoonerThanS) ? fmtTime(inrush.opensNoSoonerThanS) : "never"}.
          </li>
        ) : null}
        <li>
          Rated {p.ratingA} A, within the {p.checks.ampacityA.toFixed(0)} A the cable may carry.
        </li>
        <li>
          Lets through at most {letKA2s < 0.01 ? `${(fault.letThroughI2t).toFixed(0)} A²s` : `${letKA2s.toPrecision(3)} kA²s`} (at {fmtAmps(fault.atA)}), under the cable&apos;s {withstandKA2s.toPrecision(3)} kA²s (k = {fault.k},
          IEC 60364-4-43).
        </li>
      </ul>
      <p className="mt-2 text-xs text-graphite-500">{family.source}. Check the part against its maker&apos;s curve.</p>
    </figure>
  );
});
