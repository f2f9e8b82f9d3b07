import { z } from "zod";

/** A NUL character, or half of a UTF-16 surrogate pair with no other half: neither can be stored or shown. */
const BAD_CHARACTER = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be taken as text, in words, or undefined when it can. */
export function badTextReason(s: string): string | undefined {
  const m = BAD_CHARACTER.exec(s);
  if (!m) return undefined;
  return m[0] === "\u0000" ? "has a NUL character (code 0), which text cannot hold" : "has a broken character (half of a UTF-16 surrogate pair)";
}

/** The first string in a JSON value (keys included) that is not storable text, with its path. */
export function findBadText(value: unknown, path: string[] = []): { path: string; reason: string } | undefined {
  if (typeof value === "string") {
    const reason = badTextReason(value);
    return reason ? { path: path.join(".") || "(body)", reason } : undefined;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = findBadText(value[i], [...path, String(i)]);
      if (hit) return hit;
    }
    return undefined;
  }
  if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) {
      const keyReason = badTextReason(k);
      if (keyReason) return { path: [...path, k.replace(/[\u0000\uD800-\uDFFF]/g, "?")].join("."), reason: `name ${keyReason}` };
      const hit = findBadText(v, [...path, k]);
      if (hit) return hit;
    }
  }
  return undefined;
}

/**
 * The one text field: trimmed, at most `max` characters, no NUL and no broken characters. Every body, query and
 * path id goes through this (the route wrapper also refuses such characters anywhere in a request).
 */
export function plainText(what: string, max: number) {
  return z
    .string({ error: `${what} must be text` })
    .trim()
    .max(max, `${what} is at most ${max} characters`)
    .refine((s) => badTextReason(s) === undefined, { message: `${what} has a character that cannot be stored (NUL or a broken character)` });
}

/** An id in a path or a body: short, plain characters only. */
export const idText = (what = "id") =>
  z
    .string({ error: `${what} must be text` })
    .min(1, `${what} is missing`)
    .max(100, `${what} is at most 100 characters`)
    .regex(/^[A-Za-z0-9_.:-]+$/, `${what} has characters no id has`);

/** PostgreSQL's integer column: anything outside it is refused in words rather than failing in the database. */
export const PG_INT_MAX = 2_147_483_647;
