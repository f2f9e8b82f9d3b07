import { TERMINALS, type CircuitDocument, type Component, type OperatingState, type Wire } from "@/lib/circuit";
import { INSULATION_TYPES, LOAD_EFFICIENCY, sizeCable, type Duty, type SizeFamily, type SizingAnswer } from "@/lib/conductors";
import { freeSpot, nextId } from "./edit";

/** Where an added load may take its power: a battery post, a bus bar or stud, a fuse block's output, a switched feed. */
const TAP_KINDS = new Set(["battery", "junction", "fuse", "switch", "alternator"]);
/** Where it may ground: a ground point, a battery negative, or any junction on the ground side. */
const GROUND_KINDS = new Set(["ground", "battery", "junction"]);

/** Length of the short cable from the tap to the new fuse: inside the 18 cm of the placement rule (33 CFR 183.455). */
export const TAP_LEAD_M = 0.15;

export type AddLoadInput = {
  label: string;
  /** Terminal the feed taps, e.g. "B1.pos" or "N2.t". */
  tap: string;
  /** Terminal the load's return lands on, e.g. "G1.t" or "B1.neg". */
  ground: string;
  demand: { mode: "current" | "power"; value: number };
  /** Of a power demand: its output over its input (an inverter's); LOAD_EFFICIENCY when not given. */
  efficiency?: number;
  duty: Duty;
  /** One-way length of the feed from the fuse to the load, m. */
  feedLengthM: number;
  /** Length of the load's ground cable, m. */
  groundLengthM: number;
  zone: "cabin" | "engine" | "underbody";
  insulation: string;
  family: SizeFamily;
  circuitClass: "critical" | "non-critical";
  /** The state the load is switched on in: a new state made from this one ("base" or a state id) with the load on. */
  fromState: string;
  stateName: string;
};

export type AddLoadPlan =
  | { ok: true; doc: CircuitDocument; sizing: SizingAnswer; stateId: string; ids: { fuse: string; load: string; wires: string[] }; size: string; fuseA: number }
  | { ok: false; message: string; field?: keyof AddLoadInput };

function splitTerminal(ref: string): { component: string; terminal: string } | null {
  const dot = ref.lastIndexOf(".");
  return dot > 0 ? { component: ref.slice(0, dot), terminal: ref.slice(dot + 1) } : null;
}

/** The terminals a load may tap and ground to, with a readable name, for the form's lists. */
export function tapChoices(doc: CircuitDocument): { tap: { ref: string; name: string }[]; ground: { ref: string; name: string }[] } {
  const name = (c: Component, role: string) => `${c.id}${c.label ? ` (${c.label})` : ""} ${role}`;
  const tap: { ref: string; name: string }[] = [];
  const ground: { ref: string; name: string }[] = [];
  for (const c of doc.components) {
    const terms = TERMINALS[c.kind] as readonly string[];
    if (TAP_KINDS.has(c.kind)) {
      // The output side of a fuse or switch, the B+ of an alternator, the positive post, a bus bar.
      const t = c.kind === "battery" ? "pos" : c.kind === "alternator" ? "out" : c.kind === "junction" ? "t" : terms[1];
      tap.push({ ref: `${c.id}.${t}`, name: name(c, c.kind === "battery" ? "+ post" : c.kind === "alternator" ? "B+" : c.kind === "junction" ? "" : `${t} side`).trim() });
    }
    if (GROUND_KINDS.has(c.kind)) {
      const t = c.kind === "battery" ? "neg" : "t";
      ground.push({ ref: `${c.id}.${t}`, name: name(c, c.kind === "battery" ? "- post" : "").trim() });
    }
  }
  return { tap, ground };
}

function stateIdFor(doc: CircuitDocument, name: string): string {
  const taken = new Set(["base", ...(doc.states ?? []).map((s) => s.id)]);
  const stem = name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "added-load";
  if (!taken.has(stem)) return stem;
  for (let n = 2; ; n++) if (!taken.has(`${stem}-${n}`)) return `${stem}-${n}`;
}

/**
 * Adds a load with its own fuse and cables to a circuit: the fuse at the tap (placement rule), the feed and ground
 * cables sized by the conductor engine for the load's current, duty and route, the load off in every existing
 * state and on in a new one made from the chosen state. Nothing in the document is changed unless all of it fits.
 */
