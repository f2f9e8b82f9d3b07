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

/** The charging window for the system voltage (the 12 V figures, scaled). */
export function chargingWindowV(systemVoltage: number): [number, number] {
  const k = systemVoltage / 12;
  return [DIAGNOSIS_LIMITS.charging12V[0] * k, DIAGNOSIS_LIMITS.charging12V[1] * k];
}
