import { componentSchema, CIRCUIT_DEFAULTS, TERMINALS, type CircuitDocument, type Component } from "@/lib/circuit/schema";
import { conductorResistanceOhm, conductorTempC } from "@/lib/conductors/resistance";
import { findSize } from "@/lib/conductors/sizes";
import type { MaterialId } from "@/lib/conductors/materials";
import type { SolveIssue } from "./types";

/** Element kinds after the document is read: what the nodal analysis stamps. */
export const EL = {
  /** conductance g between a and b (a cable, a joint, a resistive load, a closed switch) */
  resistor: 0,
  /** zero-ohm connection: a and b become one node */
  link: 1,
  /** ideal voltage source: v(a) - v(b) = value */
  vsource: 2,
  /** current source: value amperes flow from a through the element to b */
  isource: 3,
  /** battery with internal resistance: value = open-circuit voltage, g = 1 / r */
  norton: 4,
  /** constant-power load: value watts from a to b */
  power: 5,
  /** alternator: value = regulated voltage, g = rated current; its mode is chosen by the active set */
  alternator: 6,
} as const;

export type Netlist = {
  terminalNames: string[];
  /** The component (by position in `components`) each terminal belongs to. */
  terminalComponent: Int32Array;
  /** Which component or wire (by position in ownerIds) each element belongs to. */
  ownerIds: string[];
  count: number;
  type: Uint8Array;
  a: Int32Array;
  b: Int32Array;
  g: Float64Array;
  value: Float64Array;
  owner: Int32Array;
  components: Component[];
  /** Element index of each component (or -1) and of each wire. */
  componentElement: Int32Array;
  /** Index of each component's first terminal (its terminals are consecutive). */
  componentTerminal: Int32Array;
  wireIds: string[];
  wireElement: Int32Array;
  wireResistance: Float64Array;
  /** Terminals touched by at least one wire. */
  wired: Uint8Array;
  referenceTerminal: number;
  issues: SolveIssue[];
};

const PARAM_KEYS_FIXED = new Set(["id", "kind"]);

/** The document's components with an operating state's overrides applied (base = as written). */
export function applyState(doc: CircuitDocument, stateId: string): { components: Component[]; issues: SolveIssue[]; found: boolean } {
  const issues: SolveIssue[] = [];
  if (stateId === "base") return { components: doc.components, issues, found: true };
  const state = (doc.states ?? []).find((s) => s.id === stateId);
  if (!state) {
    const known = ["base", ...(doc.states ?? []).map((s) => s.id)].join(", ");
    issues.push({ severity: "error", code: "unknown-state", message: `There is no operating state "${stateId}". Known states: ${known}.`, ids: [] });
    return { components: doc.components, issues, found: false };
  }
  const byId = new Map(doc.components.map((c, i) => [c.id, i]));
  const components = doc.components.slice();
  for (const [cid, params] of Object.entries(state.set)) {
    const i = byId.get(cid);
    if (i === undefined) {
      issues.push({ severity: "error", code: "unknown-component", message: `State "${state.name}" sets ${cid}, which is not a component of this circuit.`, ids: [cid] });
      continue;
    }
    const bad = Object.keys(params).filter((k) => PARAM_KEYS_FIXED.has(k));
    if (bad.length) {
      issues.push({ severity: "error", code: "invalid-state-override", message: `State "${state.name}" cannot change ${bad.join(" or ")} of ${cid}.`, ids: [cid] });
      continue;
    }
    const merged = componentSchema.safeParse({ ...components[i], ...params });
    if (!merged.success) {
      const what = merged.error.issues.map((e) => `${e.path.join(".") || "value"}: ${e.message}`).join("; ");
      issues.push({ severity: "error", code: "invalid-state-override", message: `State "${state.name}" gives ${cid} a value it cannot take (${what}).`, ids: [cid] });
      continue;
    }
    components[i] = merged.data;
  }
  return { components, issues, found: true };
}

