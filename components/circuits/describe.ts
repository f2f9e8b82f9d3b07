import type { CircuitDocument, Component, Wire } from "@/lib/circuit";

const mOhm = (ohm: number) => `${+(ohm * 1000).toPrecision(3)} mΩ`;

/** A component's settings in a line, with units (what a technician would write on the job card). */
export function describeComponent(c: Component): string {
  switch (c.kind) {
    case "battery":
      return `${c.openCircuitVoltage} V open-circuit, ${mOhm(c.internalResistance)} internal${c.cca ? `, ${c.cca} CCA` : ""}${c.capacityAh ? `, ${c.capacityAh} Ah` : ""}`;
    case "alternator":
      return `${c.regulatedVoltage} V regulated, ${c.ratedCurrent} A rated${c.enabled === false ? ", off" : ""}`;
    case "starter":
      return `${c.current !== undefined ? `${c.current} A draw` : `${mOhm(c.resistance ?? 0)}`}${c.enabled === false ? ", off" : ""}`;
    case "load":
      return `${c.value} ${c.mode === "current" ? "A" : c.mode === "power" ? "W" : "Ω"} (${c.mode === "current" ? "constant current" : c.mode === "power" ? "constant power" : "resistance"})${c.enabled === false ? ", off" : ""}`;
    case "fuse":
      return `${c.rating} A, ${mOhm(c.resistance)}`;
    case "switch":
      return `${c.closed === false ? "open" : "closed"}, ${mOhm(c.contactResistance)} contact`;
    case "joint":
      return mOhm(c.resistance);
    case "junction":
      return "one electrical point";
    case "ground":
      return c.reference ? "ground point, 0 V reference" : "ground point";
  }
}

export function describeWire(w: Wire): string {
  if (w.resistanceOhm !== undefined) return w.resistanceOhm === 0 ? "direct connection" : `${mOhm(w.resistanceOhm)} (strap, rail or block)`;
  return `${w.size}, ${w.lengthM} m${w.material && w.material !== "copper" ? `, ${w.material}` : ""}`;
}

const ROLE: Record<string, string> = { pos: "+", neg: "-", out: "B+", case: "case", in: "in", a: "a", b: "b", t: "" };

/** "B1.pos" as "Battery (750 CCA) +", for probe pickers and reading tables. */
export function terminalLabel(doc: CircuitDocument, ref: string): string {
  const [id, t] = ref.split(".");
  const c = doc.components.find((x) => x.id === id);
  if (!c) return `${ref} (no longer in the circuit)`;
  const role = ROLE[t] ?? t;
  return `${c.label ?? c.id}${role ? ` ${role}` : ""} (${ref})`;
}

export function stateName(doc: CircuitDocument, id: string): string {
  if (id === "base") return "Base (as drawn)";
  return doc.states?.find((s) => s.id === id)?.name ?? `${id} (no longer in the circuit)`;
}
