import { deflateSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { pdfActiveContent } from "@/lib/storage/pdf-safety";

// PDF 32000-1:2008 (ISO), 7.3.5 (names and #xx escapes), 7.5.7 (object streams), 12.6.4.16 (JavaScript actions),
// 12.6.4.5 (launch actions): the structures these cases are written from.
const obj = (n: number, dict: string, stream?: Buffer) =>
  stream
    ? Buffer.concat([Buffer.from(`${n} 0 obj\n<< ${dict} /Length ${stream.length} >>\nstream\n`, "latin1"), stream, Buffer.from("\nendstream\nendobj\n", "latin1")])
    : Buffer.from(`${n} 0 obj\n<< ${dict} >>\nendobj\n`, "latin1");
const pdf = (...parts: Buffer[]) => Buffer.concat([Buffer.from("%PDF-1.7\n", "latin1"), ...parts, Buffer.from("trailer\n<< /Root 1 0 R >>\n%%EOF\n", "latin1")]);

describe("PDFs that would run something when opened", () => {
  it("finds a script hidden in a compressed object stream", () => {
    const inner = Buffer.from("3 0 << /S /JavaScript /JS (app.launchURL('x')) >>", "latin1");
    const doc = pdf(obj(1, "/Type /Catalog /OpenAction 3 0 R"), obj(2, "/Type /ObjStm /N 1 /First 4 /Filter /FlateDecode", deflateSync(inner)));
    expect(pdfActiveContent(doc)).toMatch(/script/);
  });

  it("refuses an object stream it cannot decode rather than trusting it", () => {
    const doc = pdf(obj(1, "/Type /Catalog"), obj(2, "/Type /ObjStm /N 1 /First 4 /Filter /LZWDecode", Buffer.from("whatever")));
    expect(pdfActiveContent(doc)).toMatch(/LZWDecode/);
  });

  it("passes a plain document, and is not fooled by bytes inside an image stream that spell /JS", () => {
    const image = Buffer.from("\x00\x10/JS /Launch /JavaScript\xff\xd8", "latin1");
    const doc = pdf(obj(1, "/Type /Catalog /Pages 2 0 R"), obj(2, "/Type /XObject /Subtype /Image /Width 1 /Height 1", image));
    expect(pdfActiveContent(doc)).toBeUndefined();
  });
});
