import type { CircuitDocument, Component, Wire } from "@/lib/circuit";
import { TERMINALS } from "@/lib/circuit";
import type { SolveResult } from "@/lib/solver";

/** A document from parts, with the version 1 header. */
export function circuit(components: unknown[], wires: unknown[], extra: Record<string, unknown> = {}): CircuitDocument {
  return { schema: "ampwright.circuit/1", name: "test", systemVoltage: 12, components, wires, ...extra } as CircuitDocument;
}

/** A small deterministic generator (no Math.random: runs repeat). */
export function rng(seed: number) {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

/**
 * A random connected linear circuit: batteries with internal resistance, joints, resistive and constant-current
 * loads, grounds joined by straps; every terminal wired, all resistances above zero.
 */
export function randomLinearCircuit(seed: number, size: number, opts: { currentLoads?: boolean } = {}): CircuitDocument {
  const r = rng(seed);
  const components: Component[] = [];
  const wires: Wire[] = [];
  // Terminals joined to the reference through resistance (never only through a current source).
  const terminals: string[] = [];
  const pick = () => terminals[Math.floor(r() * terminals.length)];
  const later: string[] = [];
  let w = 0;
  const wire = (from: string, to: string) => {
    wires.push({ id: `W${++w}`, from, to, resistanceOhm: 0.0005 + r() * 0.05 } as Wire);
  };
  const add = (c: Component) => {
    const ts = TERMINALS[c.kind].map((t) => `${c.id}.${t}`);
    // Join the new part to what exists so the whole stays connected.
    if (terminals.length) wire(pick(), ts[0]);
    components.push(c);
    const currentSource = c.kind === "load" && c.mode === "current";
    terminals.push(ts[0]);
    if (ts[1]) (currentSource ? later : terminals).push(ts[1]);
  };
  add({ id: "G0", kind: "ground", reference: true } as Component);
  add({ id: "B0", kind: "battery", openCircuitVoltage: 12 + r(), internalResistance: 0.005 + r() * 0.02 } as Component);
  for (let i = 1; i < size; i++) {
    const k = r();
    if (k < 0.1) add({ id: `B${i}`, kind: "battery", openCircuitVoltage: 11.5 + r() * 1.5, internalResistance: 0.005 + r() * 0.05 } as Component);
    else if (k < 0.4) add({ id: `J${i}`, kind: "joint", resistance: 0.0002 + r() * 0.2 } as Component);
    else if (k < 0.6) add({ id: `L${i}`, kind: "load", mode: "resistance", value: 0.5 + r() * 20 } as Component);
    else if (k < 0.7 && opts.currentLoads !== false) add({ id: `I${i}`, kind: "load", mode: "current", value: r() * 5 } as Component);
    else if (k < 0.8) add({ id: `G${i}`, kind: "ground" } as Component);
    else add({ id: `N${i}`, kind: "junction" } as Component);
  }
  // Close the second terminals of two-terminal parts, and a few extra loops.
  for (const c of components) {
    const ts = TERMINALS[c.kind];
    if (ts.length !== 2) continue;
    let other = pick();
    while (other === `${c.id}.${ts[1]}` || other === `${c.id}.${ts[0]}`) other = pick();
    wire(`${c.id}.${ts[1]}`, other);
  }
  terminals.push(...later);
  for (let i = 0; i < size / 5; i++) wire(pick(), pick());
  return circuit(components, wires.filter((x) => x.from !== x.to));
}

/**
 * A random charging circuit: a random linear circuit with one to three alternators (each feeding a random terminal
 * through an output cable, its case strapped to the reference ground) and constant-power loads across random
 * terminals, so that alternators land in all three modes and loads may collapse.
 */
export function randomChargingCircuit(seed: number, size: number): CircuitDocument {
  const doc = randomLinearCircuit(seed, size);
  const r = rng(seed ^ 0x5bd1e995);
  const terminals = doc.wires.map((w) => w.from);
  const pick = () => terminals[Math.floor(r() * terminals.length)];
  const alternators = 1 + Math.floor(r() * 3);
  for (let i = 0; i < alternators; i++) {
    // Rated 5 A to 5 kA (log-uniform), so that some alternators hold their node above what others regulate to.
    doc.components.push({ id: `A${i}`, kind: "alternator", regulatedVoltage: 12.8 + r() * 2.2, ratedCurrent: 5 * 1000 ** r() } as Component);
    doc.wires.push({ id: `WA${i}`, from: `A${i}.out`, to: i > 0 && r() < 0.5 ? "A0.out" : pick(), resistanceOhm: 0.001 + r() * 0.02 } as Wire);
    doc.wires.push({ id: `WC${i}`, from: `A${i}.case`, to: "G0.t", resistanceOhm: 0.0002 + r() * 0.002 } as Wire);
  }
  const loads = 1 + Math.floor(r() * (size / 10));
  for (let i = 0; i < loads; i++) {
    doc.components.push({ id: `P${i}`, kind: "load", mode: "power", value: 1 + r() * 300 } as Component);
    doc.wires.push({ id: `WP${i}`, from: `P${i}.pos`, to: pick(), resistanceOhm: 0.001 + r() * 0.05 } as Wire);
    doc.wires.push({ id: `WQ${i}`, from: `P${i}.neg`, to: "G0.t", resistanceOhm: 0.001 + r() * 0.01 } as Wire);
  }
  return doc;
}

/** Largest Kirchhoff current-law mismatch over all terminals of a solved circuit, and the largest current. */
export function kclMismatch(doc: CircuitDocument, res: SolveResult): { worst: number; largest: number } {
  const sum = new Map<string, number>();
  const bump = (t: string, x: number) => sum.set(t, (sum.get(t) ?? 0) + x);
  let largest = 0;
  for (const w of doc.wires) {
    const I = res.wires[w.id]?.current ?? 0;
    bump(w.from, I);
    bump(w.to, -I);
    largest = Math.max(largest, Math.abs(I));
  }
  for (const c of doc.components) {
    const ts = TERMINALS[c.kind];
    if (ts.length !== 2) continue;
    const I = res.components[c.id]?.current ?? 0;
    bump(`${c.id}.${ts[0]}`, I);
    bump(`${c.id}.${ts[1]}`, -I);
    largest = Math.max(largest, Math.abs(I));
  }
  let worst = 0;
  for (const x of sum.values()) worst = Math.max(worst, Math.abs(x));
  return { worst, largest };
}

/** Sum of all powers (components and wires) and the sum of their magnitudes. */
export function powerBalance(res: SolveResult): { net: number; scale: number } {
  let net = 0;
  let scale = 0;
  for (const c of Object.values(res.components)) {
    net += c.power ?? 0;
    scale += Math.abs(c.power ?? 0);
  }
  for (const w of Object.values(res.wires)) {
    net += w.power;
    scale += Math.abs(w.power);
  }
  return { net, scale };
}
