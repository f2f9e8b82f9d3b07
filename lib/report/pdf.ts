import "server-only";
import path from "node:path";
import PDFDocument from "pdfkit";
import type { Drawing } from "./drawing";
import type { JobReport } from "./job-report";

// Public Sans (SIL Open Font License) from the app's npm font package; nothing is fetched.
const FONT_DIR = path.join(process.cwd(), "node_modules/@fontsource/public-sans/files");
const FONTS = { body: "public-sans-latin-400-normal.woff", semi: "public-sans-latin-600-normal.woff", bold: "public-sans-latin-700-normal.woff" };

const INK = "#1d2125";
const MUTED = "#68737d";
const RULE = "#aab3bb";
const COPPER = "#a65a24";
const VERDICT_COLOUR: Record<string, string> = { "as-predicted": "#2d7a56", higher: "#b0301f", lower: "#a86a0c", "no-model": MUTED };

/** The shipped Latin font has no Greek or arrows: spell those out so nothing prints as a blank. */
export function pdfText(s: string): string {
  return s.replace(/mΩ/g, "mohm").replace(/Ω/g, "ohm").replace(/[▲▼]\s?/g, "").replace(/−/g, "-");
}

type Doc = InstanceType<typeof PDFDocument>;

/** The job report as a PDF (A4), made on the server. */
export function reportPdf(r: JobReport): Promise<Buffer> {
  const doc: Doc = new PDFDocument({ size: "A4", margins: { top: 48, bottom: 56, left: 48, right: 48 }, bufferPages: true, info: { Title: r.title, Author: r.organizationName, Creator: "Ampwright" } });
  doc.registerFont("body", path.join(FONT_DIR, FONTS.body));
  doc.registerFont("semi", path.join(FONT_DIR, FONTS.semi));
  doc.registerFont("bold", path.join(FONT_DIR, FONTS.bold));
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const room = (h: number) => {
    if (doc.y + h > bottom()) doc.addPage();
  };
  const heading = (text: string, size = 13) => {
    room(size * 3);
    doc.moveDown(0.6).font("bold").fontSize(size).fillColor(INK).text(pdfText(text), left, doc.y, { width });
    doc.moveDown(0.25);
  };
  const para = (text: string, opts: { size?: number; colour?: string; font?: string } = {}) => {
    doc.font(opts.font ?? "body").fontSize(opts.size ?? 10).fillColor(opts.colour ?? INK);
    room(doc.heightOfString(pdfText(text), { width }) + 2);
    doc.text(pdfText(text), left, doc.y, { width });
  };

  // Title block.
  doc.font("semi").fontSize(9).fillColor(COPPER).text("AMPWRIGHT · JOB REPORT", left, doc.y, { width, characterSpacing: 1 });
  doc.moveDown(0.3).font("bold").fontSize(20).fillColor(INK).text(pdfText(r.title), { width });
  doc.font("body").fontSize(9.5).fillColor(MUTED).text(pdfText(`${r.organizationName} · made ${r.generated}`), { width });
  doc.moveDown(0.6);
  for (const [k, v] of r.facts) {
    const y = doc.y;
    doc.font("semi").fontSize(9.5).fillColor(MUTED).text(k, left, y, { width: 90 });
    doc.font("body").fillColor(INK).text(pdfText(v), left + 95, y, { width: width - 95 });
    doc.moveDown(0.15);
  }
  for (const [label, text] of [["Complaint", r.complaint], ["Found", r.findings], ["Repair", r.repair]] as const) {
    if (!text) continue;
    heading(label, 12);
    para(text);
  }

  for (const c of r.circuits) {
    heading(`${c.name} (version ${c.version})`, 14);
    drawing(doc, c.drawing, left, width);
    heading("Operating states", 11);
    for (const s of c.states) para(`${s.name}: ${s.summary}`, { size: 9 });
    room(80);
    heading(`Readings (${c.readings.length})`, 11);
    if (!c.readings.length) para("No readings taken on this circuit.", { size: 9, colour: MUTED });
    else readingsTable(doc, c.readings, left, width, room);
    if (c.suspects.length || c.fitNote || c.probeNext) {
      heading("Where the readings put extra resistance", 11);
      c.suspects.forEach((s, i) => para(`${i + 1}. ${s}`, { size: 9.5 }));
      if (c.fitNote) para(c.fitNote, { size: 9.5 });
      if (c.probeNext) para(`Probe next: ${c.probeNext}`, { size: 9.5 });
    }
  }

  if (r.sizings.length) {
    heading("Cable and fuse sizing", 13);
    for (const s of r.sizings) {
      para(`${s.title}: ${s.line}`, { font: "semi", size: 10 });
      para(s.detail, { size: 9, colour: MUTED });
      doc.moveDown(0.2);
    }
  }

  heading("Cautions", 12);
  for (const c of r.cautions) para(`• ${c}`, { size: 9 });

  // Page numbers on every page.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const y = doc.page.height - 36;
    doc.font("body").fontSize(8).fillColor(MUTED);
    doc.text(pdfText(`${r.title} · page ${i + 1} of ${range.count}`), left, y, { width, align: "right", lineBreak: false, height: 12 });
  }
  doc.end();
  return done;
}

