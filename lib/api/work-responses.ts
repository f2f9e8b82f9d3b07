import "server-only";
import { badTextReason } from "@/lib/validators/text";
import { ApiError } from "./errors";

/** A strong entity tag of a circuit version, as RFC 9110 writes it: "7". */
export const etagOf = (version: number) => `"${version}"`;

/**
 * The version an If-Match header asks for. 428 when it is missing (a save must say which version it edits),
 * 400 when it is not one of our tags.
 */
export function expectedVersion(req: Request): number {
  const header = req.headers.get("if-match");
  if (!header) {
    throw new ApiError(428, "version-required", 'Send If-Match with the version you edited (the ETag of your last GET, like "3"), so nobody\'s changes are overwritten.');
  }
  const m = /^\s*"(\d{1,9})"\s*$/.exec(header);
  if (!m) throw new ApiError(400, "bad-if-match", `If-Match must be one version tag such as "3"; got ${header.slice(0, 40)}.`);
  return Number(m[1]);
}

/** Cursor of a list page: an opaque token holding the last row's sort value and id. */
export function encodeCursor(after: [string, string]): string {
  return Buffer.from(JSON.stringify(after)).toString("base64url");
}

/** A timestamp as PostgreSQL writes timestamptz as text (microseconds kept), or as ISO 8601. */
const TIMESTAMP_TEXT = /^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}:\d{2}(\.\d{1,6})?(Z|[+-]\d{2}(:?\d{2})?)$/;

/** A timestamp text whose date and time exist (PostgreSQL refuses 30 February; a query must never reach that). */
function realTimestamp(value: string): boolean {
  if (!TIMESTAMP_TEXT.test(value)) return false;
  const [y, mo, d, h, mi, s] = value.split(/[-T :.+Z]/).map(Number);
  const t = new Date(Date.UTC(y, mo - 1, d, h, mi, s));
  return y >= 1 && t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d && h < 24 && mi < 60 && s < 60;
}

/**
 * A cursor this list gave out, checked before any of it reaches the database: two strings, an id that looks like
 * one, and a sort value of the sort's own kind (a timestamp for date sorts). Anything else is 422.
 */
export function decodeCursor(cursor: string | undefined, kind: "timestamp" | "text" = "text"): [string, string] | undefined {
  if (!cursor) return undefined;
  try {
    const v = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8")) as unknown;
    if (Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === "string")) {
      const [value, id] = v as [string, string];
      const idOk = /^[A-Za-z0-9_.:-]{1,100}$/.test(id);
      const valueOk = kind === "timestamp" ? realTimestamp(value) : value.length <= 500 && badTextReason(value) === undefined;
      if (idOk && valueOk) return [value, id];
    }
  } catch {
    // fall through to the error below
  }
  throw new ApiError(422, "invalid-query", "The cursor is not one this list gave out; start again from the first page.", [{ path: "cursor", message: "unknown cursor" }]);
}