/** Reads components and wires into elements between terminals, reporting every reference problem as an issue. */
export function buildNetlist(doc: CircuitDocument, components: Component[]): Netlist {
  const issues: SolveIssue[] = [];
  // One map of every id: a component's position in `unique` (>= 0), or a wire (-1). It finds duplicates and reads
  // "B1.pos" as component B1's terminal "pos" without building a name for every terminal first.
  const ids = new Map<string, number>();
  const unique: Component[] = [];
  let terminalCount = 0;
  // One map operation per id (a large map costs a cache miss per operation): a set that does not grow the map met a
  // duplicate, and the rare duplicate puts the first holder's index back.
  const firstHolder = (id: string) => unique.findIndex((u) => u.id === id);
  for (const c of components) {
    const before = ids.size;
    ids.set(c.id, unique.length);
    if (ids.size === before) {
      ids.set(c.id, firstHolder(c.id));
      issues.push({ severity: "error", code: "duplicate-id", message: `Two components are called ${c.id}; give each its own id.`, ids: [c.id] });
      continue;
    }
    unique.push(c);
    terminalCount += TERMINALS[c.kind].length;
  }
  const terminalNames: string[] = new Array(terminalCount);
  const terminalComponent = new Int32Array(terminalCount);

  const cap = unique.length + doc.wires.length;
  const type = new Uint8Array(cap);
  const a = new Int32Array(cap);
  const b = new Int32Array(cap);
  const g = new Float64Array(cap);
  const value = new Float64Array(cap);
  const owner = new Int32Array(cap);
  const ownerIds: string[] = [];
  let count = 0;
  const add = (t: number, ia: number, ib: number, gv: number, v: number, ownerId: string) => {
    type[count] = t;
    a[count] = ia;
    b[count] = ib;
    g[count] = gv;
    value[count] = v;
    owner[count] = ownerIds.length;
    ownerIds.push(ownerId);
    return count++;
  };

  const componentElement = new Int32Array(unique.length).fill(-1);
  const componentTerminal = new Int32Array(unique.length);
  let reference = -1;
  let firstBatteryNeg = -1;
  const references: string[] = [];
  let nextTerminal = 0;
  unique.forEach((c, ci) => {
    const t0 = nextTerminal;
    const nt = TERMINALS[c.kind].length;
    const t1 = nt > 1 ? t0 + 1 : -1;
    nextTerminal += nt;
    componentTerminal[ci] = t0;
    for (let k = 0; k < nt; k++) terminalComponent[t0 + k] = ci;
    const resistive = (r: number) => (r > 0 ? add(EL.resistor, t0, t1, 1 / r, 0, c.id) : add(EL.link, t0, t1, 0, 0, c.id));
    switch (c.kind) {
      case "battery":
        if (firstBatteryNeg < 0) firstBatteryNeg = t1;
        componentElement[ci] =
          c.internalResistance > 0
            ? add(EL.norton, t0, t1, 1 / c.internalResistance, c.openCircuitVoltage, c.id)
            : add(EL.vsource, t0, t1, 0, c.openCircuitVoltage, c.id);
        break;
      case "alternator":
        if (c.enabled ?? CIRCUIT_DEFAULTS.enabled) componentElement[ci] = add(EL.alternator, t0, t1, c.ratedCurrent, c.regulatedVoltage, c.id);
        break;
      case "starter":
        if (c.enabled ?? CIRCUIT_DEFAULTS.enabled) {
          componentElement[ci] = c.resistance !== undefined ? resistive(c.resistance) : add(EL.isource, t0, t1, 0, c.current ?? 0, c.id);
        }
        break;
      case "load":
        if (c.enabled ?? CIRCUIT_DEFAULTS.enabled) {
          if (c.mode === "current") componentElement[ci] = add(EL.isource, t0, t1, 0, c.value, c.id);
          else if (c.mode === "resistance") componentElement[ci] = resistive(c.value);
          else if (c.value > 0) componentElement[ci] = add(EL.power, t0, t1, 0, c.value, c.id);
        }
        break;
      case "fuse":
        componentElement[ci] = resistive(c.resistance);
        break;
      case "switch":
        if (c.closed ?? CIRCUIT_DEFAULTS.closed) componentElement[ci] = resistive(c.contactResistance);
        break;
      case "joint":
        componentElement[ci] = resistive(c.resistance);
        break;
      case "ground":
        if (c.reference) {
          references.push(c.id);
          if (reference < 0) reference = t0;
        }
        break;
      case "junction":
        break;
    }
  });
  if (references.length > 1) {
    issues.push({
      severity: "error",
      code: "multiple-references",
      message: `Only one ground can be the 0 V reference; ${references.join(", ")} are all marked. Unmark all but one.`,
      ids: references,
    });
  }
  if (reference < 0) reference = firstBatteryNeg >= 0 ? firstBatteryNeg : terminalCount > 0 ? 0 : -1;

  // "B1.pos" -> the terminal's index: the component from the id map, the terminal by its name among the kind's few.
  // A wire's own text becomes the terminal's name (the result's key), so most names are never built.
  const terminalOf = (ref: string): number | undefined => {
    const dot = ref.lastIndexOf(".");
    if (dot <= 0) return undefined;
    const ci = ids.get(ref.slice(0, dot));
    if (ci === undefined || ci < 0) return undefined;
    const names = TERMINALS[unique[ci].kind];
    const len = ref.length - dot - 1;
    for (let k = 0; k < names.length; k++) {
      if (names[k].length === len && ref.startsWith(names[k], dot + 1)) {
        const t = componentTerminal[ci] + k;
        terminalNames[t] ??= ref;
        return t;
      }
    }
    return undefined;
  };
  // Resistance per metre by size, material and conductor temperature: a harness repeats a few sizes many times.
  const perMetre = new Map<string, number>();
  const ambientC = doc.ambientC ?? CIRCUIT_DEFAULTS.ambientC;
  const tempChoice = doc.conductorTemp ?? CIRCUIT_DEFAULTS.conductorTemp;
  const wired = new Uint8Array(terminalCount);
  const wireIds: string[] = new Array(doc.wires.length);
  const wireElement = new Int32Array(doc.wires.length).fill(-1);
  const wireResistance = new Float64Array(doc.wires.length);
  // The last size, material and temperature looked up, and its resistance per metre (runs of one size are common).
  let lastSize: string | undefined;
  let lastMaterial = "";
  let lastTempC = NaN;
  let lastOhmPerM = 0;
  for (let wi = 0; wi < doc.wires.length; wi++) {
    const w = doc.wires[wi];
    wireIds[wi] = w.id;
    const before = ids.size;
    ids.set(w.id, -1);
    if (ids.size === before) {
      ids.set(w.id, firstHolder(w.id));
      issues.push({ severity: "error", code: "duplicate-id", message: `The id ${w.id} is used twice (wires and components share one list of ids).`, ids: [w.id] });
      continue;
    }
    const ia = terminalOf(w.from);
    const ib = terminalOf(w.to);
    if (ia === undefined || ib === undefined) {
      const missing = [ia === undefined ? w.from : null, ib === undefined ? w.to : null].filter(Boolean) as string[];
      issues.push({
        severity: "error",
        code: "unknown-terminal",
        message: `Wire ${w.id} goes to ${missing.join(" and ")}, which ${missing.length > 1 ? "are not terminals" : "is not a terminal"} of this circuit. Check the component id and the terminal name (${describeTerminals(missing[0], unique)}).`,
        ids: [w.id],
      });
      continue;
    }
    let r = w.resistanceOhm;
    if (r === undefined) {
      const material = (w.material ?? CIRCUIT_DEFAULTS.material) as MaterialId;
      const tempC = conductorTempC(tempChoice, ambientC, w.insulationRatingC ?? CIRCUIT_DEFAULTS.insulationRatingC);
      if (w.size !== lastSize || material !== lastMaterial || tempC !== lastTempC) {
        const key = `${w.size}|${material}|${tempC}`;
        let ohmPerM = perMetre.get(key);
        if (ohmPerM === undefined) {
          ohmPerM = conductorResistanceOhm(findSize(w.size!)!, material, 1, tempC);
          perMetre.set(key, ohmPerM);
        }
        lastSize = w.size;
        lastMaterial = material;
        lastTempC = tempC;
        lastOhmPerM = ohmPerM;
      }
      r = lastOhmPerM * (w.lengthM ?? 0);
    }
    wireResistance[wi] = r;
    wired[ia] = 1;
    wired[ib] = 1;
    wireElement[wi] = r > 0 ? add(EL.resistor, ia, ib, 1 / r, 0, w.id) : add(EL.link, ia, ib, 0, 0, w.id);
  }
  // Terminals no wire names get their names built here.
  for (let ci = 0; ci < unique.length; ci++) {
    const c = unique[ci];
    const names = TERMINALS[c.kind];
    for (let k = 0; k < names.length; k++) terminalNames[componentTerminal[ci] + k] ??= `${c.id}.${names[k]}`;
  }

  return {
    terminalNames,
    terminalComponent,
    ownerIds,
    count,
    type,
    a,
    b,
    g,
    value,
    owner,
    components: unique,
    componentElement,
    componentTerminal,
    wireIds,
    wireElement,
    wireResistance,
    wired,
    referenceTerminal: reference,
    issues,
  };
}

function describeTerminals(ref: string, components: Component[]): string {
  const cid = ref.split(".")[0];
  const c = components.find((x) => x.id === cid);
  if (!c) return `there is no component ${cid}`;
  return `${cid} is a ${c.kind} with terminals ${TERMINALS[c.kind].map((t) => `${cid}.${t}`).join(", ")}`;
}
