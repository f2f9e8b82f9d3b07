import { deratedAmpacity, ZONE_AMBIENT_C, TABLE5_BASIS_C, type Zone } from "./ampacity";
import type { MaterialId } from "./materials";
import { PLACEMENT_RULE, pickRating, PROTECTION_MARGIN, type Protection } from "./protection";
import { conductorTempC, resistancePerMetre, type ConductorTempChoice } from "./resistance";
import { findSize, sizeRank, sizesOf, type ConductorSize, type SizeFamily } from "./sizes";

export type Duty = { kind: "continuous" } | { kind: "intermittent"; onS: number; periodS: number };

export type SizingRequest = {
  systemVoltage: number;
  /** Peak current of the load, A (also its continuous current under continuous duty). */
  currentA: number;
  /** One-way length of the run, m. */
  lengthM: number;
  returnPath?: "two-wire" | "chassis";
  returnResistanceOhm?: number;
  circuitClass?: "critical" | "non-critical";
  maxDropPercent?: number;
  maxDropV?: number;
  ambientC?: number;
  zone?: Zone;
  insulationRatingC?: number;
  bundleSize?: number;
  material?: MaterialId;
  family?: SizeFamily;
  conductorTemp?: ConductorTempChoice;
  duty?: Duty;
  minSize?: string;
};

export type Governing = "drop" | "ampacity" | "protection" | "minimum-size";

export type Candidate = {
  size: string;
  resistanceOhm: number;
  dropV: number;
  dropPercent: number;
  lossW: number;
  tableAmpacityA: number;
  ambientFactor: number;
  bundleFactor: number;
  ampacityA: number;
  derived: boolean;
  ok: boolean;
  governing: Governing | null;
};

export type SizingAnswer = {
  status: "ok" | "no-size-fits";
  recommended: Candidate | null;
  candidates: Candidate[];
  protection: Protection | null;
  reason: string;
  closest: Candidate | null;
  notes: string[];
  /** The drop limit the candidates were judged against, V. */
  limitV: number;
  /** What the drop is made of, so it can be redrawn for other lengths (see dropAtLength). */
  basis: { currentA: number; lengthM: number; returnResistanceOhm: number };
};

/** Marine standard (ABYC E-11) drop limits: 3 % for critical circuits, 10 % for others. */
export const DROP_LIMIT_PERCENT = { critical: 3, "non-critical": 10 } as const;
/** Smallest size offered by default for mechanical strength (common practice). */
export const DEFAULT_MIN_SIZE = { awg: "18 AWG", metric: "0.5 mm2" } as const;
/** Duty-cycle equivalent current applies when the period is this short or shorter (common practice). */
export const DUTY_PERIOD_LIMIT_S = 600;

const round = (x: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
};

/**
 * The smallest size of the chosen family and material that meets every limit: voltage drop over the full current
 * path at the peak current, derated ampacity at the continuous (or duty-equivalent) current, a standard protective
 * rating between 125 % of that current and the derated ampacity, and a minimum mechanical size.
 */
