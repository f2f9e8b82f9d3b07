import { stateIdsOf, type CircuitDocument } from "@/lib/circuit";
import { describeProtection } from "@/lib/conductors/protection";
import type { SizingRequest, SizingSummary } from "@/lib/conductors/sizing";
import { checkReadings, type ReadingCheck } from "@/lib/diagnosis/compare";
import { locateFault } from "@/lib/diagnosis/locate";
import { formatVolts, formatWhen, STATUS_LABELS } from "@/lib/format";
import { solveCircuit } from "@/lib/solver";
import type { JobStatus } from "@/lib/validators/job-status";
import { drawCircuit, type Drawing } from "./drawing";

/** What a report is made from: one job as stored, with its circuits, readings, sizings and photos. */
export type ReportInput = {
  job: {
    id: string;
    title: string;
    vehicle: string;
    systemVoltage: number;
    complaint: string;
    findings: string;
    repair: string;
    status: JobStatus;
    ownerName: string | null;
    organizationName: string;
    createdAt: Date | string;
    updatedAt: Date | string;
  };
  circuits: {
    id: string;
    name: string;
    version: number;
    document: CircuitDocument;
    readings: {
      id: string;
      stateId: string;
      positive: string;
      negative: string;
      value: number;
      unit: "V" | "mV";
      currentA: number | null;
      note: string;
      takenByName: string | null;
      takenAt: Date | string;
    }[];
  }[];
  sizings: { title: string; request: SizingRequest; answer: SizingSummary; createdAt: Date | string }[];
  photos: { readingId: string | null; fileName: string }[];
  generatedAt: Date;
};

export type ReportReading = {
  id: string;
  state: string;
  between: string;
  measured: string;
  expected: string;
  verdict: "as-predicted" | "higher" | "lower" | "no-model";
  verdictText: string;
  detail: string;
  note: string;
  taken: string;
  photos: number;
};

export type ReportState = { id: string; name: string; summary: string };

export type ReportCircuit = {
  id: string;
  name: string;
  version: number;
  drawing: Drawing;
  states: ReportState[];
  readings: ReportReading[];
  suspects: string[];
  probeNext: string | null;
  fitNote: string | null;
};

export type JobReport = {
  title: string;
  jobId: string;
  organizationName: string;
  generated: string;
  facts: [string, string][];
  complaint: string;
  findings: string;
  repair: string;
  circuits: ReportCircuit[];
  sizings: { title: string; line: string; detail: string }[];
  cautions: string[];
};

/** The cautions every report carries: the usual ones for battery and cable work, and where authority lies. */
export const REPORT_CAUTIONS = [
  "Lead-acid batteries vent hydrogen: keep sparks and flames away, and wear eye protection.",
  "Disconnect the battery negative first and reconnect it last; a short circuit across a battery can weld a tool and burn skin.",
  "Cables carrying high current get hot, and engines have moving belts and fans: keep hands and leads clear while cranking or running.",
  "Figures here come from a model of the circuit and from meter readings; the vehicle maker's service information, local codes and licensed practice come first.",
];

const mOhm = (ohm: number) => `${(ohm * 1000).toFixed(ohm < 0.01 ? 2 : 1)} mΩ`;
const amps = (a: number) => `${Math.abs(a) < 10 ? a.toFixed(1) : Math.round(a)} A`;

function nameOf(doc: CircuitDocument, id: string): string {
  const c = doc.components.find((x) => x.id === id);
  if (c) return c.label ? `${c.label} (${id})` : id;
  const w = doc.wires.find((x) => x.id === id);
  return w?.label ? `${w.label} (${id})` : id;
}

const ROLE: Record<string, string> = { pos: "+", neg: "−", out: "B+", case: "case", in: "in", a: "a", b: "b", t: "" };
function pointName(doc: CircuitDocument, ref: string): string {
  const [id, t] = ref.split(".");
  const c = doc.components.find((x) => x.id === id);
  const role = ROLE[t] ?? t;
  return `${c?.label ?? id}${role ? ` ${role}` : ""}`;
}

