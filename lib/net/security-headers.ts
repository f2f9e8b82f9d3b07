/**
 * The browser's rules for every page and answer: a Content Security Policy with a fresh nonce per page (Next.js puts
 * it on its own scripts), no framing by any site, no type sniffing, a strict referrer policy, and no camera,
 * microphone or location unless a page asks (the camera is allowed for this site only, for photos of readings).
 */

/** Origins of the object store, which the browser reaches directly: photo URLs and upload PUTs. */
function storageOrigin(): string {
  try {
    return new URL(process.env.S3_PUBLIC_ENDPOINT ?? process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569").origin;
  } catch {
    return "";
  }
}

/** The Content-Security-Policy of a page rendered with this nonce. */
export function pageCsp(nonce: string, dev = process.env.NODE_ENV === "development"): string {
  const store = storageOrigin();
  return [
    "default-src 'self'",
    // 'strict-dynamic': scripts Next.js loads from a nonced script may run; nothing else. React needs eval in development only.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    // Styles: the canvas and charts position elements with style attributes, which a nonce cannot cover.
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' data: blob: ${store}`.trim(),
    "font-src 'self' data:",
    `connect-src 'self' ${store}${dev ? " ws:" : ""}`.trim(),
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
  ].join("; ");
}

/**
 * The Content-Security-Policy of an API answer (JSON, CSV): nothing in it may run or load anything. Not on the
 * PDFs Ampwright makes, which the browser's own viewer must be free to show.
 */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'";

/** Headers every response carries, pages and API alike. */
export const COMMON_SECURITY_HEADERS: { key: string; value: string }[] = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];