export function planAddedLoad(doc: CircuitDocument, input: AddLoadInput): AddLoadPlan {
  const ids = new Set(doc.components.map((c) => c.id));
  const tap = splitTerminal(input.tap);
  const gnd = splitTerminal(input.ground);
  const isTerminal = (t: { component: string; terminal: string } | null) => {
    const c = t && doc.components.find((x) => x.id === t.component);
    return Boolean(c && (TERMINALS[c.kind] as readonly string[]).includes(t!.terminal));
  };
  if (!isTerminal(tap)) return { ok: false, message: `Choose where the load takes its power: ${input.tap || "nothing"} is not a terminal of this circuit.`, field: "tap" };
  if (!isTerminal(gnd)) return { ok: false, message: `Choose where the load grounds: ${input.ground || "nothing"} is not a terminal of this circuit.`, field: "ground" };
  if (input.tap === input.ground) return { ok: false, message: "The feed and the ground cannot land on the same terminal.", field: "ground" };
  if (!(input.demand.value > 0)) return { ok: false, message: "The load needs a current or a power above zero.", field: "demand" };
  if (!(input.feedLengthM > 0)) return { ok: false, message: "The feed needs a length above zero.", field: "feedLengthM" };
  if (!(input.groundLengthM > 0)) return { ok: false, message: "The ground cable needs a length above zero.", field: "groundLengthM" };
  if (input.fromState !== "base" && !(doc.states ?? []).some((s) => s.id === input.fromState)) return { ok: false, message: `There is no state ${input.fromState} to start from.`, field: "fromState" };
  const stateName = input.stateName.trim();
  if (!stateName) return { ok: false, message: "Name the state the load is on in, e.g. Winch pulling.", field: "stateName" };

  // The same engine call as the sizing page: a power goes in as a power, with its efficiency (a power load draws a
  // little more when the voltage sags; the circuit's solve shows that).
  const efficiency = input.demand.mode === "power" ? (input.efficiency ?? LOAD_EFFICIENCY) : undefined;
  const rating = INSULATION_TYPES.find((t) => t.id === input.insulation)?.ratingC ?? 105;
  // Feed and ground are the same size, so the two-wire sizing runs over their mean length: the same total copper.
  const sizing = sizeCable({
    systemVoltage: doc.systemVoltage,
    ...(input.demand.mode === "current" ? { currentA: input.demand.value } : { powerW: input.demand.value, efficiency }),
    lengthM: (input.feedLengthM + input.groundLengthM + TAP_LEAD_M) / 2,
    circuitClass: input.circuitClass,
    zone: input.zone,
    insulationRatingC: rating,
    family: input.family,
    duty: input.duty,
    returnPath: "two-wire",
  });
  if (!sizing.recommended || !sizing.protection) return { ok: false, message: sizing.reason, field: "feedLengthM" };
  const size = sizing.recommended.size;
  const fuseA = sizing.protection.ratingA;

  const taken = new Set<string>();
  const fuseId = nextId(doc, "fuse", taken);
  taken.add(fuseId);
  const loadId = nextId(doc, "load", taken);
  taken.add(loadId);
  const wireIds: string[] = [];
  const used = new Set([...ids, ...doc.wires.map((w) => w.id), ...taken]);
  for (let n = 1; wireIds.length < 3; n++) if (!used.has(`W${n}`)) wireIds.push(`W${n}`);

  const at = doc.components.find((c) => c.id === tap!.component)?.position ?? { x: 0, y: 0 };
  let working: CircuitDocument = doc;
  const place = (p: { x: number; y: number }) => freeSpot(working, p);
  const fusePos = place({ x: at.x + 160, y: at.y - 120 });
  const fuse: Component = { id: fuseId, kind: "fuse", label: `${input.label} fuse`, position: fusePos, rating: fuseA, resistance: fuseA > 40 ? 0.0002 : 0.002 };
  working = { ...working, components: [...working.components, fuse] };
  const loadPos = place({ x: fusePos.x + 240, y: fusePos.y });
  // A power load draws its output over its efficiency from the battery.
  const drawn = input.demand.mode === "power" ? input.demand.value / (efficiency ?? 1) : input.demand.value;
  const load: Component = { id: loadId, kind: "load", label: input.label, position: loadPos, mode: input.demand.mode, value: drawn, enabled: false };
  const route = { size, material: "copper" as const, insulationRatingC: rating, bundleSize: 1, zone: input.zone };
  const wires: Wire[] = [
    { id: wireIds[0], from: input.tap, to: `${fuseId}.a`, lengthM: TAP_LEAD_M, ...route },
    { id: wireIds[1], from: `${fuseId}.b`, to: `${loadId}.pos`, lengthM: input.feedLengthM, ...route },
    { id: wireIds[2], from: `${loadId}.neg`, to: input.ground, lengthM: input.groundLengthM, ...route },
  ];
  const stateId = stateIdFor(doc, stateName);
  const from = (doc.states ?? []).find((s) => s.id === input.fromState);
  const state: OperatingState = { id: stateId, name: stateName, set: { ...(from?.set ?? {}), [loadId]: { enabled: true } } };
  return {
    ok: true,
    doc: { ...doc, components: [...doc.components, fuse, load], wires: [...doc.wires, ...wires], states: [...(doc.states ?? []), state] },
    sizing,
    stateId,
    ids: { fuse: fuseId, load: loadId, wires: wireIds },
    size,
    fuseA,
  };
}
