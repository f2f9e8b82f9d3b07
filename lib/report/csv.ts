import Papa from "papaparse";
import { stateIdsOf, type CircuitDocument } from "@/lib/circuit";
import { checkReadings, type Reading } from "@/lib/diagnosis/compare";
import { solveCircuit } from "@/lib/solver";

type Cell = string | number | null;

/**
 * RFC 4180 CSV through papaparse, CRLF line ends, and text cells that a spreadsheet would run as a formula
 * (starting with =, +, - or @) escaped with a leading quote mark; numbers stay numbers.
 */
export function toCsv(header: string[], rows: Cell[][]): string {
  return Papa.unparse({ fields: header, data: rows }, { newline: "\r\n", escapeFormulae: /^[=+\-@\t\r]/ });
}

const round = (x: number | undefined, digits = 6): Cell => (x === undefined || !Number.isFinite(x) ? null : Number(x.toFixed(digits)));

export type CsvReading = Reading & { note: string; takenAt: Date | string; takenByName: string | null };

/** A circuit's readings with the model's prediction and verdict beside each, one row per reading. */
export function readingsCsv(doc: CircuitDocument, readings: CsvReading[]): string {
  const checks = new Map(checkReadings(doc, readings).map((c) => [c.id, c]));
  const header = ["taken_at", "state", "red_probe", "black_probe", "value", "unit", "measured_v", "current_a", "expected_v", "difference_v", "verdict", "excess_ohm", "note", "taken_by"];
  const rows = readings.map((r) => {
    const k = checks.get(r.id);
    return [
      new Date(r.takenAt).toISOString(),
      r.stateId,
      r.positive,
      r.negative,
      r.value,
      r.unit,
      round(k?.measuredV),
      r.currentA,
      round(k?.expectedV),
      round(k?.differenceV),
      k?.verdict ?? "no-model",
      round(k?.path?.excessOhm, 7),
      r.note,
      r.takenByName ?? "",
    ];
  });
  return toCsv(header, rows);
}

/** The solved circuit in every operating state: one row per part and per cable, in SI units. */
export function resultsCsv(doc: CircuitDocument): string {
  const header = ["state", "id", "type", "label", "current_a", "voltage_v", "drop_v", "drop_percent", "power_w", "resistance_ohm", "status"];
  const rows: Cell[][] = [];
  for (const state of stateIdsOf(doc)) {
    const r = solveCircuit(doc, { state });
    const status = r.status === "ok" ? "ok" : "no trustworthy solution";
    for (const c of doc.components) {
      const cr = r.components[c.id];
      rows.push([state, c.id, c.kind, c.label ?? "", round(cr?.current), round(cr?.voltage), null, null, round(cr?.power), null, status]);
    }
    for (const w of doc.wires) {
      const wr = r.wires[w.id];
      rows.push([state, w.id, "cable", w.label ?? "", round(wr?.current), null, round(wr?.drop), round(wr?.dropPercent, 4), round(wr?.power), round(wr?.resistance, 8), status]);
    }
  }
  return toCsv(header, rows);
}
