/** Where a protective device must sit, its margin over the load, and its name in words (the families and their ratings are in devices.ts). */
import { describeDevice, type DeviceFamilyId } from "./devices";

export type ProtectionType = "blade" | "bolt-in" | "breaker";

/** Protective device at least 125 % of the continuous current (common practice). */
export const PROTECTION_MARGIN = 1.25;

export type Protection = { ratingA: number; type: ProtectionType; placement: string };

export const PLACEMENT_RULE =
  "At the source: within 7 in (18 cm) of the battery or other source along the conductor, or within 40 in (1 m) if the conductor is in a sheath or loom the whole way (33 CFR 183.455).";

/** "25 A blade fuse", "100 A bolt-in fuse", "50 A manual-reset breaker (...)"; older saved sizings without a family: "50 A breaker". */
export function describeProtection(p: { ratingA: number; type: ProtectionType; family?: DeviceFamilyId }): string {
  if (p.family) return describeDevice({ ratingA: p.ratingA, family: p.family });
  return `${p.ratingA} A ${p.type === "blade" ? "blade fuse" : p.type === "bolt-in" ? "bolt-in fuse" : "breaker"}`;
}
