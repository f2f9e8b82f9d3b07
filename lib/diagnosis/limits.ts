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
