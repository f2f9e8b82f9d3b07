import { createHash, randomBytes } from "node:crypto";

/** A share token: 32 random bytes (256 bits) from the operating system's generator, base64url (43 characters). */
export function newShareToken(): string {
  return randomBytes(32).toString("base64url");
}

/** What is stored for a token: its SHA-256, hex. The token itself is shown once and never kept. */
export function hashShareToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** Whether a string could be a token at all (checked before any database work). */
export function looksLikeShareToken(s: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(s);
}
