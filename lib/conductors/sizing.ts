import { deratedAmpacity, ZONE_AMBIENT_C, TABLE5_BASIS_C, type AmpacityBasis, type Zone } from "./ampacity";
import { bandAt, describeDevice, familiesFor, letThroughI2t, withstandI2t, type DeviceFamilyId, type DevicePreference } from "./devices";
import { MATERIALS, type MaterialId } from "./materials";
import { PLACEMENT_RULE, PROTECTION_MARGIN, type Protection } from "./protection";
import { conductorTempC, resistancePerMetre, type ConductorTempChoice } from "./resistance";
import { findSize, sizeRank, sizesOf, type ConductorSize, type SizeFamily } from "./sizes";

export type Duty = { kind: "continuous" } | { kind: "intermittent"; onS: number; periodS: number };

export type SizingRequest = {
  systemVoltage: number;
  /** Peak current of the load, A (also its continuous current under continuous duty). Or give powerW. */
  currentA?: number;
  /** The load's power, W, instead of its current: the current is powerW / (efficiency x systemVoltage). */
  powerW?: number;
  /** Of a load given in watts (an inverter's output against its input); default LOAD_EFFICIENCY. */
  efficiency?: number;
  /** A start-up surge the device must also carry: a motor's or a lamp's inrush. */
  inrush?: { currentA: number; durationS: number };
  /** One-way length of the run, m. */
  lengthM: number;
  returnPath?: "two-wire" | "chassis";
  /** The chassis or frame return with its joints, ohm (measured on the job, or CHASSIS_RETURN_DEFAULT_OHM). */
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
  /** The conductor temperature the drop is worked at: its estimated operating temperature by default. */
  conductorTemp?: ConductorTempChoice | "operating";
  duty?: Duty;
  minSize?: string;
  /** Which protective devices to choose from: fuses (default), breakers, or one family. */
  device?: DevicePreference;
  /** The source's own resistance for the prospective fault current, ohm (default: SOURCE_RESISTANCE_OHM_PER_12V per 12 V). */
  sourceResistanceOhm?: number;
  /** Where ampacity comes from: the marine table (default) or a heat balance of the cable in still air. */
  ampacityBasis?: AmpacityBasis;
};

export type Governing = "drop" | "ampacity" | "protection" | "minimum-size";

export type Candidate = {
  size: string;
  resistanceOhm: number;
  dropV: number;
  dropPercent: number;
  lossW: number;
  /** The conductor temperature its drop was worked at, degrees C. */
  conductorTempC: number;
  tableAmpacityA: number;
  ambientFactor: number;
  bundleFactor: number;
  materialFactor: number;
  ampacityA: number;
  derived: boolean;
  ok: boolean;
  governing: Governing | null;
};

/** A protective device chosen against the load's duty and the cable, with the three checks that chose it. */
export type ProtectionChoice = Protection & {
  family: DeviceFamilyId;
  name: string;
  source: string;
  caution?: string;
  checks: {
    /** The peak (and inrush) it must carry, and the shortest time it may open at that current. */
    peak: { currentA: number; forS: number; opensNoSoonerThanS: number };
    inrush: { currentA: number; forS: number; opensNoSoonerThanS: number } | null;
    /** Its rating against the cable's derated ampacity. */
    ratingA: number;
    ampacityA: number;
    /** Prospective fault currents (at the far end and at the device) and the worst let-through against the cable's withstand. */
    fault: { minA: number; maxA: number; letThroughI2t: number; atA: number; withstandI2t: number; k: number };
  };
};

export type SizingAnswer = {
  status: "ok" | "no-size-fits";
  recommended: Candidate | null;
  candidates: Candidate[];
  protection: ProtectionChoice | null;
  reason: string;
  closest: Candidate | null;
  notes: string[];
  /** The drop limit the candidates were judged against, V. */
  limitV: number;
  /** What the drop is made of, so it can be redrawn for other lengths (see dropAtLength). */
  basis: { currentA: number; lengthM: number; returnResistanceOhm: number };
  /** The load current the answer is for (from powerW when a power was given), A, and the continuous current heat is judged at. */
  load: { currentA: number; continuousA: number; fromPowerW: number | null; efficiency: number | null };
  /** Where the ampacity figures come from. */
  ampacityBasis: string;
  /** Which temperature the drop was worked at, in words. */
  temperatureBasis: string;
};

