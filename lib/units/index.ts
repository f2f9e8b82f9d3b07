import { create, all, type Unit } from "mathjs";

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
    .replace(/,/g, "")
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
  if (t === "") return { ok: false, message: `Enter a ${quantity}, for example ${example(quantity)}.` };
  try {
    const n = Number(t);
    const u: Unit = Number.isFinite(n) ? math.unit(n, normalise(defaultUnit)) : math.unit(t);
    const value = u.toNumber(SI[quantity]);
    if (!Number.isFinite(value)) throw new Error("not finite");
    return { ok: true, value };
  } catch {
    return { ok: false, message: `"${text}" is not a ${quantity}. Type a number and a unit, for example ${example(quantity)}.` };
  }
}

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
