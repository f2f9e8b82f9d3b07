/**
 * Protective devices as data: each family's ratings and a representative time-current band (the shortest time a
 * device of the family may take to open, and the longest it may take to clear, at multiples of its rating). The
 * bands are representative of the family, not of any maker's part: the maker's published curve decides for the part
 * in hand, and a sizing says so.
 */

export type DeviceFamilyId = "blade" | "bolt-in" | "breaker-auto" | "breaker-modified" | "breaker-manual";

export type CurvePoint = { multiple: number; minS: number; maxS: number };

export type DeviceFamily = {
  id: DeviceFamilyId;
  name: string;
  kind: "fuse" | "breaker";
  ratingsA: readonly number[];
  /** The current it carries without ever opening, as a multiple of its rating. */
  carriesMultiple: number;
  /** Representative band, multiples ascending; between points the times are interpolated log-log. */
  curve: readonly CurvePoint[];
  /**
   * Past the last point the element heats adiabatically, so the time falls as 1 / I^2 (constant I^2 t), down to the
   * shortest time the mechanism can clear in (floorS: none for a fuse, about 20 ms for a breaker's contacts, from
   * memory), below which a breaker's let-through grows with the square of the current.
   */
  beyond: "constant-i2t";
  /** The shortest time its mechanism can clear in, whatever the current (a breaker's contacts), s. */
  floorS: number;
  source: string;
  caution?: string;
};

/** ISO 8820-3 blade fuses (mini to standard); the ratings are the standard's series. */
const BLADE: DeviceFamily = {
  id: "blade",
  name: "Blade fuse",
  kind: "fuse",
  ratingsA: [1, 2, 3, 4, 5, 7.5, 10, 15, 20, 25, 30, 35, 40],
  carriesMultiple: 1.1,
  curve: [
    { multiple: 1.1, minS: 360_000, maxS: Infinity },
    { multiple: 1.35, minS: 0.75, maxS: 600 },
    { multiple: 2, minS: 0.15, maxS: 5 },
    { multiple: 3.5, minS: 0.08, maxS: 0.5 },
    { multiple: 6, minS: 0.02, maxS: 0.1 },
  ],
  beyond: "constant-i2t",
  floorS: 0,
  source: "ISO 8820-3 blade fuse test points, representative (from memory): 110 % held 100 h; 135 % opens within 0.75 to 600 s; 200 % within 0.15 to 5 s; 350 % within 0.08 to 0.5 s; 600 % within 0.02 to 0.1 s",
};

/** Bolt-in high-current fuses (strip and stud-mounted slow types). */
const BOLT_IN: DeviceFamily = {
  id: "bolt-in",
  name: "Bolt-in fuse",
  kind: "fuse",
  ratingsA: [30, 40, 50, 60, 70, 80, 100, 125, 150, 175, 200, 225, 250, 300, 350, 400, 500],
  carriesMultiple: 1.1,
  curve: [
    { multiple: 1.1, minS: 360_000, maxS: Infinity },
    { multiple: 1.5, minS: 60, maxS: 3600 },
    { multiple: 2, minS: 10, maxS: 300 },
    { multiple: 3, minS: 1, maxS: 30 },
    { multiple: 5, minS: 0.15, maxS: 3 },
    { multiple: 10, minS: 0.02, maxS: 0.3 },
  ],
  beyond: "constant-i2t",
  floorS: 0,
  source: "representative slow-acting bolt-in fuse band (from memory of makers' published curves, ISO 8820-5 style): 110 % held; 150 % opens within 1 to 60 min; 200 % within 10 to 300 s; 300 % within 1 to 30 s; 500 % within 0.15 to 3 s; 1000 % within 0.02 to 0.3 s",
};

const BREAKER_CURVE: readonly CurvePoint[] = [
  { multiple: 1, minS: 360_000, maxS: Infinity },
  { multiple: 1.35, minS: 30, maxS: 3600 },
  { multiple: 2, minS: 5, maxS: 60 },
  { multiple: 3, minS: 1.5, maxS: 20 },
  { multiple: 5, minS: 0.5, maxS: 6 },
  { multiple: 10, minS: 0.1, maxS: 1.5 },
];
const BREAKER_RATINGS = [5, 10, 15, 20, 25, 30, 40, 50, 60, 70, 80, 100, 120, 135, 150, 200, 250, 300];
const BREAKER_SOURCE =
  "SAE J553 thermal circuit breakers (types I auto-reset, II modified reset, III manual reset), representative band (from memory): 100 % carried; 135 % trips within 30 s to 1 h; 200 % within 5 to 60 s; 300 % within 1.5 to 20 s; 500 % within 0.5 to 6 s; 1000 % within 0.1 to 1.5 s";