export function sizeCable(req: SizingRequest): SizingAnswer {
  const family = req.family ?? "awg";
  const material = req.material ?? "copper";
  const rating = req.insulationRatingC ?? 105;
  const bundle = req.bundleSize ?? 1;
  const ambient = req.ambientC ?? (req.zone ? ZONE_AMBIENT_C[req.zone] : TABLE5_BASIS_C);
  const tempC = conductorTempC(req.conductorTemp ?? "ambient", ambient, rating);
  const returnPath = req.returnPath ?? "two-wire";
  const returnR = returnPath === "chassis" ? (req.returnResistanceOhm ?? 0) : 0;
  const circuitClass = req.circuitClass ?? "critical";
  const limitV =
    req.maxDropV ?? ((req.maxDropPercent ?? DROP_LIMIT_PERCENT[circuitClass]) / 100) * req.systemVoltage;
  const duty = req.duty ?? { kind: "continuous" };
  const notes: string[] = [];
  const basis = { currentA: req.currentA, lengthM: req.lengthM, returnResistanceOhm: returnR };

  let continuousA = req.currentA;
  if (duty.kind === "intermittent") {
    if (duty.periodS <= DUTY_PERIOD_LIMIT_S) {
      continuousA = req.currentA * Math.sqrt(Math.min(duty.onS, duty.periodS) / duty.periodS);
      notes.push(
        `Intermittent duty: heat is judged at the duty-cycle equivalent ${round(continuousA, 1)} A (${req.currentA} A x sqrt(${duty.onS} s / ${duty.periodS} s)), common practice for periods of ten minutes or less. Voltage drop still uses the peak ${req.currentA} A.`,
      );
      notes.push(
        `Choose a time-delay fuse or a breaker that carries ${req.currentA} A for ${duty.onS} s without opening; check its time-current curve.`,
      );
    } else {
      notes.push(`The duty period is over ${DUTY_PERIOD_LIMIT_S / 60} minutes, so the load is treated as continuous at ${req.currentA} A.`);
    }
  }

  const minSize = findSize(req.minSize ?? DEFAULT_MIN_SIZE[family]);
  const minRank = minSize && minSize.family === family ? sizeRank(minSize) : 0;
  const wanted = pickRating(continuousA * PROTECTION_MARGIN);

  const candidates: Candidate[] = sizesOf(family).map((size: ConductorSize, rank) => {
    const conductorR = resistancePerMetre(size, material, tempC) * req.lengthM * (returnPath === "two-wire" ? 2 : 1);
    const pathR = conductorR + returnR;
    const dropV = req.currentA * pathR;
    const amp = deratedAmpacity(size, rating, ambient, bundle);
    const ampacityA = amp?.ampacityA ?? 0;
    const fails: Governing[] = [];
    if (rank < minRank) fails.push("minimum-size");
    if (dropV > limitV + 1e-12) fails.push("drop");
    if (ampacityA + 1e-9 < continuousA) fails.push("ampacity");
    if (!wanted || wanted.ratingA > ampacityA + 1e-9) fails.push("protection");
    return {
      size: size.label,
      resistanceOhm: pathR,
      dropV,
      dropPercent: (100 * dropV) / req.systemVoltage,
      lossW: req.currentA * req.currentA * conductorR,
      tableAmpacityA: amp?.amps ?? 0,
      ambientFactor: amp?.ambientFactor ?? 0,
      bundleFactor: amp?.bundleFactor ?? 1,
      ampacityA,
      derived: amp?.derived ?? true,
      ok: fails.length === 0,
      governing: fails[0] ?? null,
    };
  });

  const idx = candidates.findIndex((c) => c.ok);
  if (rating < 60) notes.push("Insulation rated under 60 C is below the ampacity table; no size can be given an ampacity.");
  if (candidates.some((c) => c.derived)) notes.push("Sizes marked derived are not rows of 33 CFR 183.425 Table 5; their ampacity is interpolated log-log in circular mils.");
  notes.push(PLACEMENT_RULE);
  notes.push("The fuse protects the cable, not the load: no cable downstream of it may be smaller than the size it protects.");
  notes.push("The boat rule (33 CFR 183.455) allows a rating up to 150 % of the table ampacity under 50 V; Ampwright keeps to the stricter automotive practice of not exceeding the derated ampacity.");

  if (idx < 0) {
    // The closest is the largest size: the least drop and the most ampacity the family offers.
    const closest = candidates[candidates.length - 1];
    const failing = new Set(candidates.map((c) => c.governing));
    const parts: string[] = [];
    const last = candidates[candidates.length - 1];
    if (last.dropV > limitV) parts.push(`even ${last.size} drops ${round(last.dropV, 3)} V against a limit of ${round(limitV, 3)} V: shorten the run, run two cables in parallel, or move the load closer to the battery`);
    if (last.ampacityA < continuousA) parts.push(`even ${last.size} may carry only ${round(last.ampacityA, 1)} A here against ${round(continuousA, 1)} A: use a higher-rated insulation, route it cooler or out of the bundle, or split the load`);
    if (!wanted) parts.push(`no standard fuse reaches 125 % of ${round(continuousA, 1)} A`);
    else if (last.ampacityA < wanted.ratingA && failing.has("protection")) parts.push(`a ${wanted.ratingA} A device needs a cable that carries at least ${wanted.ratingA} A after derating`);
    return {
      status: "no-size-fits",
      limitV,
      basis,
      recommended: null,
      candidates,
      protection: null,
      reason: `No ${family === "awg" ? "AWG" : "metric"} size meets every limit: ${parts.join("; ") || "check the inputs"}.`,
      closest,
      notes,
    };
  }

  const chosen = { ...candidates[idx] };
  const below = idx > 0 ? candidates[idx - 1] : undefined;
  chosen.governing = below?.governing ?? (idx === minRank ? "minimum-size" : null);
  candidates[idx] = chosen;
  const protection = wanted ? { ...wanted, placement: PLACEMENT_RULE } : null;
  const why: Record<Governing, string> = {
    drop: `the voltage drop limit of ${round(limitV, 3)} V`,
    ampacity: `the derated ampacity needed for ${round(continuousA, 1)} A`,
    protection: `the ${protection?.ratingA} A protective device it must be rated for`,
    "minimum-size": "the minimum size for mechanical strength",
  };
  return {
    status: "ok",
    limitV,
    basis,
    recommended: chosen,
    candidates,
    protection,
    reason: chosen.governing
      ? `${chosen.size} is the smallest size that meets every limit; ${why[chosen.governing]} decided it.`
      : `${chosen.size} meets every limit.`,
    closest: null,
    notes,
  };
}

