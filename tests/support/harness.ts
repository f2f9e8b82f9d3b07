import type { CircuitDocument, Component, Wire } from "@/lib/circuit";
import { rng } from "./circuits";

/**
 * A synthetic harness of about `target` components: three batteries in parallel and an alternator on a main bus,
 * a ladder of cables and joints along the vehicle, at each rung a fused branch to a load grounded to a local
 * point, and the local grounds chained along the frame back to the battery ground (star and chain grounds).
 * `linear` leaves out the alternator and constant-power loads (for the ngspice deck).
 */
export function harnessCircuit(target: number, opts: { linear?: boolean; seed?: number } = {}): CircuitDocument {
  const r = rng(opts.seed ?? 7);
  const components: Component[] = [];
  const wires: Wire[] = [];
  let w = 0;
  const wire = (from: string, to: string, extra: Partial<Wire>) => wires.push({ id: `W${++w}`, from, to, ...extra } as Wire);
  const cable = (from: string, to: string, size: string, lengthM: number) => wire(from, to, { size, lengthM, material: "copper" });
  const strap = (from: string, to: string, ohm: number) => wire(from, to, { resistanceOhm: ohm });
  components.push({ id: "G0", kind: "ground", reference: true } as Component, { id: "BUS", kind: "junction" } as Component);
  for (let b = 1; b <= 3; b++) {
    components.push({ id: `B${b}`, kind: "battery", openCircuitVoltage: 12.5 + 0.05 * b, internalResistance: 0.006 + 0.001 * b, cca: 900 } as Component);
    cable(`B${b}.pos`, "BUS.t", "2/0 AWG", 0.6);
    cable(`B${b}.neg`, "G0.t", "2/0 AWG", 0.6);
  }
  if (!opts.linear) {
    components.push({ id: "A1", kind: "alternator", regulatedVoltage: 14.2, ratedCurrent: 160 } as Component, { id: "GE", kind: "ground" } as Component);
    cable("A1.out", "BUS.t", "4 AWG", 1.5);
    strap("A1.case", "GE.t", 0.0004);
    strap("GE.t", "G0.t", 0.0008);
  }
  let prevNode = "BUS.t";
  let prevGround = "G0.t";
  let k = 0;
  while (components.length < target) {
    k++;
    const j = `J${k}`;
    const n = `N${k}`;
    const f = `F${k}`;
    const l = `L${k}`;
    const g = `G${k}`;
    components.push({ id: j, kind: "joint", resistance: 0.0002 + r() * 0.001 } as Component, { id: n, kind: "junction" } as Component);
    cable(prevNode, `${j}.a`, "8 AWG", 0.3 + r());
    cable(`${j}.b`, `${n}.t`, "8 AWG", 0.1);
    const kind = r();
    const load: Component =
      kind < 0.5
        ? ({ id: l, kind: "load", mode: "resistance", value: 20 + r() * 200 } as Component)
        : kind < 0.85 || opts.linear
          ? ({ id: l, kind: "load", mode: "current", value: 0.05 + r() * 0.5 } as Component)
          : ({ id: l, kind: "load", mode: "power", value: 1 + r() * 8 } as Component);
    components.push({ id: f, kind: "fuse", rating: 10, resistance: 0.003 } as Component, load, { id: g, kind: "ground" } as Component);
    cable(`${n}.t`, `${f}.a`, "16 AWG", 0.2);
    cable(`${f}.b`, `${l}.pos`, "16 AWG", 0.5 + 3 * r());
    cable(`${l}.neg`, `${g}.t`, "16 AWG", 0.3);
    strap(`${g}.t`, prevGround, 0.0003 + r() * 0.0005);
    // Every fifth ground also goes straight back to the battery ground (a star point).
    if (k % 5 === 0) strap(`${g}.t`, "G0.t", 0.002);
    prevNode = `${n}.t`;
    prevGround = `${g}.t`;
  }
  return { schema: "ampwright.circuit/1", name: `harness ${target}`, systemVoltage: 12, ambientC: 25, components, wires };
}
