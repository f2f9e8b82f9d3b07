import { create, all } from "mathjs";
import { parseDecimal } from "./number";

export { parseDecimal, typedNumber, type ParsedNumber } from "./number";

/** One mathjs instance for the whole app, with the trade's units it lacks (circular mil, kcmil). */
export const math = create(all, {});
math.createUnit("cmil", { definition: `${(Math.PI / 4) * 25.4e-6 * 25.4e-6} m^2`, aliases: ["circmil", "circular_mil"] });
math.createUnit("kcmil", { definition: "1000 cmil", aliases: ["MCM"] });

export type Quantity = "length" | "current" | "voltage" | "resistance" | "temperature" | "time" | "power" | "area";

const SI: Record<Quantity, string> = {
  length: "m",
  current: "A",
  voltage: "V",
  resistance: "ohm",
  temperature: "degC",
  time: "s",
  power: "W",
  area: "m^2",
};

/** What people type, mapped to mathjs names: "C" and "°C" for degC, "mOhm", "Ω". */
function normalise(text: string): string {
  return text
    .trim()
    .replace(/Ω/g, "ohm")
    .replace(/\b(m|k|u|µ)?ohms?\b/gi, (_m, p: string | undefined) => `${p ? (p === "µ" ? "u" : p) : ""}ohm`)
    .replace(/°\s*([CF])\b/g, "deg$1")
    .replace(/(\d|\s)([CF])$/, "$1deg$2")
    .replace(/\bmm2\b/g, "mm^2")
    .replace(/\bmin\b/g, "minute")
    .replace(/\bfeet\b/g, "ft");
}

export type ParsedQuantity = { ok: true; value: number } | { ok: false; message: string };

/**
 * Reads a value typed in any unit of the quantity ("18 ft", "300 A", "5 mOhm", "45 C") and answers it in SI
 * (metres, amperes, volts, ohms, degrees Celsius, seconds, watts, square metres). A bare number is taken in
 * defaultUnit.
 */
export function parseQuantity(text: string, quantity: Quantity, defaultUnit = SI[quantity]): ParsedQuantity {
  const t = normalise(text);
  if (t === "") return { ok: false, message: `Enter a ${NAMES[quantity]}, for example ${example(quantity)}.` };
  if (quantity === "length") {
    const compound = compoundImperial(t);
    if (compound) return compound;
  }
  // The number is read by parseDecimal (a decimal comma is fine, "1,500" is asked about); the rest is the unit.
  const m = /^([+-]?[\d.,\u2212]*\d[\d.,]*(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(t);
  if (!m) return { ok: false, message: `"${text.trim()}" is not a ${NAMES[quantity]}. Type a number and a unit, for example ${example(quantity)}.` };
  const n = parseDecimal(m[1]);
  if (!n.ok) return { ok: false, message: n.message };
  try {
    const unit = m[2].trim() === "" ? normalise(defaultUnit) : m[2].trim();
    const value = math.unit(n.value, unit).toNumber(SI[quantity]);
    if (!Number.isFinite(value)) throw new Error("not finite");
    return { ok: true, value };
  } catch {
    return { ok: false, message: `"${text.trim()}" is not a ${NAMES[quantity]}. Type a number and a unit, for example ${example(quantity)}.` };
  }
}

/** "5 ft 6 in", "5' 6\"", "5ft6in": feet and inches together, in metres. */
function compoundImperial(t: string): ParsedQuantity | undefined {
  const m = /^([\d.,]+)\s*(?:ft|foot|feet|')\s*([\d.,]+)\s*(?:in|inch|inches|")$/i.exec(t);
  if (!m) return undefined;
  const ft = parseDecimal(m[1]);
  const inch = parseDecimal(m[2]);
  if (!ft.ok) return { ok: false, message: ft.message };
  if (!inch.ok) return { ok: false, message: inch.message };
  return { ok: true, value: toSI(ft.value, "length", "ft") + toSI(inch.value, "length", "inch") };
}

const NAMES: Record<Quantity, string> = {
  length: "length",
  current: "current",
  voltage: "voltage",
  resistance: "resistance",
  temperature: "temperature",
  time: "time",
  power: "power",
  area: "cross-section",
};

/** Converts an SI value to another unit of the same quantity. */
export function fromSI(value: number, quantity: Quantity, unit: string): number {
  return math.unit(value, SI[quantity]).toNumber(normalise(unit));
}

/** Converts a value in a unit to SI. */
export function toSI(value: number, quantity: Quantity, unit: string): number {
  return math.unit(value, normalise(unit)).toNumber(SI[quantity]);
}

function example(q: Quantity): string {
  return { length: '"5.5 m" or "18 ft"', current: '"120 A"', voltage: '"12.6 V"', resistance: '"5 mOhm"', temperature: '"45 C" or "110 F"', time: '"10 min" or "30 s"', power: '"1500 W"', area: '"35 mm2" or "66360 cmil"' }[q];
}
