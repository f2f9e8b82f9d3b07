import { findSize } from "@/lib/conductors/sizes";

/** How this browser shows lengths, conductor sizes and temperatures (the document always holds SI and its own size labels). */
export type UnitPrefs = { length: "m" | "ft"; temperature: "degC" | "degF"; size: "awg" | "mm2" };
export const DEFAULT_PREFS: UnitPrefs = { length: "m", temperature: "degC", size: "awg" };

/** A size as this browser prefers to read it: an AWG size given its area in mm2 when metric is preferred. */
export function sizeShown(label: string, prefs: UnitPrefs, long = false): string {
  const s = findSize(label);
  if (!s || s.family !== "awg" || prefs.size !== "mm2") return label.replace(/ mm2$/, " mm²");
  const mm2 = `${+(s.areaM2 * 1e6).toPrecision(3)} mm²`;
  return long ? `${mm2} (${label})` : `≈${mm2}`;
}

/** An insulation rating in the preferred scale (ratings are whole degrees Celsius in the document). */
export const ratingShown = (c: number, prefs: UnitPrefs) => (prefs.temperature === "degF" ? `${Math.round((c * 9) / 5 + 32)} °F (${c} °C)` : `${c} °C`);
