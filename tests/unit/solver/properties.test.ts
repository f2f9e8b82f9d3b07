import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { TERMINALS, type Component } from "@/lib/circuit";
import { solveCircuit } from "@/lib/solver";
import { kclMismatch, powerBalance, randomChargingCircuit, randomLinearCircuit } from "../../support/circuits";

const seeds = fc.integer({ min: 1, max: 2 ** 31 - 1 });
const sizes = fc.integer({ min: 3, max: 300 });

describe("solver properties on random connected circuits", () => {
  it("Kirchhoff's current law holds at every terminal to 1e-9 of the largest current", () => {
    fc.assert(
      fc.property(seeds, sizes, (seed, n) => {
        const doc = randomLinearCircuit(seed, n);
        const r = solveCircuit(doc);
        expect(r.status).toBe("ok");
        const { worst, largest } = kclMismatch(doc, r);
        // Relative to the largest current, with a 1 A floor so that round-off in a circuit where nothing flows passes.
        expect(worst).toBeLessThanOrEqual(1e-9 * Math.max(largest, 1));
      }),
      { numRuns: 60 },
    );
  });

  it("power delivered equals power dissipated to 1e-9 relative", () => {
    fc.assert(
      fc.property(seeds, sizes, (seed, n) => {
        const r = solveCircuit(randomLinearCircuit(seed, n));
        const { net, scale } = powerBalance(r);
        // A 1 W floor: a battery's current is (V - E) / r, and round-off in V (about 1e-15 x 12 V) over a few
        // milliohms is about 1e-12 A, which only matters when almost nothing flows.
        expect(Math.abs(net)).toBeLessThanOrEqual(1e-9 * Math.max(scale, 1));
      }),
      { numRuns: 60 },
    );
  });

  it("with batteries and resistances only, scaling every battery voltage scales every voltage and current", () => {
    fc.assert(
      fc.property(seeds, sizes, fc.double({ min: 0.1, max: 3, noNaN: true }), (seed, n, k) => {
        const doc = randomLinearCircuit(seed, n, { currentLoads: false });
        const scaled = structuredClone(doc);
        scaled.components = scaled.components.map((c: Component) => (c.kind === "battery" ? { ...c, openCircuitVoltage: c.openCircuitVoltage * k } : c));
        const a = solveCircuit(doc);
        const b = solveCircuit(scaled);
        let vmax = 0;
        for (const v of Object.values(a.terminals)) vmax = Math.max(vmax, Math.abs(v));
        for (const [t, v] of Object.entries(a.terminals)) expect(Math.abs(b.terminals[t] - k * v)).toBeLessThanOrEqual(1e-9 * k * vmax);
        let imax = 0;
        for (const w of Object.values(a.wires)) imax = Math.max(imax, Math.abs(w.current));
        for (const [id, w] of Object.entries(a.wires)) expect(Math.abs(b.wires[id].current - k * w.current)).toBeLessThanOrEqual(1e-9 * k * imax + 1e-12); // 1e-12 A floor: round-off when nothing flows
      }),
      { numRuns: 40 },
    );
  });

  it("with alternators and constant-power loads, every alternator's mode is the one its current and voltage call for", () => {
    fc.assert(
      fc.property(seeds, sizes, (seed, n) => {
        const doc = randomChargingCircuit(seed, n);
        const r = solveCircuit(doc);
        expect(r.issues.filter((i) => i.severity === "error")).toEqual([]);
        const { worst, largest } = kclMismatch(doc, r);
        expect(worst).toBeLessThanOrEqual(1e-9 * Math.max(largest, 1));
        const { net, scale } = powerBalance(r);
        expect(Math.abs(net)).toBeLessThanOrEqual(1e-9 * Math.max(scale, 1));
        // The alternator model of the circuit document (regulate between 0 and the rated current, else hold the
        // rated current, never sink current): common practice (no source) for a charging-system model.
        for (const c of doc.components) {
          if (c.kind !== "alternator") continue;
          const res = r.components[c.id];
          const delivered = -(res.current ?? 0);
          const volts = res.voltage;
          if (res.mode === "regulating") {
            expect(Math.abs(volts - c.regulatedVoltage)).toBeLessThanOrEqual(1e-9);
            expect(delivered).toBeGreaterThanOrEqual(-1e-6);
            expect(delivered).toBeLessThanOrEqual(c.ratedCurrent + 1e-6);
          } else if (res.mode === "current-limit") {
            expect(Math.abs(delivered - c.ratedCurrent)).toBeLessThanOrEqual(1e-9 * c.ratedCurrent);
            expect(volts).toBeLessThanOrEqual(c.regulatedVoltage + 1e-6);
          } else {
            expect(res.mode).toBe("blocked");
            expect(res.current).toBe(0);
            expect(volts).toBeGreaterThanOrEqual(c.regulatedVoltage - 1e-6);
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it("never gives NaN or Infinity, whatever is cut, shorted or switched", () => {
    fc.assert(
      fc.property(seeds, fc.integer({ min: 3, max: 80 }), fc.array(fc.nat(), { maxLength: 6 }), fc.array(fc.nat(), { maxLength: 4 }), (seed, n, cuts, zeros) => {
        const doc = randomLinearCircuit(seed, n);
        for (const c of cuts) doc.wires.splice(c % Math.max(doc.wires.length, 1), 1);
        for (const z of zeros) if (doc.wires.length) doc.wires[z % doc.wires.length] = { ...doc.wires[z % doc.wires.length], resistanceOhm: 0 };
        doc.components.push({ id: "A9", kind: "alternator", regulatedVoltage: 14.2, ratedCurrent: 20 } as Component, { id: "P9", kind: "load", mode: "power", value: 50 } as Component);
        const t = TERMINALS.alternator;
        doc.wires.push({ id: "WA", from: `A9.${t[0]}`, to: doc.wires[0]?.from ?? "G0.t", resistanceOhm: 0.01 }, { id: "WB", from: "A9.case", to: "G0.t", resistanceOhm: 0.001 });
        doc.wires.push({ id: "WP", from: "P9.pos", to: "B0.pos", resistanceOhm: 0.02 }, { id: "WQ", from: "P9.neg", to: "G0.t", resistanceOhm: 0.01 });
        const r = solveCircuit(doc);
        expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity|null/);
      }),
      { numRuns: 80 },
    );
  });
});
