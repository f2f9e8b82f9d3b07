import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { TERMINALS, type CircuitDocument } from "@/lib/circuit";

/**
 * Writes a linear circuit document as an ngspice deck (batteries as a source behind their internal resistance,
 * every wire, joint and resistive load a resistor, constant-current loads as current sources), with node "0" at
 * the reference terminal. Only for circuits with no zero-ohm parts, alternators or constant-power loads.
 */
export function toSpiceDeck(doc: CircuitDocument, reference: string, wireOhm: Record<string, number> = {}): { deck: string; nodeOf: Map<string, string> } {
  const nodeOf = new Map<string, string>();
  let k = 0;
  for (const c of doc.components) for (const t of TERMINALS[c.kind]) nodeOf.set(`${c.id}.${t}`, `n${k++}`);
  nodeOf.set(reference, "0");
  const lines = [`* ${doc.name}`];
  for (const c of doc.components) {
    const p = (t: string) => nodeOf.get(`${c.id}.${t}`);
    if (c.kind === "battery") {
      lines.push(`V${c.id} x${c.id} ${p("neg")} DC ${c.openCircuitVoltage}`, `Rint${c.id} ${p("pos")} x${c.id} ${c.internalResistance}`);
    } else if (c.kind === "joint" || c.kind === "fuse") lines.push(`R${c.id} ${p("a")} ${p("b")} ${c.resistance}`);
    else if (c.kind === "load" && c.mode === "resistance") lines.push(`R${c.id} ${p("pos")} ${p("neg")} ${c.value}`);
    else if (c.kind === "load" && c.mode === "current") lines.push(`I${c.id} ${p("pos")} ${p("neg")} DC ${c.value}`);
    else if (c.kind !== "ground" && c.kind !== "junction") throw new Error(`toSpiceDeck: ${c.kind} is not supported`);
  }
  // Sized cables take the resistance the conductor engine gave them (wireOhm); the network is what is checked.
  for (const w of doc.wires) lines.push(`R${w.id} ${nodeOf.get(w.from)} ${nodeOf.get(w.to)} ${w.resistanceOhm ?? wireOhm[w.id]}`);
  lines.push(".options gmin=1e-15 reltol=1e-12 vntol=1e-12 abstol=1e-15", ".control", "op", "set filetype=ascii", "write {RAW} all", ".endc", ".end");
  return { deck: lines.join("\n") + "\n", nodeOf };
}

/** Runs ngspice in batch mode and reads the node voltages from its ASCII raw file (full precision). */
export function runNgspice(deck: string): { voltages: Map<string, number>; ms: number } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ampwright-spice-"));
  try {
    const raw = path.join(dir, "out.raw");
    const cir = path.join(dir, "deck.cir");
    fs.writeFileSync(cir, deck.replace("{RAW}", raw));
    const t0 = performance.now();
    // ngspice exits 1 when a deck has no .print line even though the control block wrote its raw file.
    const run = spawnSync("ngspice", ["-b", cir], { stdio: "pipe", maxBuffer: 256 * 1024 * 1024 });
    const ms = performance.now() - t0;
    if (!fs.existsSync(raw)) throw new Error(`ngspice wrote no results: ${String(run.stderr).slice(0, 500)}`);
    const text = fs.readFileSync(raw, "utf8");
    const names: string[] = [];
    const varsAt = text.indexOf("\nVariables:") + 1;
    const valuesAt = text.indexOf("\nValues:") + 1;
    for (const line of text.slice(varsAt + 10, valuesAt).trim().split("\n")) {
      const [, nm] = line.trim().split(/\s+/);
      names.push(nm);
    }
    const nums = text.slice(valuesAt + 7).trim().split(/\s+/).map(Number);
    // The first number is the point index.
    const voltages = new Map<string, number>();
    names.forEach((nm, i) => {
      const m = /^v\((.+)\)$/.exec(nm);
      if (m) voltages.set(m[1], nums[i + 1]);
    });
    return { voltages, ms };
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

export function hasNgspice(): boolean {
  try {
    execFileSync("ngspice", ["-v"], { stdio: "pipe" });
    return true;
  } catch {
    return false;
  }
}