function stateLabel(doc: CircuitDocument, id: string): string {
  if (id === "base") return "As drawn";
  return doc.states?.find((s) => s.id === id)?.name ?? id;
}

export function verdictWords(check: ReadingCheck | undefined): string {
  if (!check) return "";
  if (check.verdict === "no-model") return `No prediction: ${check.reason ?? "no model"}`;
  const diff = check.differenceV !== undefined ? ` (${check.differenceV > 0 ? "+" : ""}${formatVolts(check.differenceV)})` : "";
  return check.verdict === "as-predicted" ? "As predicted" : check.verdict === "higher" ? `Higher than predicted${diff}` : `Lower than predicted${diff}`;
}

function readingDetail(check: ReadingCheck | undefined): string {
  if (!check) return "";
  const parts: string[] = [];
  const p = check.path;
  if (p) {
    parts.push(`${p.ids.join(", ")}: model ${mOhm(p.expectedOhm)}, reading gives ${mOhm(p.impliedOhm)} at ${amps(p.currentA)}`);
    if (p.excessOhm > 0.00005) parts.push(`${mOhm(p.excessOhm)} extra, ${p.excessHeatW.toFixed(1)} W of heat`);
    if (p.heatWarning) parts.push(p.heatWarning);
  }
  if (check.battery?.kind === "rest") parts.push(`at rest about ${Math.round(check.battery.socPercent)} % charged (BCI open-circuit table)`);
  if (check.battery?.kind === "charging") {
    parts.push(`charging voltage ${check.battery.within ? "inside" : "outside"} the window of ${check.battery.window[0].toFixed(2)}–${check.battery.window[1].toFixed(2)} V for the circuit's temperature`);
  }
  return parts.join("; ");
}

/** One line per operating state: the battery's terminal voltage, what the alternator and starter carry, the worst cable. */
function stateSummary(doc: CircuitDocument, stateId: string): string {
  const r = solveCircuit(doc, { state: stateId });
  if (r.status !== "ok") return `No trustworthy solution: ${r.issues.find((i) => i.severity === "error")?.message ?? "see the circuit's problems"}`;
  const bits: string[] = [];
  for (const c of doc.components) {
    const cr = r.components[c.id];
    if (!cr) continue;
    if (c.kind === "battery") bits.push(`${c.label ?? c.id} ${cr.voltage.toFixed(2)} V${cr.current !== undefined ? `, ${amps(cr.current)}` : ""}`);
    if ((c.kind === "alternator" || c.kind === "starter") && cr.current !== undefined && Math.abs(cr.current) > 0.05) bits.push(`${c.label ?? c.id} ${amps(Math.abs(cr.current))}`);
  }
  let worst: { id: string; drop: number } | undefined;
  for (const w of doc.wires) {
    const wr = r.wires[w.id];
    if (wr && (!worst || Math.abs(wr.drop) > worst.drop)) worst = { id: w.id, drop: Math.abs(wr.drop) };
  }
  if (worst && worst.drop > 0.0005) bits.push(`largest cable drop ${nameOf(doc, worst.id)} ${formatVolts(worst.drop)}`);
  return bits.join("; ") || "Nothing carries current";
}

function sizingLine(s: ReportInput["sizings"][number]): { line: string; detail: string } {
  const a = s.answer;
  const r = s.request;
  const line = a.size
    ? `${a.size}${a.protection ? ` with a ${describeProtection(a.protection)}` : ""}`
    : `No size fits: ${a.reason}`;
  const bits = [`${r.currentA} A over ${r.lengthM} m one way`, `${r.systemVoltage} V system`];
  if (a.dropV !== null) bits.push(`drop ${formatVolts(a.dropV)}${a.dropPercent !== null ? ` (${a.dropPercent.toFixed(1)} %)` : ""} against a ${formatVolts(a.limitV)} limit`);
  if (a.ampacityA !== null) bits.push(`ampacity ${Math.round(a.ampacityA)} A`);
  return { line, detail: bits.join("; ") };
}

