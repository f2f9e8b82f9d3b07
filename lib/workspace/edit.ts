import { stateIdsOf, TERMINALS, type CircuitDocument, type Component, type ComponentKind, type OperatingState, type Wire } from "@/lib/circuit";

/** Id prefixes by kind, as a technician labels a sketch: B1, A1, M1 (motor), L1, F1, S1, J1 (joint), N1 (node), G1. */
export const ID_PREFIX: Record<ComponentKind, string> = {
  battery: "B",
  alternator: "A",
  starter: "M",
  load: "L",
  fuse: "F",
  switch: "S",
  joint: "J",
  junction: "N",
  ground: "G",
};

export const KIND_NAMES: Record<ComponentKind, string> = {
  battery: "Battery",
  alternator: "Alternator",
  starter: "Starter motor",
  load: "Load",
  fuse: "Fuse",
  switch: "Switch",
  joint: "Joint (connection)",
  junction: "Junction or bus bar",
  ground: "Ground point",
};

/** The next free id for a kind: the lowest number its prefix does not use yet. */
export function nextId(doc: CircuitDocument, kind: ComponentKind, taken: Set<string> = new Set()): string {
  const used = new Set([...doc.components.map((c) => c.id), ...doc.wires.map((w) => w.id), ...taken]);
  const prefix = ID_PREFIX[kind];
  for (let n = 1; ; n++) if (!used.has(`${prefix}${n}`)) return `${prefix}${n}`;
}

function nextWireId(doc: CircuitDocument, taken: Set<string> = new Set()): string {
  const used = new Set([...doc.components.map((c) => c.id), ...doc.wires.map((w) => w.id), ...taken]);
  for (let n = 1; ; n++) if (!used.has(`W${n}`)) return `W${n}`;
}

/**
 * A new part with starting values scaled to the system voltage (typical values to edit, not measurements: the
 * properties panel is where the real ones go).
 */
export function newComponent(kind: ComponentKind, id: string, position: { x: number; y: number }, systemVoltage: number): Component {
  const k = systemVoltage / 12;
  const base = { id, position: { x: Math.round(position.x), y: Math.round(position.y) } };
  switch (kind) {
    case "battery":
      return { ...base, kind, openCircuitVoltage: +(12.6 * k).toFixed(2), internalResistance: 0.006 * k };
    case "alternator":
      return { ...base, kind, regulatedVoltage: +(14.2 * k).toFixed(2), ratedCurrent: 120, enabled: true };
    case "starter":
      // Off in the base state: a starter cranks in its own state (see addComponent), never while the engine charges.
      return { ...base, kind, current: 200, enabled: false };
    case "load":
      return { ...base, kind, mode: "current", value: 10, enabled: true };
    case "fuse":
      return { ...base, kind, rating: 30, resistance: 0.002 };
    case "switch":
      return { ...base, kind, closed: true, contactResistance: 0.001 };
    case "joint":
      return { ...base, kind, resistance: 0.0005 };
    case "junction":
      return { ...base, kind };
    case "ground":
      return { ...base, kind };
  }
}

/** The state a circuit cranks in: one whose id or name says so. */
export function crankingState(doc: CircuitDocument): OperatingState | undefined {
  return (doc.states ?? []).find((s) => /crank/i.test(`${s.id} ${s.name}`));
}

/**
 * Adds a part. A starter is off in the base state and on in a cranking state (made, named "Cranking", when the
 * circuit has none), where every alternator is off: the engine does not charge while it cranks. An alternator
 * added later is off in that state too.
 */
export function addComponent(doc: CircuitDocument, kind: ComponentKind, position: { x: number; y: number }): { doc: CircuitDocument; id: string } {
  const id = nextId(doc, kind);
  let next: CircuitDocument = { ...doc, components: [...doc.components, newComponent(kind, id, position, doc.systemVoltage)] };
  if (kind === "starter" || kind === "alternator") {
    const crank = crankingState(next);
    const on = kind === "starter";
    if (crank) {
      next = { ...next, states: (next.states ?? []).map((s) => (s === crank ? { ...s, set: { ...s.set, [id]: { ...(s.set[id] ?? {}), enabled: on } } } : s)) };
    } else if (on) {
      const taken = new Set(stateIdsOf(next));
      const stateId = taken.has("crank") ? `crank-${taken.size}` : "crank";
      const alternatorsOff = Object.fromEntries(next.components.filter((c) => c.kind === "alternator").map((c) => [c.id, { enabled: false }]));
      next = { ...next, states: [...(next.states ?? []), { id: stateId, name: "Cranking", set: { ...alternatorsOff, [id]: { enabled: true } } }] };
    }
  }
  return { doc: next, id };
}

/** Joins two terminals with a cable of a common size; refuses a terminal to itself and a second identical wire. */
export function addWire(doc: CircuitDocument, from: string, to: string): { doc: CircuitDocument; id?: string; refused?: string } {
  if (from === to) return { doc, refused: "A cable needs two different terminals." };
  if (doc.wires.some((w) => (w.from === from && w.to === to) || (w.from === to && w.to === from))) return { doc, refused: `${from} and ${to} are joined already.` };
  const id = nextWireId(doc);
  // A cable to a starter or an alternator runs in the engine compartment; any other starts in the cabin.
  const engine = [from, to].some((t) => ["starter", "alternator"].includes(doc.components.find((c) => c.id === t.slice(0, t.lastIndexOf(".")))?.kind ?? ""));
  const wire: Wire = { id, from, to, size: "10 AWG", material: "copper", lengthM: 1, zone: engine ? "engine" : "cabin" };
  return { doc: { ...doc, wires: [...doc.wires, wire] }, id };
}

