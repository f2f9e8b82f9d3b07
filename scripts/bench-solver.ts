/**
 * npm run bench: the solver's speed on synthetic harnesses of 100 to 100,000 components, the sparse kernel
 * against mathjs's sparse LU on the same ladder, and ngspice on the 10,000-component circuit. Prints figures;
 * it is not a test.
 */
import { spawnSync } from "node:child_process";
import { lusolve, matrix } from "mathjs";
import { solveCircuit } from "../lib/solver";
import { buildPattern, minimumDegree, numeric, position, solveFactored, symbolic } from "../lib/solver/sparse";
import { harnessCircuit } from "../tests/support/harness";
import { runNgspice, toSpiceDeck } from "../tests/support/spice";

const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const mb = (bytes: number) => `${Math.round(bytes / 1e6)} MB`;

function time<T>(fn: () => T, runs: number): { ms: number; last: T } {
  const times: number[] = [];
  let last: T | undefined;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    last = fn();
    times.push(performance.now() - t0);
  }
  return { ms: median(times), last: last as T };
}

console.log("Solver on synthetic harnesses (median of runs; warm)");
console.log("(same: the one document solved again, as the workspace does; fresh: a new copy parsed from JSON before each");
console.log(" run, untimed, as the API receives it)");
console.log("components  wires  unknowns  ms (median)  ms (best)  fresh ms (median)  newton  active-set  status  peak RSS");
for (const n of [100, 1_000, 10_000, 100_000]) {
  const doc = harnessCircuit(n);
  const json = JSON.stringify(doc);
  const runs = n >= 100_000 ? 5 : n >= 10_000 ? 11 : 31;
  for (let i = 0; i < 3; i++) solveCircuit(doc); // warm up the JIT
  const times: number[] = [];
  const fresh: number[] = [];
  let res = solveCircuit(doc);
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    res = solveCircuit(doc);
    times.push(performance.now() - t0);
    const copy = JSON.parse(json) as typeof doc;
    const t1 = performance.now();
    solveCircuit(copy);
    fresh.push(performance.now() - t1);
  }
  const unknowns = Object.keys(res.terminals).length;
  console.log(
    [
      String(doc.components.length).padStart(10),
      String(doc.wires.length).padStart(6),
      String(unknowns).padStart(9),
      median(times).toFixed(2).padStart(12),
      Math.min(...times).toFixed(2).padStart(10),
      median(fresh).toFixed(2).padStart(18),
      String(res.iterations).padStart(7),
      String(res.activeSetPasses).padStart(11),
      res.status.padStart(7),
      mb(process.resourceUsage().maxRSS * 1024).padStart(9),
    ].join(" "),
  );
}

// The linear algebra alone: a grounded resistor ladder, our kernel against mathjs's sparse LU.
console.log("\nLinear solve of a grounded ladder: this kernel vs mathjs lusolve (sparse)");
for (const n of [1_000, 10_000]) {
  const ea = new Int32Array(n - 1).map((_, i) => i);
  const eb = new Int32Array(n - 1).map((_, i) => i + 1);
  const ours = time(() => {
    const p = buildPattern(n, ea, eb, n - 1);
    const ax = new Float64Array(p.rowIdx.length);
    for (let i = 0; i < n - 1; i++) {
      ax[position(p, i, i)] += 1;
      ax[position(p, i + 1, i + 1)] += 1;
      ax[position(p, i, i + 1)] -= 1;
      ax[position(p, i + 1, i)] -= 1;
    }
    for (let i = 0; i < n; i++) ax[position(p, i, i)] += 0.01;
    const s = symbolic(p, minimumDegree(p));
    numeric(p, ax, s);
    const b = new Float64Array(n).fill(1);
    const x = new Float64Array(n);
    solveFactored(s, b, x);
    return x[0];
  }, 11);
  const mjs = time(() => {
    const m = matrix("sparse");
    m.resize([n, n]);
    for (let i = 0; i < n; i++) m.set([i, i], (i > 0 ? 1 : 0) + (i < n - 1 ? 1 : 0) + 0.01);
    for (let i = 0; i < n - 1; i++) {
      m.set([i, i + 1], -1);
      m.set([i + 1, i], -1);
    }
    return lusolve(m, matrix(new Array(n).fill(1)));
  }, n >= 10_000 ? 3 : 7);
  console.log(`  ${String(n).padStart(6)} nodes: ours ${ours.ms.toFixed(2)} ms, mathjs ${mjs.ms.toFixed(1)} ms`);
}

// ngspice on the same 10,000-component circuit (the linear variant: no alternator, no constant-power loads).
const linear = harnessCircuit(10_000, { linear: true });
const ours = time(() => solveCircuit(linear), 11);
if (spawnSync("ngspice", ["-v"]).status === null || spawnSync("which", ["ngspice"]).status !== 0) {
  console.log("\nngspice not installed (apt-get install ngspice) - skipping the side-by-side");
} else {
  const ohms = Object.fromEntries(Object.entries(ours.last.wires).map(([id, w]) => [id, w.resistance]));
  const { deck, nodeOf } = toSpiceDeck(linear, ours.last.reference!, ohms);
  let worst = 0;
  const check = runNgspice(deck).voltages;
  for (const [t, v] of Object.entries(ours.last.terminals)) {
    const node = nodeOf.get(t)!;
    worst = Math.max(worst, Math.abs(v - (node === "0" ? 0 : (check.get(node) ?? NaN))));
  }
  const spice = [0, 1, 2].map(() => runNgspice(deck).ms);
  console.log(`\n10,000-component linear harness: Ampwright ${ours.ms.toFixed(1)} ms; ngspice ${median(spice).toFixed(0)} ms (process start, parse, DC operating point, write); largest terminal difference ${worst.toExponential(2)} V`);
}
