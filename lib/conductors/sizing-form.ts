import type { AmpacityBasis } from "./ampacity";
import { INSULATION_TYPES } from "./insulation";
import { MATERIAL_IDS, type MaterialId } from "./materials";
import { LOAD_EFFICIENCY, type SizingRequest } from "./sizing";
import { parseDecimal, parseQuantity } from "@/lib/units";

/**
 * The sizing page's fields as typed (with their units), the request they make, and the address that carries them:
 * shared by the page, a sizing saved to a job, and the demo.
 */
export type SizingInputs = {
  systemVoltage: string;
  /** The load: a peak current ("150 A") or a power ("1500 W"). */
  current: string;
  /** Of a load given in watts: "90 %" or "0.9". */
  efficiency: string;
  /** An optional start-up surge: "600 A for 0.5 s". */
  inrush: string;
  material: MaterialId;
  device: "fuse" | "breaker";
  basis: AmpacityBasis;
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

/**
 * What a new load is sized with when nothing else is said, on the sizing page and in "Add a load" alike, so one
 * request gives one answer in both.
 */
export const LOAD_DEFAULTS = {
  circuitClass: "critical",
  zone: "cabin",
  insulation: "TXL",
  family: "awg",
  material: "copper",
  device: "fuse",
  efficiency: `${Math.round(LOAD_EFFICIENCY * 100)} %`,
} as const;

export const SIZING_DEFAULTS: SizingInputs = {
  systemVoltage: "12",
  current: "20 A",
  efficiency: LOAD_DEFAULTS.efficiency,
  inrush: "",
  material: LOAD_DEFAULTS.material,
  device: LOAD_DEFAULTS.device,
  basis: "marine-table",
  length: "6 m",
  circuitClass: LOAD_DEFAULTS.circuitClass,
  zone: LOAD_DEFAULTS.zone,
  insulation: LOAD_DEFAULTS.insulation,
  bundle: "1",
  family: LOAD_DEFAULTS.family,
  returnPath: "two-wire",
  returnResistance: "",
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
  const load = parseLoad(i.current);
  if (!load.ok) errors.current = load.message;
  const efficiency = load.ok && load.powerW !== undefined ? parseEfficiency(i.efficiency) : undefined;
  if (efficiency && !efficiency.ok) errors.efficiency = efficiency.message;
  const lengthM = q("length", "length", "m");
  const ret = i.returnPath === "chassis" && i.returnResistance.trim() !== "" ? parseReturn(i.returnResistance) : undefined;
  if (ret && !ret.ok) errors.returnResistance = ret.message;
  const inrush = i.inrush.trim() !== "" ? parseInrush(i.inrush) : undefined;
  if (inrush && !inrush.ok) errors.inrush = inrush.message;
  const onS = i.duty === "intermittent" ? q("onTime", "time", "s") : 0;
  const periodS = i.duty === "intermittent" ? q("period", "time", "s") : 0;
  if (i.duty === "intermittent" && onS > periodS) errors.onTime = "the on time cannot be longer than the period";
  const bundle = Number(i.bundle);
  if (!Number.isInteger(bundle) || bundle < 1 || bundle > 200) errors.bundle = "a whole number of conductors, 1 or more";
  if (load.ok && load.currentA !== undefined && load.currentA > 5000) errors.current = "above 5000 A is outside the tables";
  if (lengthM > 1000) errors.length = "above 1000 m is not a vehicle cable run";
  if (Object.keys(errors).length) return { ok: false, errors };
  const rating = INSULATION_TYPES.find((t) => t.id === i.insulation)?.ratingC ?? 105;
  return {
    ok: true,
    request: {
      systemVoltage: Number(i.systemVoltage),
      ...(load.ok && load.powerW !== undefined ? { powerW: load.powerW, efficiency: efficiency?.ok ? efficiency.value : undefined } : { currentA: load.ok ? load.currentA : 0 }),
      ...(inrush?.ok ? { inrush: { currentA: inrush.currentA, durationS: inrush.durationS } } : {}),
      lengthM,
      circuitClass: i.circuitClass,
      zone: i.zone,
      insulationRatingC: rating,
      bundleSize: bundle,
      family: i.family,
      returnPath: i.returnPath,
      returnResistanceOhm: ret?.ok ? ret.ohm : undefined,
      material: i.material,
      device: i.device,
      ampacityBasis: i.basis,
      duty: i.duty === "intermittent" ? { kind: "intermittent", onS, periodS } : { kind: "continuous" },
    },
  };
}

type Parsed<T> = ({ ok: true } & T) | { ok: false; message: string };

/** A load as typed: a current ("150 A", a bare number in A) or a power ("1500 W", "1,5 kW"). */
export function parseLoad(text: string): Parsed<{ currentA?: number; powerW?: number }> {
  const asCurrent = parseQuantity(text, "current", "A");
  if (asCurrent.ok) return asCurrent.value > 0 ? { ok: true, currentA: asCurrent.value } : { ok: false, message: "must be more than 0" };
  const asPower = parseQuantity(text, "power", "W");
  if (asPower.ok) return asPower.value > 0 ? { ok: true, powerW: asPower.value } : { ok: false, message: "must be more than 0" };
  return { ok: false, message: /could be|groups digits/.test(asCurrent.message) ? asCurrent.message : "a current (150 A) or a power (1500 W)" };
}

/** "90 %", "90" or "0.9" (a fraction up to 1, or a percentage above 1). */
export function parseEfficiency(text: string): Parsed<{ value: number }> {
  const t = text.trim().replace(/%$/, "").trim();
  const n = parseDecimal(t);
  if (!n.ok) return { ok: false, message: n.message };
  const v = n.value > 1 || /%/.test(text) ? n.value / 100 : n.value;
  if (!(v > 0.2 && v <= 1)) return { ok: false, message: "an efficiency between 20 % and 100 %" };
  return { ok: true, value: v };
}

/** A chassis return as a resistance ("1.5 mOhm") or as a reading on the job ("0.12 V at 80 A"). */
export function parseReturn(text: string): Parsed<{ ohm: number }> {
  const m = /^(.+?)\s+at\s+(.+)$/i.exec(text.trim());
  if (m) {
    const v = parseQuantity(m[1], "voltage", "V");
    const a = parseQuantity(m[2], "current", "A");
    if (!v.ok) return { ok: false, message: v.message };
    if (!a.ok) return { ok: false, message: a.message };
    if (!(a.value > 0) || v.value < 0) return { ok: false, message: "a drop of 0 V or more at a current above 0 A" };
    return { ok: true, ohm: v.value / a.value };
  }
  const r = parseQuantity(text, "resistance", "ohm");
  if (!r.ok) return { ok: false, message: `${r.message} Or give a reading: 0.12 V at 80 A.` };
  if (r.value < 0) return { ok: false, message: "can't be negative" };
  return { ok: true, ohm: r.value };
}

/** "600 A for 0.5 s". */
export function parseInrush(text: string): Parsed<{ currentA: number; durationS: number }> {
  const m = /^(.+?)\s+for\s+(.+)$/i.exec(text.trim());
  if (!m) return { ok: false, message: "a current and how long, such as 600 A for 0.5 s" };
  const a = parseQuantity(m[1], "current", "A");
  const t = parseQuantity(m[2], "time", "s");
  if (!a.ok) return { ok: false, message: a.message };
  if (!t.ok) return { ok: false, message: t.message };
  if (!(a.value > 0 && t.value > 0)) return { ok: false, message: "a current and a time above 0" };
  if (t.value > 60) return { ok: false, message: "an inrush lasts at most 60 s; a longer one is the load's peak (set the duty)" };
  return { ok: true, currentA: a.value, durationS: t.value };
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
  material: MATERIAL_IDS,
  device: ["fuse", "breaker"],
  basis: ["marine-table", "heat-balance"],
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

