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
  const terminalNames: string[] = [];
  const componentIndex = new Map<string, number>();
  const seen = new Map<string, string>();
  const unique: Component[] = [];
  for (const c of components) {
    if (seen.has(c.id)) {
      issues.push({ severity: "error", code: "duplicate-id", message: `Two components are called ${c.id}; give each its own id.`, ids: [c.id] });
      continue;
    }
    seen.set(c.id, "component");
    componentIndex.set(c.id, unique.length);
    unique.push(c);
    for (const t of TERMINALS[c.kind]) terminalNames.push(`${c.id}.${t}`);
  }

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
    const t1 = TERMINALS[c.kind].length > 1 ? t0 + 1 : -1;
    nextTerminal += TERMINALS[c.kind].length;
    componentTerminal[ci] = t0;
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
  if (reference < 0) reference = firstBatteryNeg >= 0 ? firstBatteryNeg : terminalNames.length > 0 ? 0 : -1;

  // "B1.pos" -> the terminal's index: one lookup in a map of every terminal's name (terminals are numbered in the
  // order their names were listed).
  const terminalIndex = new Map<string, number>();
  for (let t = 0; t < terminalNames.length; t++) terminalIndex.set(terminalNames[t], t);
  const terminalOf = (ref: string): number | undefined => terminalIndex.get(ref);
  // Resistance per metre by size, material and conductor temperature: a harness repeats a few sizes many times.
  const perMetre = new Map<string, number>();
  const ambientC = doc.ambientC ?? CIRCUIT_DEFAULTS.ambientC;
  const tempChoice = doc.conductorTemp ?? CIRCUIT_DEFAULTS.conductorTemp;
  const wired = new Uint8Array(terminalNames.length);
  const wireIds: string[] = [];
  const wireElement = new Int32Array(doc.wires.length).fill(-1);
  const wireResistance = new Float64Array(doc.wires.length);
  doc.wires.forEach((w, wi) => {
    wireIds.push(w.id);
    if (seen.has(w.id)) {
      issues.push({ severity: "error", code: "duplicate-id", message: `The id ${w.id} is used twice (wires and components share one list of ids).`, ids: [w.id] });
      return;
    }
    seen.set(w.id, "wire");
    const ia = terminalOf(w.from);
    const ib = terminalOf(w.to);
    const missing = [ia === undefined ? w.from : null, ib === undefined ? w.to : null].filter(Boolean) as string[];
    if (missing.length) {
      issues.push({
        severity: "error",
        code: "unknown-terminal",
        message: `Wire ${w.id} goes to ${missing.join(" and ")}, which ${missing.length > 1 ? "are not terminals" : "is not a terminal"} of this circuit. Check the component id and the terminal name (${describeTerminals(missing[0], unique)}).`,
        ids: [w.id],
      });
      return;
    }
    let r = w.resistanceOhm;
    if (r === undefined) {
      const material = (w.material ?? CIRCUIT_DEFAULTS.material) as MaterialId;
      const tempC = conductorTempC(tempChoice, ambientC, w.insulationRatingC ?? CIRCUIT_DEFAULTS.insulationRatingC);
      const key = `${w.size}|${material}|${tempC}`;
      let ohmPerM = perMetre.get(key);
      if (ohmPerM === undefined) {
        ohmPerM = conductorResistanceOhm(findSize(w.size!)!, material, 1, tempC);
        perMetre.set(key, ohmPerM);
      }
      r = ohmPerM * (w.lengthM ?? 0);
    }
    wireResistance[wi] = r;
    wired[ia as number] = 1;
    wired[ib as number] = 1;
    wireElement[wi] = r > 0 ? add(EL.resistor, ia as number, ib as number, 1 / r, 0, w.id) : add(EL.link, ia as number, ib as number, 0, 0, w.id);
  });

  return {
    terminalNames,
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
