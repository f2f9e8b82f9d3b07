/** A file name from a title: lower case, dashes, at most 60 characters. */
export function slugOf(title: string, fallback = "report"): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || fallback;
}

/**
 * A Content-Disposition value for any file name (RFC 6266): an ASCII fallback in `filename`, the real name
 * percent-encoded as UTF-8 in `filename*`, so names in any script open in every browser and the header stays ASCII.
 */
export function contentDisposition(fileName: string, inline = false): string {
  const clean = fileName.replace(/[\u0000-\u001f\u007f]/g, "").trim() || "file";
  const ascii = clean.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").replace(/[^\x20-\x7e]/g, "_").replace(/["\\%;]/g, "_");
  const encoded = encodeURIComponent(clean).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${inline ? "inline" : "attachment"}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/** Headers for a file to download (never cached by a shared cache, never sniffed as another type). */
export function downloadHeaders(contentType: string, fileName: string, inline = false): HeadersInit {
  return {
    "content-type": contentType,
    "content-disposition": contentDisposition(fileName, inline),
    "cache-control": "private, no-store",
    "x-content-type-options": "nosniff",
  };
}
