/** Conductor sizes as the circuit document writes them: "8 AWG", "2/0 AWG", "16 mm2". */

export type SizeFamily = "awg" | "metric";

export type ConductorSize = {
  /** As written in documents and answers: "4/0 AWG", "35 mm2". */
  label: string;
  family: SizeFamily;
  /** Cross-section in square metres (AWG from the diameter law, metric the nominal area). */
  areaM2: number;
  /** Cross-section in circular mils (1 cmil = pi/4 mil^2). */
  cmil: number;
  /** The AWG gauge number, with 1/0 = 0, 2/0 = -1, 3/0 = -2, 4/0 = -3. */
  gauge?: number;
};

/** One circular mil in square metres: pi/4 x (25.4e-6 m)^2 (definition). */
export const CMIL_M2 = (Math.PI / 4) * 25.4e-6 * 25.4e-6;

/** AWG diameter law (ASTM B258): d = 0.005 in x 92^((36 - n)/39). */
export function awgDiameterM(gauge: number): number {
  return 0.005 * 0.0254 * Math.pow(92, (36 - gauge) / 39);
}

const AWG_LABELS: [string, number][] = [
  ["20", 20], ["18", 18], ["16", 16], ["14", 14], ["12", 12], ["10", 10], ["8", 8], ["6", 6], ["4", 4], ["2", 2],
  ["1", 1], ["1/0", 0], ["2/0", -1], ["3/0", -2], ["4/0", -3],
];

/** The IEC 60228 nominal areas Ampwright offers, in mm2. */
export const METRIC_AREAS_MM2 = [0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120];

export const AWG_SIZES: ConductorSize[] = AWG_LABELS.map(([name, gauge]) => {
  const d = awgDiameterM(gauge);
  const areaM2 = (Math.PI / 4) * d * d;
  return { label: `${name} AWG`, family: "awg", areaM2, cmil: areaM2 / CMIL_M2, gauge };
});

export const METRIC_SIZES: ConductorSize[] = METRIC_AREAS_MM2.map((mm2) => ({
  label: `${mm2} mm2`,
  family: "metric",
  areaM2: mm2 * 1e-6,
  cmil: (mm2 * 1e-6) / CMIL_M2,
}));

const BY_LABEL = new Map<string, ConductorSize>([...AWG_SIZES, ...METRIC_SIZES].map((s) => [s.label, s]));

/** Sizes of one family, smallest first. */
export function sizesOf(family: SizeFamily): ConductorSize[] {
  return family === "awg" ? AWG_SIZES : METRIC_SIZES;
}

export const SIZE_LABELS = [...AWG_SIZES, ...METRIC_SIZES].map((s) => s.label);

/**
 * Looks a size up by its label. Accepts small variations people type ("2/0 awg", "16mm2", "16 mm²",
 * "00 AWG") and answers the canonical size, or undefined.
 */
export function findSize(text: string): ConductorSize | undefined {
  const exact = BY_LABEL.get(text);
  if (exact) return exact;
  const t = text.trim().toLowerCase().replace(/\s+/g, " ").replace("mm²", "mm2").replace("sq mm", "mm2");
  const awg = /^(\d{1,2}|[1-4]\/0|0{1,4})\s*(?:awg|ga|gauge)$/.exec(t);
  if (awg) {
    let name = awg[1];
    if (/^0+$/.test(name)) name = `${name.length}/0`;
    return BY_LABEL.get(`${name} AWG`);
  }
  const mm = /^(\d+(?:\.\d+)?)\s*mm2$/.exec(t);
  if (mm) return BY_LABEL.get(`${Number(mm[1])} mm2`);
  return undefined;
}

/** Index of a size within its family (0 = smallest). */
export function sizeRank(size: ConductorSize): number {
  return sizesOf(size.family).findIndex((s) => s.label === size.label);
}
