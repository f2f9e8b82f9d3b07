/** A file name from a title: lower case, dashes, at most 60 characters. */
export function slugOf(title: string, fallback = "report"): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || fallback;
}

/** Headers for a file to download (never cached by a shared cache). */
export function downloadHeaders(contentType: string, fileName: string, inline = false): HeadersInit {
  return {
    "content-type": contentType,
    "content-disposition": `${inline ? "inline" : "attachment"}; filename="${fileName}"`,
    "cache-control": "private, no-store",
  };
}
