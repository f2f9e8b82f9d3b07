import { INSULATION_TYPES } from "./insulation";
import type { SizingRequest } from "./sizing";
import { parseQuantity } from "@/lib/units";

/**
 * The sizing page's fields as typed (with their units), the request they make, and the address that carries them:
 * shared by the page, a sizing saved to a job, and the demo.
 */
export type SizingInputs = {
  systemVoltage: string;
  current: string;
  length: string;
  circuitClass: "critical" | "non-critical";
  zone: "cabin" | "engine" | "underbody";
  insulation: string;
  bundle: string;
  family: "awg" | "metric";
  returnPath: "two-wire" | "chassis";
  returnResistance: string;
  duty: "continuous" | "intermittent";
  onTime: string;
  period: string;
};

export const SIZING_DEFAULTS: SizingInputs = {
  systemVoltage: "12",
  current: "20 A",
  length: "6 m",
  circuitClass: "critical",
  zone: "cabin",
  insulation: "TXL",
  bundle: "1",
  family: "awg",
  returnPath: "two-wire",
  returnResistance: "5 mOhm",
  duty: "continuous",
  onTime: "1 min",
  period: "10 min",
};

export type ParsedSizingInputs = { ok: true; request: SizingRequest } | { ok: false; errors: Partial<Record<keyof SizingInputs, string>> };

/** Reads the typed values with their units into a sizing request, or says what to fix field by field. */
export function parseSizingInputs(i: SizingInputs): ParsedSizingInputs {
  const errors: Partial<Record<keyof SizingInputs, string>> = {};
  const q = (key: keyof SizingInputs, kind: Parameters<typeof parseQuantity>[1], unit?: string) => {
    const r = parseQuantity(i[key], kind, unit);
    if (!r.ok) errors[key] = r.message;
    else if (!(r.value > 0)) errors[key] = "must be more than 0";
    return r.ok ? r.value : 0;
  };
  const currentA = q("current", "current", "A");
  const lengthM = q("length", "length", "m");
  const returnR = i.returnPath === "chassis" ? q("returnResistance", "resistance", "ohm") : 0;
  const onS = i.duty === "intermittent" ? q("onTime", "time", "s") : 0;
  const periodS = i.duty === "intermittent" ? q("period", "time", "s") : 0;
  if (i.duty === "intermittent" && onS > periodS) errors.onTime = "the on time cannot be longer than the period";
  const bundle = Number(i.bundle);
  if (!Number.isInteger(bundle) || bundle < 1 || bundle > 200) errors.bundle = "a whole number of conductors, 1 or more";
  if (currentA > 5000) errors.current = "above 5000 A is outside the tables";
  if (lengthM > 1000) errors.length = "above 1000 m is not a vehicle cable run";
  if (Object.keys(errors).length) return { ok: false, errors };
  const rating = INSULATION_TYPES.find((t) => t.id === i.insulation)?.ratingC ?? 105;
  return {
    ok: true,
    request: {
      systemVoltage: Number(i.systemVoltage),
      currentA,
      lengthM,
      circuitClass: i.circuitClass,
      zone: i.zone,
      insulationRatingC: rating,
      bundleSize: bundle,
      family: i.family,
      returnPath: i.returnPath,
      returnResistanceOhm: i.returnPath === "chassis" ? returnR : undefined,
      duty: i.duty === "intermittent" ? { kind: "intermittent", onS, periodS } : { kind: "continuous" },
    },
  };
}

/** The choices a URL may set; anything else in it is ignored. Text fields take any short text (parse judges it). */
const CHOICES: Partial<Record<keyof SizingInputs, readonly string[]>> = {
  systemVoltage: ["12", "24"],
  circuitClass: ["critical", "non-critical"],
  zone: ["cabin", "engine", "underbody"],
  insulation: INSULATION_TYPES.map((t) => t.id),
  family: ["awg", "metric"],
  returnPath: ["two-wire", "chassis"],
  duty: ["continuous", "intermittent"],
};

/** The inputs a shared or bookmarked address carries, over the defaults. */
export function inputsFromQuery(search: string): SizingInputs {
  const q = new URLSearchParams(search);
  const next = { ...SIZING_DEFAULTS };
  for (const key of Object.keys(SIZING_DEFAULTS) as (keyof SizingInputs)[]) {
    const value = q.get(key);
    if (value === null || value.length > 40) continue;
    const allowed = CHOICES[key];
    if (allowed && !allowed.includes(value)) continue;
    (next as Record<string, string>)[key] = value;
  }
  return next;
}

/** Only what differs from the defaults goes into the address, so a shared link stays short. */
export function queryFromInputs(v: SizingInputs): string {
  const q = new URLSearchParams();
  for (const key of Object.keys(SIZING_DEFAULTS) as (keyof SizingInputs)[]) if (v[key] !== SIZING_DEFAULTS[key]) q.set(key, v[key]);
  const s = q.toString();
  return s ? `?${s}` : "";
}

