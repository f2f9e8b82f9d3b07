import { z } from "zod";

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string };

/**
 * A number as people type it: "1.5" and "1,5" (a decimal comma) are both one and a half; "-0,25", ",5" and "1e3"
 * are read too. A comma followed by exactly three digits ("1,500") could be either a decimal comma or a thousands
 * separator, so it is refused with the question rather than guessed; so are "1,500.5", "1.500,5" and "1 500".
 * Never scales silently.
 */
export function parseDecimal(raw: string): ParsedNumber {
  const text = raw.trim().replace(/\u2212/g, "-");
  if (text === "") return { ok: false, message: "Enter a number." };
  const grouped = /^[+-]?\d{1,3}([ ,.\u00a0\u202f]\d{3})+([.,]\d+)?$/.test(text) && /[ \u00a0\u202f]|,\d{3}\.|\.\d{3},|,\d{3},|\.\d{3}\./.test(text);
  if (grouped) return { ok: false, message: `"${raw.trim()}" groups digits; type the number plainly, such as 1500 or 1.5.` };
  const comma = /^([+-]?)(\d*),(\d+)$/.exec(text);
  if (comma) {
    const [, sign, whole, frac] = comma;
    if (frac.length === 3 && whole !== "" && !/^0+$/.test(whole)) {
      const asDecimal = Number(`${sign}${whole}.${frac}`);
      const asThousands = Number(`${sign}${whole}${frac}`);
      return { ok: false, message: `"${raw.trim()}" could be ${asDecimal} or ${asThousands}: type ${asDecimal} (or ${whole},${frac.replace(/0+$/, "") || "0"}) for the first, ${asThousands} for the second.` };
    }
    return { ok: true, value: Number(`${sign}${whole || "0"}.${frac}`) };
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return { ok: false, message: `"${raw.trim()}" is not a number.` };
  const value = Number(text);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${raw.trim()}" is too large a number.` };
}

/**
 * A zod number field that also takes typed text: "12,45" is 12.45, "" is no value, and text that is not a number
 * (or is ambiguous) is refused with parseDecimal's words. Forms hand over their raw strings; the API may send either.
 */
export function typedNumber<T extends z.ZodType>(schema: T) {
  return z.preprocess((v, ctx) => {
    if (typeof v !== "string") return v;
    if (v.trim() === "") return undefined;
    const r = parseDecimal(v);
    if (r.ok) return r.value;
    ctx.addIssue({ code: "custom", message: r.message });
    return z.NEVER;
  }, schema);
}