/**
 * The drop a candidate of an answer would give over another one-way length, everything else kept: the cable part
 * scales with the length, the chassis return does not.
 */
export function dropAtLength(answer: Pick<SizingAnswer, "basis">, candidate: Pick<Candidate, "resistanceOhm">, lengthM: number): number {
  const { currentA, lengthM: basisLength, returnResistanceOhm } = answer.basis;
  const cableOhm = candidate.resistanceOhm - returnResistanceOhm;
  return currentA * (returnResistanceOhm + (basisLength > 0 ? (cableOhm * lengthM) / basisLength : 0));
}

/** The longest one-way run a candidate may have before its drop reaches the answer's limit, m (Infinity if never). */
export function longestRun(answer: Pick<SizingAnswer, "basis" | "limitV">, candidate: Pick<Candidate, "resistanceOhm">): number {
  const { currentA, lengthM, returnResistanceOhm } = answer.basis;
  const spare = answer.limitV - currentA * returnResistanceOhm;
  if (spare <= 0) return 0;
  const perMetre = (candidate.resistanceOhm - returnResistanceOhm) / lengthM;
  return perMetre > 0 ? spare / (currentA * perMetre) : Infinity;
}

/** What a saved sizing keeps of its answer: enough for a job page and a report without recomputing. */
export type SizingSummary = {
  status: SizingAnswer["status"];
  size: string | null;
  protection: { ratingA: number; type: Protection["type"] } | null;
  reason: string;
  limitV: number;
  dropV: number | null;
  dropPercent: number | null;
  lossW: number | null;
  ampacityA: number | null;
};

export function summarizeSizing(a: SizingAnswer): SizingSummary {
  const r = a.recommended;
  return {
    status: a.status,
    size: r?.size ?? null,
    protection: a.protection ? { ratingA: a.protection.ratingA, type: a.protection.type } : null,
    reason: a.reason,
    limitV: a.limitV,
    dropV: r?.dropV ?? null,
    dropPercent: r?.dropPercent ?? null,
    lossW: r?.lossW ?? null,
    ampacityA: r?.ampacityA ?? null,
  };
}