/** Marine standard (ABYC E-11) drop limits: 3 % for critical circuits, 10 % for others. */
export const DROP_LIMIT_PERCENT = { critical: 3, "non-critical": 10 } as const;
/** Smallest size offered by default for mechanical strength (common practice). */
export const DEFAULT_MIN_SIZE = { awg: "18 AWG", metric: "0.5 mm2" } as const;
/** Duty-cycle equivalent current applies when the period is this short or shorter (common practice). */
export const DUTY_PERIOD_LIMIT_S = 600;
/** Efficiency of a load given in watts when none is given: an inverter's, about 90 % (common practice, no source). */
export const LOAD_EFFICIENCY = 0.9;
/**
 * A chassis or frame return when none is measured: about 1 mOhm for a sound bolted frame path with its joints on a
 * light vehicle (common practice, no source). Measure it: a drop reading at a known current gives the real figure.
 */
export const CHASSIS_RETURN_DEFAULT_OHM = 0.001;
/**
 * The source behind a fault, per 12 V of system voltage: about 5 mOhm, a 12 V starting battery of 600 to 1000 CCA
 * with its posts (common practice, no source). It sets the prospective fault current the cable must survive.
 */
export const SOURCE_RESISTANCE_OHM_PER_12V = 0.005;
export const AMPACITY_BASES: Record<AmpacityBasis, string> = {
  "marine-table": "33 CFR 183.425 Table 5 (the marine standard ABYC E-11's figures), corrected for ambient (NFPA 70 310.15(B)(1), no credit below 30 C), bundling (USCG guideline) and material (equal heating)",
  "heat-balance":
    "a heat balance of the cable alone in still air at its insulation's temperature class (ISO 6722-1 / SAE J1128 ratings): natural convection and radiation from heat-transfer handbooks and a thin automotive wall (representative parameters, from memory), then bundling (USCG guideline)",
};

const round = (x: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
};

/**
 * A conductor's steady temperature carrying a current: its rise above ambient grows with the square of the current,
 * reaching the insulation's rating at the derated ampacity (the basis of the ampacity tables; NFPA 70 310.15(B)'s
 * formula rests on it). Clamped to the rating.
 */
export function operatingTempC(ambientC: number, ratingC: number, currentA: number, ampacityA: number): number {
  if (!(ampacityA > 0)) return ratingC;
  const rise = (ratingC - ambientC) * (currentA / ampacityA) ** 2;
  return Math.min(ratingC, ambientC + Math.max(0, rise));
}

type DeviceCheck = { choice: ProtectionChoice } | { failure: string };

/**
 * The smallest device that carries the load's peak (and inrush) for its on-time without opening, is rated at least
 * 125 % of the continuous current and no more than the cable's derated ampacity, and lets through less energy than
 * the cable withstands at any prospective fault current along the run.
 */
