import { describe, expect, it } from "vitest";
import { solveCircuit } from "@/lib/solver";
import { randomLinearCircuit } from "../../support/circuits";
import { hasNgspice, runNgspice, toSpiceDeck } from "../../support/spice";

// Oracle: ngspice, a general-purpose circuit simulator (Debian package ngspice), DC operating point in batch
// mode. npm test installs it when missing; without it this suite fails rather than passing silently.
describe("agreement with ngspice on random linear circuits", () => {
  it("ngspice is installed", () => {
    expect(hasNgspice()).toBe(true);
  });

  const cases = Array.from({ length: 40 }, (_, i) => ({ seed: 1000 + i * 7919, size: 5 + ((i * 37) % 116) }));
  it.each(cases)("seed $seed, $size components: every terminal within 1 microvolt", ({ seed, size }) => {
    const doc = randomLinearCircuit(seed, size);
    const ours = solveCircuit(doc);
    expect(ours.status).toBe("ok");
    const { deck, nodeOf } = toSpiceDeck(doc, ours.reference!);
    const { voltages } = runNgspice(deck);
    let worst = 0;
    for (const [terminal, v] of Object.entries(ours.terminals)) {
      const node = nodeOf.get(terminal)!;
      const spice = node === "0" ? 0 : voltages.get(node);
      expect(spice, `ngspice has no voltage for ${terminal}`).toBeTypeOf("number");
      worst = Math.max(worst, Math.abs(v - (spice as number)));
    }
    expect(worst).toBeLessThan(1e-6);
  });
});
