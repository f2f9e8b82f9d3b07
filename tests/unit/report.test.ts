import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import type { CircuitDocument } from "@/lib/circuit";
import { toCsv } from "@/lib/report/csv";
import { drawCircuit, PART_H, PART_W } from "@/lib/report/drawing";
import { buildJobReport, reportText, type ReportInput } from "@/lib/report/job-report";
import { looksLikeShareToken, newShareToken } from "@/lib/report/tokens";

// A battery, one lamp load and two leads of known resistance: every figure below is Ohm's law by hand.
const doc: CircuitDocument = {
  schema: "ampwright.circuit/1",
  name: "Lamp on a bench",
  systemVoltage: 12,
  components: [
    { id: "B1", kind: "battery", label: "Bench battery", openCircuitVoltage: 12.6, internalResistance: 0.02, position: { x: 0, y: 0 } },
    { id: "L1", kind: "load", label: "Lamp", mode: "resistance", value: 1.0, position: { x: 300, y: 0 } },
  ],
  wires: [
    { id: "W1", from: "B1.pos", to: "L1.pos", resistanceOhm: 0.05 },
    { id: "W2", from: "L1.neg", to: "B1.neg", resistanceOhm: 0.03 },
  ],
};
// I = 12.6 V / (0.02 + 0.05 + 1.0 + 0.03) ohm = 11.4545 A; the W1 drop is 0.05 x I = 0.5727 V.
const I = 12.6 / 1.1;

const input = (readings: ReportInput["circuits"][number]["readings"]): ReportInput => ({
  job: {
    id: "job_x",
    title: "Dim lamp",
    vehicle: "Bench",
    systemVoltage: 12,
    complaint: "Lamp dim",
    findings: "Feed lead corroded",
    repair: "",
    status: "diagnosed",
    ownerName: "A. Tech",
    organizationName: "Test shop",
    createdAt: "2026-12-01T10:00:00Z",
    updatedAt: "2026-12-01T11:00:00Z",
  },
  circuits: [{ id: "cir_x", name: "Lamp circuit", version: 3, document: doc, readings }],
  sizings: [],
  photos: [{ readingId: "r2", fileName: "meter.jpg" }],
  generatedAt: new Date("2026-12-02T09:30:00Z"),
});

describe("the job report", () => {
  it("puts each reading beside the model's prediction with a verdict and the resistance it implies", () => {
    const report = buildJobReport(
      input([
        { id: "r1", stateId: "base", positive: "B1.pos", negative: "L1.pos", value: 0.57, unit: "V", currentA: null, note: "", takenByName: "A. Tech", takenAt: "2026-12-01T10:30:00Z" },
        { id: "r2", stateId: "base", positive: "B1.pos", negative: "L1.pos", value: 900, unit: "mV", currentA: 11.45, note: "after a wiggle", takenByName: null, takenAt: "2026-12-01T10:40:00Z" },
      ]),
    );
    const [c] = report.circuits;
    expect(c.readings[0]).toMatchObject({ expected: `${(0.05 * I).toFixed(3)} V`, verdict: "as-predicted" });
    expect(c.readings[1].verdict).toBe("higher");
    // 0.9 V / 11.45 A = 78.6 mohm against the 50 mohm drawn: 28.6 mohm extra, 11.45^2 x 0.0286 = 3.7 W.
    expect(c.readings[1].detail).toContain("W1: model 50.0 mΩ, reading gives 78.6 mΩ at 11 A");
    expect(c.readings[1].detail).toContain("28.6 mΩ extra, 3.7 W of heat");
    expect(c.readings[1].photos).toBe(1);
    expect(c.suspects[0]).toMatch(/^W1: about \d+\.\d mΩ more than drawn/);
    expect(c.states[0].summary).toContain(`Bench battery ${(12.6 - 0.02 * I).toFixed(2)} V`);
    expect(report.facts).toContainEqual(["Status", "Diagnosed"]);
    const text = reportText(report, "http://127.0.0.1/shared/x");
    expect(text).toContain("Found:\nFeed lead corroded");
    expect(text).not.toContain("Repair:");
    expect(text).toContain("Full report: http://127.0.0.1/shared/x");
  });

  it("says so when a reading names a state the circuit no longer has", () => {
    const report = buildJobReport(input([{ id: "r1", stateId: "gone", positive: "B1.pos", negative: "B1.neg", value: 12.5, unit: "V", currentA: null, note: "", takenByName: null, takenAt: "2026-12-01T10:30:00Z" }]));
    expect(report.circuits[0].readings[0]).toMatchObject({ verdict: "no-model", expected: "—" });
    expect(report.circuits[0].readings[0].verdictText).toContain('no state "gone"');
  });
});

describe("the report drawing", () => {
  it("places parts where the canvas has them, from the margin, and joins cables at the terminals", () => {
    const d = drawCircuit(doc);
    const [b, l] = d.parts;
    expect([b.x, b.y, l.x - b.x]).toEqual([40, 40, 300]);
    // As on the canvas: a part's first terminal (B1.pos, L1.pos) on its left edge at mid height, its second on the right.
    expect(d.cables[0].points[0]).toEqual([b.x, b.y + PART_H / 2]);
    expect(d.cables[0].points.at(-1)).toEqual([l.x, l.y + PART_H / 2]);
    expect(d.cables[1].points[0]).toEqual([l.x + PART_W, l.y + PART_H / 2]);
    expect(d.width).toBe(l.x + PART_W + 40);
  });
});

describe("CSV", () => {
  it("quotes what needs quoting and disarms text a spreadsheet would run, but leaves negative numbers alone", () => {
    const csv = toCsv(["a", "b", "c"], [["=1+1", -0.5, 'say "hi", then go'], ["+cmd", 2, "-x"]]);
    expect(csv.split("\r\n")[1]).toBe(`"'=1+1",-0.5,"say ""hi"", then go"`);
    const back = Papa.parse<string[]>(csv).data;
    expect(back[2]).toEqual(["'+cmd", "2", "'-x"]);
  });
});

describe("share tokens", () => {
  it("are 43 base64url characters and never repeat", () => {
    const t = Array.from({ length: 500 }, newShareToken);
    expect(t.every(looksLikeShareToken)).toBe(true);
    expect(new Set(t).size).toBe(500);
    expect(looksLikeShareToken("../../etc/passwd")).toBe(false);
  });
});