function chooseDevice(p: {
  prefer: DevicePreference;
  continuousA: number;
  peakA: number;
  onS: number;
  inrush?: { currentA: number; durationS: number };
  ampacityA: number;
  faultMinA: number;
  faultMaxA: number;
  withstand: { i2t: number; k: number };
}): DeviceCheck {
  const reasons = new Set<string>();
  for (const family of familiesFor(p.prefer)) {
    for (const ratingA of family.ratingsA) {
      if (ratingA < p.continuousA * PROTECTION_MARGIN - 1e-9) continue;
      if (ratingA > p.ampacityA + 1e-9) {
        reasons.add("ampacity");
        break;
      }
      const peakOpen = bandAt(family, p.peakA / ratingA).minS;
      // At the limit passes: a device that may open no sooner than the on-time carries the peak for it.
      if (peakOpen < p.onS * (1 - 1e-9)) {
        reasons.add("peak");
        continue;
      }
      const inrushOpen = p.inrush ? bandAt(family, p.inrush.currentA / ratingA).minS : Infinity;
      if (p.inrush && inrushOpen < p.inrush.durationS * (1 - 1e-9)) {
        reasons.add("inrush");
        continue;
      }
      // The worst let-through over the fault currents the run can see: at both ends and at each band point between.
      const probes = [p.faultMinA, p.faultMaxA, ...family.curve.map((c) => c.multiple * ratingA).filter((a) => a > p.faultMinA && a < p.faultMaxA)];
      let worst = 0;
      let atA = p.faultMinA;
      for (const a of probes) {
        const e = letThroughI2t(family, ratingA, a);
        if (e > worst) {
          worst = e;
          atA = a;
        }
      }
      if (!(worst < p.withstand.i2t)) {
        reasons.add(Number.isFinite(worst) ? "withstand" : "no-clear");
        continue;
      }
      return {
        choice: {
          ratingA,
          type: family.id === "blade" ? "blade" : family.id === "bolt-in" ? "bolt-in" : "breaker",
          placement: PLACEMENT_RULE,
          family: family.id,
          name: describeDevice({ ratingA, family: family.id }),
          source: family.source,
          ...(family.caution ? { caution: family.caution } : {}),
          checks: {
            peak: { currentA: p.peakA, forS: p.onS, opensNoSoonerThanS: peakOpen },
            inrush: p.inrush ? { currentA: p.inrush.currentA, forS: p.inrush.durationS, opensNoSoonerThanS: inrushOpen } : null,
            ratingA,
            ampacityA: p.ampacityA,
            fault: { minA: p.faultMinA, maxA: p.faultMaxA, letThroughI2t: worst, atA, withstandI2t: p.withstand.i2t, k: p.withstand.k },
          },
        },
      };
    }
  }
  const words: Record<string, string> = {
    ampacity: "a device that carries the load is rated above what the cable may carry",
    peak: `every device small enough for the cable would open at ${round(p.peakA, 0)} A within the ${round(p.onS, 0)} s on-time`,
    inrush: `every device small enough for the cable would open during the ${round(p.inrush?.currentA ?? 0, 0)} A inrush`,
    withstand: "the cable could not survive what the device lets through before it clears a short circuit",
    "no-clear": `the fault current at the far end (${round(p.faultMinA, 0)} A) is too small for the device to clear with certainty`,
  };
  return { failure: [...reasons].map((r) => words[r]).join("; ") || "no device of the family reaches 125 % of the current" };
}

/**
 * The smallest size of the chosen family and material that meets every limit: voltage drop over the full current
 * path at the peak current (at the conductor's operating temperature by default), derated ampacity at the continuous
 * (or duty-equivalent) current, and a protective device that carries the real duty, protects the cable's ampacity
 * and lets through less than the cable withstands; and a minimum mechanical size.
 */
