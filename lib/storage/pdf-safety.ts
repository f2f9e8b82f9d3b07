import { inflateSync } from "node:zlib";

/** PDF names that make a reader run something: scripts and launching programs. */
const ACTIVE_NAMES = new Set(["JavaScript", "JS", "Launch"]);
/** Largest object stream inflated while looking (a real one is kilobytes; more is refused, not trusted). */
const MAX_INFLATED_BYTES = 32 * 1024 * 1024;

/** A PDF name with its #xx escapes decoded ("/J#61vaScript" is "/JavaScript"). */
function decodeName(raw: string): string {
  return raw.replace(/#([0-9A-Fa-f]{2})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
}

function activeNameIn(text: string): string | undefined {
  for (const m of text.matchAll(/\/([^\s/<>[\](){}%]+)/g)) {
    const name = decodeName(m[1]);
    if (ACTIVE_NAMES.has(name)) return name;
  }
  return undefined;
}

/**
 * Why a PDF would run something when opened (JavaScript, or a launch action), or undefined when it would not.
 * Dictionaries live in the file's text or inside object streams (compressed): both are read, names decoded.
 * An object stream that cannot be read is a reason too: what cannot be checked is not kept.
 */
export function pdfActiveContent(bytes: Buffer): string | undefined {
  const text = bytes.toString("latin1");
  const said = (name: string) => `it has a ${name === "Launch" ? "launch action" : "script"} (/${name})`;
  // The file's own text, without the bodies of its streams (compressed bytes can spell anything by chance).
  const outside: string[] = [];
  const streamRe = /stream\r?\n/g;
  let from = 0;
  let m: RegExpExecArray | null;
  while ((m = streamRe.exec(text))) {
    if (m.index > 0 && /[A-Za-z]/.test(text[m.index - 1])) continue; // "endstream", not a stream's start
    const end = text.indexOf("endstream", m.index + m[0].length);
    if (end < 0) break;
    outside.push(text.slice(from, m.index));
    const dictStart = text.lastIndexOf("obj", m.index);
    const dict = decodeName(text.slice(dictStart < 0 ? Math.max(0, m.index - 2000) : dictStart, m.index));
    if (/\/Type\s*\/ObjStm/.test(dict)) {
      const raw = bytes.subarray(m.index + m[0].length, end);
      const filters = [...dict.matchAll(/\/([A-Za-z0-9]+Decode)\b/g)].map((f) => f[1]);
      let inner: Buffer;
      if (filters.length === 0) inner = raw;
      else if (filters.length === 1 && filters[0] === "FlateDecode") {
        try {
          inner = inflateSync(raw, { maxOutputLength: MAX_INFLATED_BYTES, finishFlush: 2 /* Z_SYNC_FLUSH: a truncated end is read as far as it goes */ });
        } catch {
          return "it has a compressed part Ampwright cannot read to check";
        }
      } else return `it has a part compressed with ${filters.join(" + ")}, which Ampwright cannot check`;
      const found = activeNameIn(inner.toString("latin1"));
      if (found) return said(found);
    }
    from = end;
    streamRe.lastIndex = end + "endstream".length;
  }
  outside.push(text.slice(from));
  const direct = activeNameIn(outside.join("\n"));
  return direct ? said(direct) : undefined;
}
