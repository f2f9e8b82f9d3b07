/**
 * The figures the diagnosis judges readings by, each with where it comes from. Common practice means consistent
 * across makers' service manuals but set by no single standard; the vehicle maker's own figures come first.
 */
export const DIAGNOSIS_LIMITS = {
  /** Common practice (no single source): positive side of a starting circuit while cranking. */
  crankPositiveV: 0.5,
  /** Common practice (no single source): ground side of a starting circuit while cranking. */
  crankGroundV: 0.2,
  /** Common practice (no single source): each side of a charging circuit at charging current (0.2 to 0.3 V). */
  chargeSideV: 0.3,
  /** Common practice (no single source): across one connection under load. */
  connectionV: 0.1,
  /** Common practice: a 12 V system's charging voltage, about 13.5 to 14.8 V (double for 24 V). */
  charging12V: [13.5, 14.8] as const,
} as const;

/**
 * Battery Council International table: open-circuit voltage of a rested 12 V flooded lead-acid battery at about
 * 27 degrees C against its state of charge.
 */
export const BCI_OCV_12V: readonly [number, number][] = [
  [11.89, 0],
  [12.06, 25],
  [12.24, 50],
  [12.45, 75],
  [12.65, 100],
];

/**
 * State of charge in percent from a rested battery's open-circuit voltage, by straight lines between the BCI
 * table's points; a 24 V system is read as two 12 V batteries in series. Clamped to 0..100.
 */
export function stateOfChargePercent(openCircuitV: number, systemVoltage: number): number {
  const v = (openCircuitV * 12) / systemVoltage;
  const t = BCI_OCV_12V;
  if (v <= t[0][0]) return 0;
  if (v >= t[t.length - 1][0]) return 100;
  for (let i = 1; i < t.length; i++) {
    if (v <= t[i][0]) {
      const [v0, s0] = t[i - 1];
      const [v1, s1] = t[i];
      return s0 + ((v - v0) / (v1 - v0)) * (s1 - s0);
    }
  }
  return 100;
}

/** The charging window for the system voltage (the 12 V figures, scaled), from an organisation's limits if given. */
export function chargingWindowV(systemVoltage: number, limits?: Limits): [number, number] {
  const k = systemVoltage / 12;
  const lo = limits?.chargingLowV ?? DIAGNOSIS_LIMITS.charging12V[0];
  const hi = limits?.chargingHighV ?? DIAGNOSIS_LIMITS.charging12V[1];
  return [lo * k, hi * k];
}

/**
 * The limits an organisation may set for itself, with the common-practice default each starts from and the range
 * it may be set in. The charging window is stated for a 12 V system and scaled for others.
 */
export const LIMIT_FIELDS = [
  { key: "crankPositiveV", label: "Starting, positive side drop while cranking", unit: "V", default: DIAGNOSIS_LIMITS.crankPositiveV, min: 0.05, max: 2 },
  { key: "crankGroundV", label: "Starting, ground side drop while cranking", unit: "V", default: DIAGNOSIS_LIMITS.crankGroundV, min: 0.05, max: 2 },
  { key: "chargeSideV", label: "Charging, drop on each side at charging current", unit: "V", default: DIAGNOSIS_LIMITS.chargeSideV, min: 0.05, max: 2 },
  { key: "connectionV", label: "Across one connection under load", unit: "V", default: DIAGNOSIS_LIMITS.connectionV, min: 0.01, max: 1 },
  { key: "chargingLowV", label: "Charging voltage, low end (12 V system)", unit: "V", default: DIAGNOSIS_LIMITS.charging12V[0], min: 12, max: 15 },
  { key: "chargingHighV", label: "Charging voltage, high end (12 V system)", unit: "V", default: DIAGNOSIS_LIMITS.charging12V[1], min: 13, max: 16 },
  { key: "restSocPercent", label: "Battery at rest, lowest state of charge to go on testing", unit: "%", default: 75, min: 0, max: 100 },
] as const;
export type LimitKey = (typeof LIMIT_FIELDS)[number]["key"];
export type Limits = Record<LimitKey, number>;

/** The defaults with an organisation's own figures laid over them. */
export function effectiveLimits(own?: Partial<Record<string, number>> | null): Limits {
  const out = {} as Limits;
  for (const f of LIMIT_FIELDS) {
    const v = own?.[f.key];
    out[f.key] = typeof v === "number" && Number.isFinite(v) ? v : f.default;
  }
  return out;
}

/** The temperature limits are worked at when none is known: a shop at room temperature, 25 degrees C. */
export const REFERENCE_TEMP_C = 25;

