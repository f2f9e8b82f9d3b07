/** Fuse and breaker ratings, and where the device must sit. */
import { describeDevice, type DeviceFamilyId } from "./devices";

export type ProtectionType = "blade" | "bolt-in" | "breaker";

/** Blade fuse ratings, amperes (ISO 8820-3 blade types, mini to standard). */
export const BLADE_RATINGS_A = [1, 2, 3, 4, 5, 7.5, 10, 15, 20, 25, 30, 35, 40];
/** Bolt-in high-current fuse ratings in their usual steps (common practice). */
export const BOLT_IN_RATINGS_A = [30, 40, 50, 60, 70, 80, 100, 125, 150, 175, 200, 250, 300, 400, 500];
/** Resettable breaker ratings commonly made for 12/24 V work (common practice, no source). */
export const BREAKER_RATINGS_A = [5, 10, 15, 20, 25, 30, 40, 50, 60, 70, 80, 100, 120, 135, 150, 200, 250, 300];

/** Protective device at least 125 % of the continuous current (common practice). */
export const PROTECTION_MARGIN = 1.25;

export type Protection = { ratingA: number; type: ProtectionType; placement: string };

export const PLACEMENT_RULE =
  "At the source: within 7 in (18 cm) of the battery or other source along the conductor, or within 40 in (1 m) if the conductor is in a sheath or loom the whole way (33 CFR 183.455).";

/** The smallest standard rating at or above minA: a blade fuse up to 40 A, a bolt-in fuse above (or a breaker if asked). */
export function pickRating(minA: number, prefer: ProtectionType | "fuse" = "fuse"): Protection | undefined {
  const series: [ProtectionType, number[]][] =
    prefer === "breaker" ? [["breaker", BREAKER_RATINGS_A]] : [["blade", BLADE_RATINGS_A], ["bolt-in", BOLT_IN_RATINGS_A]];
  for (const [type, ratings] of series) {
    const r = ratings.find((x) => x >= minA - 1e-9);
    if (r !== undefined) return { ratingA: r, type, placement: PLACEMENT_RULE };
  }
  return undefined;
}

/**
 * The device for a continuous current and a conductor: at least 125 % of the current, not above the conductor's
 * derated ampacity (the stricter automotive practice; the boat rule allows up to 150 % of the table value under 50 V).
 */
export function protectionFor(continuousA: number, deratedAmpacityA: number, prefer: ProtectionType | "fuse" = "fuse"): Protection | undefined {
  const p = pickRating(continuousA * PROTECTION_MARGIN, prefer);
  return p && p.ratingA <= deratedAmpacityA + 1e-9 ? p : undefined;
}

/** "25 A blade fuse", "100 A bolt-in high-current fuse", "50 A manual-reset breaker (...)"; older saved sizings without a family: "50 A breaker". */
export function describeProtection(p: { ratingA: number; type: ProtectionType; family?: DeviceFamilyId }): string {
  if (p.family) return describeDevice({ ratingA: p.ratingA, family: p.family });
  return `${p.ratingA} A ${p.type === "blade" ? "blade fuse" : p.type === "bolt-in" ? "bolt-in fuse" : "breaker"}`;
}
