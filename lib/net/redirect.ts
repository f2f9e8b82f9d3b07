const PROBE = "http://ampwright.invalid";

/**
 * Where to go after signing in, up or accepting an invitation: a path on this site, or the fallback. Anything that
 * a browser could read as another site ("//host", "/\host", a scheme, control characters that URL parsers drop)
 * is not a path here.
 */
export function safeLocalPath(next: unknown, fallback = "/jobs"): string {
  if (typeof next !== "string" || next.length === 0 || next.length > 2000) return fallback;
  if (!next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return fallback;
  if (/[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
  try {
    const url = new URL(next, PROBE);
    if (url.origin !== PROBE) return fallback;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return fallback;
  }
}