/** The job report as words and figures, the same for the print page, the PDF and the e-mail. */
export function buildJobReport(input: ReportInput): JobReport {
  const { job } = input;
  const photoCount = new Map<string, number>();
  for (const p of input.photos) if (p.readingId) photoCount.set(p.readingId, (photoCount.get(p.readingId) ?? 0) + 1);

  const circuits: ReportCircuit[] = input.circuits.map((c) => {
    const doc = c.document;
    const checks = new Map(checkReadings(doc, c.readings).map((k) => [k.id, k]));
    const loc = c.readings.length ? locateFault(doc, c.readings) : undefined;
    return {
      id: c.id,
      name: c.name,
      version: c.version,
      drawing: drawCircuit(doc),
      states: stateIdsOf(doc).map((id) => ({ id, name: stateLabel(doc, id), summary: stateSummary(doc, id) })),
      readings: c.readings.map((r) => {
        const k = checks.get(r.id);
        return {
          id: r.id,
          state: stateLabel(doc, r.stateId),
          between: `${pointName(doc, r.positive)} to ${pointName(doc, r.negative)}`,
          measured: `${formatVolts(r.value, r.unit)}${r.currentA !== null ? ` at ${amps(r.currentA)}` : ""}`,
          expected: k?.expectedV !== undefined ? formatVolts(k.expectedV) : "—",
          verdict: k?.verdict ?? "no-model",
          verdictText: verdictWords(k),
          detail: readingDetail(k),
          note: r.note,
          taken: `${formatWhen(r.takenAt)}${r.takenByName ? `, ${r.takenByName}` : ""}`,
          photos: photoCount.get(r.id) ?? 0,
        };
      }),
      suspects: (loc?.suspects ?? []).map(
        (s) => `${nameOf(doc, s.id)}: about ${mOhm(s.extraOhm)} more than drawn, from ${s.readings} ${s.readings === 1 ? "reading" : "readings"}${s.twins.length ? ` (cannot yet be told apart from ${s.twins.join(", ")})` : ""}`,
      ),
      probeNext: loc?.probeNext?.why ?? null,
      fitNote: loc && loc.used.length ? (loc.suspects.length ? null : "The readings fit the circuit as drawn: no extra resistance found.") : null,
    };
  });

  return {
    title: job.title,
    jobId: job.id,
    organizationName: job.organizationName,
    generated: formatWhen(input.generatedAt),
    facts: [
      ["Vehicle", job.vehicle || "Not described"],
      ["System", `${job.systemVoltage} V`],
      ["Status", STATUS_LABELS[job.status]],
      ["Opened", `${formatWhen(job.createdAt)}${job.ownerName ? ` by ${job.ownerName}` : ""}`],
      ["Last change", formatWhen(job.updatedAt)],
    ],
    complaint: job.complaint,
    findings: job.findings,
    repair: job.repair,
    circuits,
    sizings: input.sizings.map((s) => ({ title: s.title, ...sizingLine(s) })),
    cautions: REPORT_CAUTIONS,
  };
}

/** The report as plain text, for the body of an e-mail. */
export function reportText(r: JobReport, url?: string): string {
  const lines = [`${r.title}`, `${r.organizationName} · report made ${r.generated}`, ""];
  for (const [k, v] of r.facts) lines.push(`${k}: ${v}`);
  if (r.complaint) lines.push("", "Complaint:", r.complaint);
  if (r.findings) lines.push("", "Found:", r.findings);
  if (r.repair) lines.push("", "Repair:", r.repair);
  for (const c of r.circuits) {
    if (!c.readings.length && !c.suspects.length) continue;
    lines.push("", `${c.name}: ${c.readings.length} ${c.readings.length === 1 ? "reading" : "readings"}`);
    for (const x of c.readings) lines.push(`- ${x.state}, ${x.between}: ${x.measured} (expected ${x.expected}) — ${x.verdictText}`);
    for (const s of c.suspects) lines.push(`  Suspect: ${s}`);
  }
  if (r.sizings.length) {
    lines.push("", "Cable and fuse sizing:");
    for (const s of r.sizings) lines.push(`- ${s.title}: ${s.line}`);
  }
  if (url) lines.push("", `Full report: ${url}`);
  lines.push("", ...r.cautions.map((c) => `! ${c}`));
  return lines.join("\n");
}