/**
 * Regulators raise the charging voltage in the cold and lower it in the heat, by about -3 to -5 mV per cell per
 * degree C from 25 C (common practice; battery makers publish similar figures, e.g. -3 mV/cell/K, from memory).
 * The window widens by the smaller slope, never narrows: the high end rises in the cold, the low end falls in the
 * heat, so a regulator doing its job is not condemned on a cold morning or a hot afternoon.
 */
export const CHARGE_COMPENSATION_V_PER_CELL_K = -0.003;

/** The charging window at a battery temperature (see CHARGE_COMPENSATION_V_PER_CELL_K). */
export function chargingWindowAtV(systemVoltage: number, tempC: number, limits?: Limits): [number, number] {
  const [lo, hi] = chargingWindowV(systemVoltage, limits);
  const cells = 6 * (systemVoltage / 12);
  const shift = CHARGE_COMPENSATION_V_PER_CELL_K * cells * (tempC - REFERENCE_TEMP_C);
  return [lo + Math.min(0, shift), hi + Math.max(0, shift)];
}

/**
 * The lowest a healthy 12 V battery may fall to under a load test (half its CCA for 15 s), by battery temperature:
 * the battery makers' load-test table (from memory of the BCI table as printed by battery makers: 70 F and above
 * 9.6 V, 60 F 9.5, 50 F 9.4, 40 F 9.3, 30 F 9.1, 20 F 8.9, 10 F 8.7, 0 F 8.5). Straight lines between its rows,
 * 8.5 V below 0 F (-18 C), 9.6 V above 21 C; a 24 V system doubles it.
 */
export const CRANKING_FLOOR_12V: readonly [number, number][] = [
  [-17.8, 8.5],
  [-12.2, 8.7],
  [-6.7, 8.9],
  [-1.1, 9.1],
  [4.4, 9.3],
  [10, 9.4],
  [15.6, 9.5],
  [21.1, 9.6],
];

export function crankingFloorV(systemVoltage: number, tempC: number): number {
  const t = CRANKING_FLOOR_12V;
  let v: number;
  if (tempC <= t[0][0]) v = t[0][1];
  else if (tempC >= t[t.length - 1][0]) v = t[t.length - 1][1];
  else {
    const i = t.findIndex(([c]) => c >= tempC);
    const [c0, v0] = t[i - 1];
    const [c1, v1] = t[i];
    v = v0 + ((tempC - c0) / (c1 - c0)) * (v1 - v0);
  }
  return (v * systemVoltage) / 12;
}

/** The open-circuit voltage of a rested battery at a state of charge (the BCI table read backwards, as above). */
export function restVoltageForSoc(percent: number, systemVoltage: number): number {
  const t = BCI_OCV_12V;
  const p = Math.min(100, Math.max(0, percent));
  for (let i = 1; i < t.length; i++) {
    if (p <= t[i][1]) {
      const [v0, s0] = t[i - 1];
      const [v1, s1] = t[i];
      return ((v0 + ((p - s0) / (s1 - s0)) * (v1 - v0)) * systemVoltage) / 12;
    }
  }
  return (t[t.length - 1][0] * systemVoltage) / 12;
}

/** Half the last digit a value was entered with, in volts: 12.45 V was 12.445 to 12.455 V; 120 mV was 119.5 to 120.5 mV. */
export function halfDigitV(value: number, unit: "V" | "mV"): number {
  const text = Math.abs(value).toString();
  const exp = /e([+-]\d+)$/.exec(text);
  const mantissa = text.replace(/e[+-]\d+$/, "");
  const decimals = (mantissa.split(".")[1]?.length ?? 0) - (exp ? Number(exp[1]) : 0);
  const half = 0.5 * 10 ** -decimals;
  return unit === "mV" ? half / 1000 : half;
}

export type LimitCheck = "good" | "bad" | "cannot-tell";

/**
 * A reading against a limit at the resolution it was entered: good when every value the digits stand for meets it,
 * bad when none does, and "cannot tell" when the digits straddle it. A reading exactly at the limit, at its own
 * resolution, meets it (never lost to floating-point error).
 */
export function againstLimit(v: number, halfV: number, limit: number, kind: "at-least" | "at-most"): LimitCheck {
  const eps = 1e-9 * Math.max(1, Math.abs(limit));
  const step = 2 * halfV;
  // "At the limit" only when the limit itself can be written at the reading's resolution (12.45 V can at 0.01 V, not at 0.1 V).
  const units = step > 0 ? limit / step : NaN;
  const atLimit = Math.abs(units - Math.round(units)) < 1e-6 && Math.abs(Math.round(units) * step - v) <= eps;
  if (atLimit) return "good";
  if (kind === "at-least") return v - halfV >= limit - eps ? "good" : v + halfV < limit - eps ? "bad" : "cannot-tell";
  return v + halfV <= limit + eps ? "good" : v - halfV > limit + eps ? "bad" : "cannot-tell";
}