export function sizeCable(req: SizingRequest): SizingAnswer {
  const family = req.family ?? "awg";
  const material = req.material ?? "copper";
  const rating = req.insulationRatingC ?? 105;
  const bundle = req.bundleSize ?? 1;
  const ambient = req.ambientC ?? (req.zone ? ZONE_AMBIENT_C[req.zone] : TABLE5_BASIS_C);
  const tempChoice = req.conductorTemp ?? "operating";
  const returnPath = req.returnPath ?? "two-wire";
  const returnR = returnPath === "chassis" ? (req.returnResistanceOhm ?? CHASSIS_RETURN_DEFAULT_OHM) : 0;
  const circuitClass = req.circuitClass ?? "critical";
  const limitV = req.maxDropV ?? ((req.maxDropPercent ?? DROP_LIMIT_PERCENT[circuitClass]) / 100) * req.systemVoltage;
  const duty = req.duty ?? { kind: "continuous" };
  const notes: string[] = [];
  const efficiency = req.powerW !== undefined ? (req.efficiency ?? LOAD_EFFICIENCY) : null;
  const loadA = req.powerW !== undefined ? req.powerW / ((efficiency ?? 1) * req.systemVoltage) : (req.currentA ?? 0);
  if (req.powerW !== undefined) {
    notes.push(
      `${round(req.powerW, 0)} W at ${Math.round((efficiency ?? 1) * 100)} % efficiency from ${req.systemVoltage} V draws ${round(loadA, 1)} A${req.efficiency === undefined ? " (90 % is common practice for an inverter; give 100 % for lamps and heaters)" : ""}. It draws more when the voltage sags.`,
    );
  }
  const basis = { currentA: loadA, lengthM: req.lengthM, returnResistanceOhm: returnR };
  const sourceR = req.sourceResistanceOhm ?? SOURCE_RESISTANCE_OHM_PER_12V * Math.max(1, req.systemVoltage / 12);
  const basisId: AmpacityBasis = req.ampacityBasis ?? "marine-table";
  const materialFactor = basisId === "marine-table" ? MATERIALS[material].ampacityFactor : 1;

  let continuousA = loadA;
  let onS = 0;
  if (duty.kind === "intermittent") {
    if (duty.periodS <= DUTY_PERIOD_LIMIT_S) {
      continuousA = loadA * Math.sqrt(Math.min(duty.onS, duty.periodS) / duty.periodS);
      onS = Math.min(duty.onS, duty.periodS);
      notes.push(
        `Intermittent duty: heat is judged at the duty-cycle equivalent ${round(continuousA, 1)} A (${round(loadA, 1)} A x sqrt(${duty.onS} s / ${duty.periodS} s)), common practice for periods of ten minutes or less. Voltage drop uses the peak ${round(loadA, 1)} A, and the device must carry that peak for the whole ${duty.onS} s on-time without opening.`,
      );
    } else {
      notes.push(`The duty period is over ${DUTY_PERIOD_LIMIT_S / 60} minutes, so the load is treated as continuous at ${round(loadA, 1)} A.`);
    }
  }

  const minSize = findSize(req.minSize ?? DEFAULT_MIN_SIZE[family]);
  const minRank = minSize && minSize.family === family ? sizeRank(minSize) : 0;

  const devices: (DeviceCheck | null)[] = [];
  const candidates: Candidate[] = sizesOf(family).map((size: ConductorSize, rank) => {
    const amp = deratedAmpacity(size, rating, ambient, bundle, material, basisId);
    const ampacityA = amp?.ampacityA ?? 0;
    const tempC = tempChoice === "operating" ? operatingTempC(ambient, rating, continuousA, ampacityA) : conductorTempC(tempChoice, ambient, rating);
    const perMetre = resistancePerMetre(size, material, tempC);
    const conductorR = perMetre * req.lengthM * (returnPath === "two-wire" ? 2 : 1);
    const pathR = conductorR + returnR;
    const dropV = loadA * pathR;
    const fails: Governing[] = [];
    if (rank < minRank) fails.push("minimum-size");
    if (dropV > limitV + 1e-12) fails.push("drop");
    if (ampacityA + 1e-9 < continuousA) fails.push("ampacity");
    // A short at the far end meets the whole run (cold: the least resistance a fault sees is at ambient).
    const coldR = resistancePerMetre(size, material, ambient) * req.lengthM * (returnPath === "two-wire" ? 2 : 1) + returnR;
    const device = chooseDevice({
      prefer: req.device ?? "fuse",
      continuousA,
      peakA: loadA,
      onS,
      inrush: req.inrush,
      ampacityA,
      faultMinA: req.systemVoltage / (sourceR + coldR),
      faultMaxA: req.systemVoltage / sourceR,
      withstand: withstandI2t(size.areaM2 * 1e6, material, rating),
    });
    devices.push(device);
    if ("failure" in device) fails.push("protection");
    return {
      size: size.label,
      resistanceOhm: pathR,
      dropV,
      dropPercent: (100 * dropV) / req.systemVoltage,
      lossW: loadA * loadA * conductorR,
      conductorTempC: tempC,
      tableAmpacityA: amp?.amps ?? 0,
      ambientFactor: amp?.ambientFactor ?? 0,
      bundleFactor: amp?.bundleFactor ?? 1,
      materialFactor,
      ampacityA,
      derived: amp?.derived ?? true,
      ok: fails.length === 0,
      governing: fails[0] ?? null,
    };
  });

  const idx = candidates.findIndex((c) => c.ok);
  const temperatureBasis =
    tempChoice === "operating"
      ? `Drop is worked at each size's estimated operating temperature: ambient ${round(ambient, 0)} C plus a rise that grows with the square of the current, reaching the insulation's ${rating} C at its derated ampacity.`
      : tempChoice === "rated"
        ? `Drop is worked at the insulation's rating, ${rating} C (the conservative choice).`
        : tempChoice === "ambient"
          ? `Drop is worked at the ambient, ${round(ambient, 0)} C (no heating by the current).`
          : `Drop is worked at ${round(tempChoice, 1)} C, as asked.`;
  notes.push(temperatureBasis);
  if (rating < 60) notes.push("Insulation rated under 60 C is below the ampacity table; no size can be given an ampacity.");
  if (basisId === "heat-balance") notes.push(`Ampacity from ${AMPACITY_BASES["heat-balance"]}.`);
  if (candidates.some((c) => c.derived)) notes.push("Sizes marked derived are not rows of 33 CFR 183.425 Table 5; their ampacity is interpolated log-log in circular mils.");
  if (ambient < TABLE5_BASIS_C && basisId === "marine-table") notes.push(`No ampacity credit is taken for the cold: ${round(ambient, 0)} C is below the table's 30 C basis, and the table prints no factor above 1.`);
  if (material !== "copper" && material !== "tinned-copper") {
    notes.push(
      `${MATERIALS[material].name}: ${basisId === "marine-table" ? `ampacity is copper's x ${round(materialFactor, 3)} (equal heating: the square root of copper's resistivity over its own)` : "the heat balance uses its own resistivity"}. Use terminals and lugs rated for aluminium, with oxide-inhibiting compound, torqued to the maker's figure: an aluminium joint that loosens runs hot.`,
    );
  }
  if (returnPath === "chassis" && req.returnResistanceOhm === undefined) {
    notes.push(`The chassis return is taken as ${CHASSIS_RETURN_DEFAULT_OHM * 1000} mOhm with its joints (common practice, no source). Measure it: the drop from the load's ground to the battery negative at a known current, divided by that current.`);
  }
  notes.push(PLACEMENT_RULE);
  notes.push("The fuse protects the cable, not the load: no cable downstream of it may be smaller than the size it protects.");
  notes.push("Device curves are representative of their family; check the chosen part against its maker's published time-current curve.");

  const returnDrop = loadA * returnR;
  if (idx < 0) {
    // The closest is the largest size: the least drop and the most ampacity the family offers.
    const closest = candidates[candidates.length - 1];
    const lastDevice = devices[devices.length - 1];
    const parts: string[] = [];
    const last = candidates[candidates.length - 1];
    if (returnPath === "chassis" && returnDrop > limitV) {
      parts.push(
        `the chassis return alone drops ${round(returnDrop, 3)} V at ${round(loadA, 1)} A (${round(returnR * 1000, 2)} mOhm), over the ${round(limitV, 3)} V limit, so no cable size can fix it: run a dedicated ground cable (two-wire), or clean and tighten the return's joints and measure it again`,
      );
    } else if (last.dropV > limitV) {
      parts.push(`even ${last.size} drops ${round(last.dropV, 3)} V against a limit of ${round(limitV, 3)} V: shorten the run, run two cables in parallel, or move the load closer to the battery`);
    }
    if (last.ampacityA < continuousA) parts.push(`even ${last.size} may carry only ${round(last.ampacityA, 1)} A here against ${round(continuousA, 1)} A: use a higher-rated insulation, route it cooler or out of the bundle, or split the load`);
    if (lastDevice && "failure" in lastDevice && last.ampacityA >= continuousA) {
      parts.push(`no protective device fits even ${last.size}: ${lastDevice.failure}. Try a larger cable, a breaker (slower to trip on a short peak), or a shorter on-time`);
    }
    return {
      status: "no-size-fits",
      limitV,
      basis,
      load: { currentA: loadA, continuousA, fromPowerW: req.powerW ?? null, efficiency },
      ampacityBasis: AMPACITY_BASES[basisId],
      temperatureBasis,
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
  const protection = (devices[idx] as { choice: ProtectionChoice }).choice;
  if (protection.caution) notes.push(protection.caution);
  const why: Record<Governing, string> = {
    drop: `the voltage drop limit of ${round(limitV, 3)} V`,
    ampacity: `the derated ampacity needed for ${round(continuousA, 1)} A`,
    protection: `the protective device (${protection.name}) it must be rated for`,
    "minimum-size": "the minimum size for mechanical strength",
  };
  return {
    status: "ok",
    limitV,
    basis,
    load: { currentA: loadA, continuousA, fromPowerW: req.powerW ?? null, efficiency },
    ampacityBasis: AMPACITY_BASES[basisId],
    temperatureBasis,
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
  protection: { ratingA: number; type: Protection["type"]; family?: DeviceFamilyId } | null;
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
    protection: a.protection ? { ratingA: a.protection.ratingA, type: a.protection.type, family: a.protection.family } : null,
    reason: a.reason,
    limitV: a.limitV,
    dropV: r?.dropV ?? null,
    dropPercent: r?.dropPercent ?? null,
    lossW: r?.lossW ?? null,
    ampacityA: r?.ampacityA ?? null,
  };
}