/** The three SAE J553 types share one band; they differ in how they reset after tripping. */
const breaker = (id: DeviceFamilyId, name: string, caution?: string): DeviceFamily => ({
  id,
  name,
  kind: "breaker",
  ratingsA: BREAKER_RATINGS,
  carriesMultiple: 1,
  curve: BREAKER_CURVE,
  beyond: "constant-i2t",
  floorS: 0.02,
  source: BREAKER_SOURCE,
  ...(caution ? { caution } : {}),
});

export const DEVICE_FAMILIES: Record<DeviceFamilyId, DeviceFamily> = {
  blade: BLADE,
  "bolt-in": BOLT_IN,
  "breaker-manual": breaker("breaker-manual", "Manual-reset breaker (SAE J553 type III)"),
  "breaker-modified": breaker("breaker-modified", "Modified-reset breaker (SAE J553 type II)", "Resets only when the circuit is switched off: find the fault before switching on again."),
  "breaker-auto": breaker(
    "breaker-auto",
    "Auto-reset breaker (SAE J553 type I)",
    "Cycles on and off into a standing fault, heating the cable each time: not for a feed that must stay safe unattended.",
  ),
};

export type DevicePreference = "fuse" | "breaker" | DeviceFamilyId;

/** The families tried, in order, for a preference: fuses (blade, then bolt-in), or breakers (manual reset first). */
export function familiesFor(prefer: DevicePreference = "fuse"): DeviceFamily[] {
  if (prefer === "fuse") return [BLADE, BOLT_IN];
  if (prefer === "breaker") return [DEVICE_FAMILIES["breaker-manual"], DEVICE_FAMILIES["breaker-modified"]];
  return [DEVICE_FAMILIES[prefer]];
}

function logInterp(x: number, x0: number, x1: number, y0: number, y1: number): number {
  // An unbounded end (never certain to clear) stays unbounded until the next point is reached.
  if (!Number.isFinite(y0)) return x >= x1 ? y1 : y0;
  if (!Number.isFinite(y1)) return x <= x0 ? y0 : y1;
  const t = (Math.log(x) - Math.log(x0)) / (Math.log(x1) - Math.log(x0));
  return Math.exp(Math.log(y0) + t * (Math.log(y1) - Math.log(y0)));
}

/**
 * The band at a multiple of the rating: the shortest time the device may open in, and the longest it may take
 * to clear, seconds. Infinity where it never opens (or is not certain to).
 */
export function bandAt(family: DeviceFamily, multiple: number): { minS: number; maxS: number } {
  const c = family.curve;
  if (multiple <= family.carriesMultiple) return { minS: Infinity, maxS: Infinity };
  if (multiple <= c[0].multiple) return { minS: c[0].minS, maxS: c[0].maxS };
  for (let i = 1; i < c.length; i++) {
    if (multiple <= c[i].multiple) {
      // Between the "held" point and the first opening point the shortest time falls from the held time.
      return { minS: logInterp(multiple, c[i - 1].multiple, c[i].multiple, c[i - 1].minS, c[i].minS), maxS: logInterp(multiple, c[i - 1].multiple, c[i].multiple, c[i - 1].maxS, c[i].maxS) };
    }
  }
  const last = c[c.length - 1];
  const k = (last.multiple / multiple) ** 2;
  return { minS: Math.max(Math.min(family.floorS, last.minS), last.minS * k), maxS: Math.max(family.floorS, last.maxS * k) };
}

/** The most energy (I^2 t, A^2 s) a device of this rating lets through while clearing a fault current. */
export function letThroughI2t(family: DeviceFamily, ratingA: number, faultA: number): number {
  return faultA * faultA * bandAt(family, faultA / ratingA).maxS;
}

/**
 * Adiabatic short-circuit withstand of a conductor: (k S)^2, A^2 s, S in mm2. k from IEC 60364-4-43 Table 43A
 * (the same factors as IEC 60949's adiabatic method): copper with PVC insulation 115, with cross-linked (XLPE/EPR)
 * insulation 143; aluminium with PVC 76, with XLPE 94 (from memory; check the table). Copper-clad aluminium takes
 * aluminium's factors (its core carries the heat).
 */
export function withstandI2t(areaMm2: number, material: string, insulationRatingC: number): { i2t: number; k: number } {
  const crossLinked = insulationRatingC >= 125;
  const copper = material === "copper" || material === "tinned-copper";
  const k = copper ? (crossLinked ? 143 : 115) : crossLinked ? 94 : 76;
  return { i2t: (k * areaMm2) ** 2, k };
}

/** "25 A blade fuse", "100 A bolt-in fuse", "50 A manual-reset breaker (SAE J553 type III)". */
export function describeDevice(p: { ratingA: number; family: DeviceFamilyId }): string {
  return `${p.ratingA} A ${DEVICE_FAMILIES[p.family].name.charAt(0).toLowerCase()}${DEVICE_FAMILIES[p.family].name.slice(1)}`;
}