function drawing(doc: Doc, d: Drawing, left: number, width: number) {
  const scale = Math.min(1, width / d.width, 300 / d.height);
  const h = d.height * scale;
  if (doc.y + h + 10 > doc.page.height - doc.page.margins.bottom) doc.addPage();
  const top = doc.y + 4;
  doc.save();
  doc.rect(left, top, d.width * scale, h).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.translate(left, top).scale(scale);
  for (const c of d.cables) {
    const [first, ...rest] = c.points;
    doc.moveTo(first[0], first[1]);
    for (const p of rest) doc.lineTo(p[0], p[1]);
    doc.lineWidth(c.kind === "link" ? 1.5 : 2.5).strokeColor(c.kind === "link" ? MUTED : COPPER).stroke();
    doc.font("body").fontSize(9).fillColor(INK).text(pdfText(c.label), c.mid[0] + 3, c.mid[1] - 11, { lineBreak: false });
  }
  for (const p of d.parts) {
    doc.roundedRect(p.x, p.y, p.w, p.h, 5).lineWidth(1.2).fillAndStroke("#ffffff", p.off ? RULE : INK);
    doc.font("bold").fontSize(10).fillColor(INK).text(p.id, p.x + 6, p.y + 6, { width: p.w - 12, lineBreak: false });
    doc.font("body").fontSize(9).fillColor(MUTED).text(p.off ? "off" : p.kind, p.x + 6, p.y + 6, { width: p.w - 12, align: "right", lineBreak: false });
    doc.font("body").fontSize(10).fillColor(INK).text(pdfText(p.label), p.x + 6, p.y + 30, { width: p.w - 12, height: 28, ellipsis: true });
  }
  doc.restore();
  doc.x = left;
  doc.y = top + h + 8;
}

function readingsTable(doc: Doc, rows: JobReport["circuits"][number]["readings"], left: number, width: number, room: (h: number) => void) {
  const cols = [0.16, 0.3, 0.16, 0.12, 0.26].map((f) => f * width);
  const xs = cols.map((_, i) => left + cols.slice(0, i).reduce((a, b) => a + b, 0));
  const head = ["State", "Between", "Measured", "Expected", "Verdict"];
  const line = (cells: string[], font: string, size: number, colours: string[] = []) => {
    doc.font(font).fontSize(size);
    const h = Math.max(...cells.map((t, i) => doc.heightOfString(pdfText(t), { width: cols[i] - 6 })));
    room(h + 4);
    const y = doc.y;
    cells.forEach((t, i) => doc.fillColor(colours[i] ?? INK).text(pdfText(t), xs[i], y, { width: cols[i] - 6 }));
    doc.x = left;
    doc.y = y + h + 2;
    return y;
  };
  room(60); // never a header alone at the foot of a page
  line(head, "semi", 8.5, head.map(() => MUTED));
  doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.y += 3;
  for (const r of rows) {
    line([r.state, r.between, r.measured, r.expected, r.verdictText], "body", 9, [INK, INK, INK, MUTED, VERDICT_COLOUR[r.verdict]]);
    const extra = [r.detail, r.note ? `Note: ${r.note}` : "", `Taken ${r.taken}${r.photos ? ` · ${r.photos} photo${r.photos === 1 ? "" : "s"}` : ""}`].filter(Boolean).join(" · ");
    doc.font("body").fontSize(8).fillColor(MUTED);
    const h = doc.heightOfString(pdfText(extra), { width: width - cols[0] });
    room(h + 6);
    doc.text(pdfText(extra), xs[1], doc.y, { width: width - cols[0] - 6 });
    doc.x = left;
    doc.y += 3;
    doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(0.3).strokeColor(RULE).stroke();
    doc.y += 3;
  }
}
