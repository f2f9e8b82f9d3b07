import type { CircuitDocument } from "@/lib/circuit";
import { CIRCUIT_DEFAULTS } from "@/lib/circuit";
import { deratedAmpacity, ZONE_AMBIENT_C } from "@/lib/conductors/ampacity";
import { findSize } from "@/lib/conductors/sizes";
import { DROP_LIMIT_PERCENT } from "@/lib/conductors/sizing";
import type { SolveResult } from "@/lib/solver";

/**
 * The limits the canvas marks. Common practice (no single standard): about 3 % of the system voltage on a cable
 * feeding a critical load (the figure lib/conductors sizes to), about 0.1 V across one connection under load, and
 * no cable above its derated ampacity (33 CFR 183.425 Table 5 with the NFPA 70 ambient rule).
 */
export const CANVAS_LIMITS = { wireDropPercent: DROP_LIMIT_PERCENT.critical, jointDropV: 0.1, ampacityUsePercent: 100 } as const;

export type Band = "within" | "caution" | "over";
export type Overlay = "drop" | "loss" | "ampacity";

/** Within below 60 % of a limit, caution from 60 % up to it, over past it. */
export function bandOf(value: number, limit: number): Band {
  const v = Math.abs(value);
  return v > limit ? "over" : v >= 0.6 * limit ? "caution" : "within";
}

export type WireFigures = {
  id: string;
  kind: "wire" | "joint";
  label: string;
  current: number;
  resistance: number;
  drop: number;
  dropPercent: number;
  power: number;
  ampacityA?: number;
  usePercent?: number;
  /** What is over its limit, in words ("drop", "ampacity"); empty when nothing is. */
  over: string[];
  band: Record<Overlay, Band>;
};

/** Every cable and joint with its current, drop, heat and ampacity use, and which limits it passes. */
export function assess(doc: CircuitDocument, result: SolveResult | undefined): WireFigures[] {
  if (!result) return [];
  const rows: WireFigures[] = [];
  const lossLimit = (drop: number, I: number) => Math.abs(drop * I);
  for (const w of doc.wires) {
    const r = result.wires[w.id];
    // Zero-ohm links only say two terminals are one point; they have nothing to show.
    if (!r || w.resistanceOhm === 0) continue;
    const size = w.size ? findSize(w.size) : undefined;
    const ambient = w.zone ? Math.max(doc.ambientC ?? CIRCUIT_DEFAULTS.ambientC, ZONE_AMBIENT_C[w.zone]) : (doc.ambientC ?? CIRCUIT_DEFAULTS.ambientC);
    const amp = size && w.resistanceOhm === undefined ? deratedAmpacity(size, w.insulationRatingC ?? CIRCUIT_DEFAULTS.insulationRatingC, ambient, w.bundleSize ?? 1) : undefined;
    const usePercent = amp && amp.ampacityA > 0 ? (100 * Math.abs(r.current)) / amp.ampacityA : undefined;
    const over: string[] = [];
    if (r.dropPercent > CANVAS_LIMITS.wireDropPercent) over.push("drop");
    if (usePercent !== undefined && usePercent > CANVAS_LIMITS.ampacityUsePercent) over.push("ampacity");
    rows.push({
      id: w.id,
      kind: "wire",
      label: w.label ?? `${w.from} to ${w.to}`,
      ...r,
      ampacityA: amp?.ampacityA,
      usePercent,
      over,
      band: {
        drop: bandOf(r.dropPercent, CANVAS_LIMITS.wireDropPercent),
        // Heat: judged against what the same cable would dissipate at the drop limit.
        loss: bandOf(r.power, Math.max(1e-9, lossLimit((CANVAS_LIMITS.wireDropPercent / 100) * doc.systemVoltage, r.current))),
        ampacity: usePercent === undefined ? "within" : bandOf(usePercent, CANVAS_LIMITS.ampacityUsePercent),
      },
    });
  }
  for (const c of doc.components) {
    if (c.kind !== "joint") continue;
    const r = result.components[c.id];
    if (!r || r.current === undefined) continue;
    const over = Math.abs(r.voltage) > CANVAS_LIMITS.jointDropV ? ["drop"] : [];
    const b = bandOf(r.voltage, CANVAS_LIMITS.jointDropV);
    rows.push({
      id: c.id,
      kind: "joint",
      label: c.label ?? c.id,
      current: r.current,
      resistance: c.resistance,
      drop: r.voltage,
      dropPercent: (100 * Math.abs(r.voltage)) / doc.systemVoltage,
      power: r.power ?? 0,
      over,
      band: { drop: b, loss: b, ampacity: "within" },
    });
  }
  return rows;
}