/** Removes parts and cables; a removed part takes its cables and its lines in the operating states with it. */
export function removeItems(doc: CircuitDocument, componentIds: string[], wireIds: string[]): CircuitDocument {
  const gone = new Set(componentIds);
  const goneWires = new Set(wireIds);
  const ownerOf = (ref: string) => ref.slice(0, ref.indexOf("."));
  return {
    ...doc,
    components: doc.components.filter((c) => !gone.has(c.id)),
    wires: doc.wires.filter((w) => !goneWires.has(w.id) && !gone.has(ownerOf(w.from)) && !gone.has(ownerOf(w.to))),
    ...(doc.states
      ? { states: doc.states.map((s) => ({ ...s, set: Object.fromEntries(Object.entries(s.set).filter(([id]) => !gone.has(id))) })) }
      : {}),
  };
}

export function updateComponent(doc: CircuitDocument, id: string, next: Component): CircuitDocument {
  return { ...doc, components: doc.components.map((c) => (c.id === id ? next : c)) };
}

export function updateWire(doc: CircuitDocument, id: string, next: Wire): CircuitDocument {
  return { ...doc, wires: doc.wires.map((w) => (w.id === id ? next : w)) };
}

export function moveComponents(doc: CircuitDocument, positions: Map<string, { x: number; y: number }>): CircuitDocument {
  if (!positions.size) return doc;
  return {
    ...doc,
    components: doc.components.map((c) => {
      const p = positions.get(c.id);
      return p ? { ...c, position: { x: Math.round(p.x), y: Math.round(p.y) } } : c;
    }),
  };
}

export type Clip = { components: Component[]; wires: Wire[] };

/** The chosen parts and the cables that run between two of them, for copy and duplicate. */
export function copyItems(doc: CircuitDocument, componentIds: string[]): Clip {
  const ids = new Set(componentIds);
  const owner = (ref: string) => ref.slice(0, ref.indexOf("."));
  return {
    components: doc.components.filter((c) => ids.has(c.id)),
    wires: doc.wires.filter((w) => ids.has(owner(w.from)) && ids.has(owner(w.to))),
  };
}

/** Pastes a clip with fresh ids, shifted so it does not sit on the original; returns the new part ids. */
export function pasteItems(doc: CircuitDocument, clip: Clip, offset = { x: 40, y: 40 }): { doc: CircuitDocument; ids: string[] } {
  const rename = new Map<string, string>();
  const taken = new Set<string>();
  const components = clip.components.map((c) => {
    const id = nextId(doc, c.kind, taken);
    taken.add(id);
    rename.set(c.id, id);
    const p = c.position ?? { x: 0, y: 0 };
    return { ...c, id, position: { x: p.x + offset.x, y: p.y + offset.y } } as Component;
  });
  const re = (ref: string) => {
    const [id, t] = ref.split(".");
    return `${rename.get(id) ?? id}.${t}`;
  };
  const wires = clip.wires.map((w) => {
    const id = nextWireId(doc, taken);
    taken.add(id);
    return { ...w, id, from: re(w.from), to: re(w.to) };
  });
  return { doc: { ...doc, components: [...doc.components, ...components], wires: [...doc.wires, ...wires] }, ids: components.map((c) => c.id) };
}

/** Where a part's terminals are, for the canvas's handles: first terminal first. */
export function terminalsOfKind(kind: ComponentKind): readonly string[] {
  return TERMINALS[kind];
}

/** Places parts that have no position yet on a grid, so an imported document still draws. */
export function withPositions(doc: CircuitDocument): CircuitDocument {
  if (doc.components.every((c) => c.position)) return doc;
  let i = 0;
  return {
    ...doc,
    components: doc.components.map((c) => (c.position ? c : { ...c, position: { x: 40 + (i % 5) * 200, y: 40 + Math.floor(i++ / 5) * 140 } })),
  };
}

/** The nearest spot to `pos` (on a 20 grid) where a new part does not sit on another one. */
export function freeSpot(doc: CircuitDocument, pos: { x: number; y: number }): { x: number; y: number } {
  const snap = (v: number) => Math.round(v / 20) * 20;
  const taken = doc.components.map((c) => c.position).filter((p): p is { x: number; y: number } => Boolean(p));
  const clear = (x: number, y: number) => taken.every((p) => Math.abs(p.x - x) >= 160 || Math.abs(p.y - y) >= 120);
  for (let ring = 0; ring < 12; ring++) {
    for (let dx = -ring; dx <= ring; dx++) {
      for (let dy = -ring; dy <= ring; dy++) {
        if (Math.max(Math.abs(dx), Math.abs(dy)) !== ring) continue;
        const x = snap(pos.x + dx * 80);
        const y = snap(pos.y + dy * 60);
        if (clear(x, y)) return { x, y };
      }
    }
  }
  return { x: snap(pos.x), y: snap(pos.y) };
}
