import { TERMINALS, type CircuitDocument } from "@/lib/circuit/schema";
import { applyState, buildNetlist, EL, type Netlist } from "./netlist";
import { buildPattern, minimumDegree, numeric, position, solveFactored, symbolic } from "./sparse";
import { defaultOptions, type ComponentResult, type SolveIssue, type SolveOptions, type SolveResult, type WireResult } from "./types";

const { resistor: RES, link: LINK, vsource: VSRC, isource: ISRC, norton: NORTON, power: POWER, alternator: ALT } = EL;
const REGULATING = 1;
const LIMITED = 2;

/** Alternator operating modes chosen by the active set. */
export type AlternatorMode = "regulating" | "current-limit" | "blocked";

type Network = {
  ok: boolean;
  v: Float64Array;
  /** Current of every element, from its a terminal through it to its b terminal. */
  current: Float64Array;
  iterations: number;
  residual: number;
  issues: SolveIssue[];
  /** The pass stopped before Newton settled because an alternator's mode was already violated. */
  early?: boolean;
};

/**
 * Solves one operating state of a circuit document: modified nodal analysis with ideal batteries and zero-ohm links
 * folded into supernodes, regulating alternators as constraints bordering the nodal matrix, Newton iteration for
 * constant-power loads and an active-set iteration for alternator modes. The ordering and symbolic factorisation are
 * done once; every Newton step and mode switch reuses them. Problems come back as issues, never as exceptions.
 */
export function solveCircuit(doc: CircuitDocument, opts: Partial<SolveOptions> = {}): SolveResult {
  const options = { ...defaultOptions, ...opts };
  const { components, issues: stateIssues, found } = applyState(doc, options.state);
  const net = buildNetlist(doc, components);
  const issues: SolveIssue[] = [...stateIssues, ...net.issues];
  const empty = (): SolveResult => ({
    status: "error",
    state: options.state,
    converged: false,
    iterations: 0,
    activeSetPasses: 0,
    reference: null,
    terminals: {},
    components: {},
    wires: {},
    issues,
  });
  if (!found) return empty();
  if (net.terminalNames.length === 0) {
    issues.push({ severity: "error", code: "unconnected", message: "The circuit has no components yet. Add a battery and what it feeds.", ids: [] });
    return empty();
  }
  reportUnconnected(net, issues);
  const st = prepare(net, issues);

  // Active set over alternator modes: start regulating, solve, switch the ones whose mode is violated.
  const alternators = st.alternators;
  const modes: AlternatorMode[] = alternators.map((e) => (st.altUsable[e] ? "regulating" : "blocked"));
  const visited = new Set<string>();
  let passes = 0;
  let iterations = 0;
  let result: Network | undefined;
  let cycled = false;
  // Passes whose modes may still change stop Newton early (loose); the last pass is always a tight one.
  const loose = 1e-3 / Math.max(1, doc.systemVoltage);
  let tight = !st.hasPower || alternators.length === 0;
  // A loose pass may also stop as soon as a mode is violated (a bounded number of times, so the loop still ends);
  // such a pass is not counted as a visit of its modes.
  let earlyStops = 0;
  for (;;) {
    passes++;
    const key = modes.join(",");
    visited.add(key);
    // Each pass starts from the previous pass's voltages, so Newton has little left to do.
    const tolerance = tight ? options.voltageTolerance : Math.max(loose, options.voltageTolerance);
    const probe = !tight && earlyStops < 2 * alternators.length + 2;
    result = iterate(net, st, modes, doc.systemVoltage, { ...options, voltageTolerance: tolerance }, result?.ok ? result.v : undefined, tight, probe);
    iterations += result.iterations;
    if (!result.ok) break;
    if (result.early) {
      earlyStops++;
      visited.delete(key);
    }
    let changed = false;
    alternators.forEach((e, k) => {
      if (!st.altUsable[e]) return;
      const next = judgeMode(modes[k], -result!.current[e], result!.v[net.a[e]] - result!.v[net.b[e]], net.g[e], net.value[e], options.modeToleranceA);
      if (next !== modes[k]) {
        modes[k] = next;
        changed = true;
      }
    });
    if (!changed) {
      if (tight) break;
      tight = true; // settle the same modes to full accuracy, then check them once more
      visited.delete(modes.join(","));
      continue;
    }
    if (visited.has(modes.join(",")) || passes > 2 * alternators.length + 12) {
      cycled = true;
      break;
    }
  }
  issues.push(...result.issues);
  if (cycled) {
    issues.push({
      severity: "error",
      code: "non-convergence",
      message: "The alternators' operating modes kept switching without settling. Check for alternators in parallel with different regulated voltages.",
      ids: alternators.map((e) => net.ownerIds[net.owner[e]]),
    });
  }
  return compose(doc, net, result, modes, alternators, passes, iterations, issues, options);
}

function reportUnconnected(net: Netlist, issues: SolveIssue[]): void {
  for (let ci = 0; ci < net.components.length; ci++) {
    const c = net.components[ci];
    const t0 = net.componentTerminal[ci];
    let touched = 0;
    for (let k = 0; k < TERMINALS[c.kind].length; k++) touched += net.wired[t0 + k];
    if (touched === 0) {
      issues.push({ severity: "warning", code: "unconnected", message: `${c.id} is not connected to anything. Draw a wire to it, or remove it.`, ids: [c.id] });
    }
  }
}

/** Union-find with offsets: v[x] = v[parent[x]] + off[x]. */
class OffsetUnion {
  parent: Int32Array;
  off: Float64Array;
  constructor(n: number) {
    this.parent = new Int32Array(n);
    for (let i = 0; i < n; i++) this.parent[i] = i;
    this.off = new Float64Array(n);
  }
  find(x: number): number {
    let root = x;
    let total = 0;
    while (this.parent[root] !== root) {
      total += this.off[root];
      root = this.parent[root];
    }
    // Path compression, keeping offsets to the root.
    let node = x;
    let acc = total;
    while (this.parent[node] !== root && node !== root) {
      const next = this.parent[node];
      const o = this.off[node];
      this.parent[node] = root;
      this.off[node] = acc;
      acc -= o;
      node = next;
    }
    return root;
  }
  /** Offset of x from its root (call find first). */
  offset(x: number): number {
    let total = 0;
    while (this.parent[x] !== x) {
      total += this.off[x];
      x = this.parent[x];
    }
    return total;
  }
}

/** What does not change between Newton steps and alternator modes: supernodes, islands, the matrix pattern. */
type Structure = {
  T: number;
  rep: Int32Array;
  off: Float64Array;
  tree: number[];
  fixed: Int8Array;
  fixedValue: Float64Array;
  index: Int32Array;
  n: number;
  pattern: ReturnType<typeof buildPattern>;
  sym: ReturnType<typeof symbolic>;
  pos: Int32Array;
  deadSource: Uint8Array;
  alternators: number[];
  /** Alternators that can regulate (their terminals are distinct nodes of one island). */
  altUsable: Uint8Array;
  hasPower: boolean;
  /** The linear elements' stamps (resistors, batteries, current sources): the same in every Newton step and mode. */
  baseAx: Float64Array;
  baseRhs: Float64Array;
  /** Constant-power loads, restamped at every Newton step. */
  powerLoads: Int32Array;
};

function prepare(net: Netlist, issues: SolveIssue[]): Structure {
  const T = net.terminalNames.length;
  const uf = new OffsetUnion(T);
  const tree: number[] = [];
  const sourceLoop = new Set<number>();
  const name = (e: number) => net.ownerIds[net.owner[e]];
  const types = net.type;

  // 1. Zero-ohm links and ideal batteries fold terminals into supernodes.
  for (let e = 0; e < net.count; e++) {
    const t = types[e];
    if (t !== LINK && t !== VSRC) continue;
    const E = t === LINK ? 0 : net.value[e];
    const ia = net.a[e];
    const ib = net.b[e];
    const ra = uf.find(ia);
    const rb = uf.find(ib);
    const oa = uf.offset(ia);
    const ob = uf.offset(ib);
    if (ra === rb) {
      if (t !== LINK || Math.abs(oa - ob) > 1e-12) sourceLoop.add(e);
      continue; // a redundant zero-ohm link carries no current of its own
    }
    uf.parent[ra] = rb;
    uf.off[ra] = ob + E - oa;
    tree.push(e);
  }
  const rep = new Int32Array(T);
  const off = new Float64Array(T);
  for (let t = 0; t < T; t++) {
    rep[t] = uf.find(t);
    off[t] = uf.offset(t);
  }
  const alternators: number[] = [];
  for (let e = 0; e < net.count; e++) if (types[e] === ALT) alternators.push(e);
  const altUsable = new Uint8Array(net.count);
  for (const e of alternators) {
    altUsable[e] = 1;
    if (rep[net.a[e]] === rep[net.b[e]]) {
      altUsable[e] = 0;
      sourceLoop.add(e);
    }
  }
  if (sourceLoop.size) {
    const roots = new Set<number>();
    for (const e of sourceLoop) roots.add(rep[net.a[e]]);
    const names = new Set<string>();
    for (let e = 0; e < net.count; e++) {
      const t = types[e];
      if ((t === VSRC || t === ALT) && (roots.has(rep[net.a[e]]) || roots.has(rep[net.b[e]]))) names.add(name(e));
    }
    for (const e of sourceLoop) if (types[e] !== LINK) names.add(name(e));
    issues.push({
      severity: "error",
      code: "ideal-source-loop",
      message: `${[...names].join(", ")} form a loop of ideal sources and zero-ohm connections, so the current between them is not defined (or their voltages contradict each other). Give a battery its internal resistance, or a cable its length.`,
      ids: [...names],
    });
  }
  for (let e = 0; e < net.count; e++) {
    if (types[e] === NORTON && rep[net.a[e]] === rep[net.b[e]] && Math.abs(off[net.a[e]] - off[net.b[e]]) < 1e-12) {
      const r = 1 / net.g[e];
      issues.push({
        severity: "error",
        code: "dead-short",
        message: `${name(e)} is shorted: its terminals are joined with no resistance, which would draw about ${Math.round(net.value[e] / r)} A. Find the zero-ohm path from its positive to its negative.`,
        ids: [name(e)],
      });
    }
  }

  // 2. Islands joined by conductances; each gets a fixed node (the reference island: 0 V at the reference).
  const isConductance = (t: number) => t === RES || t === NORTON || t === POWER;
  const island = new OffsetUnion(T);
  for (let e = 0; e < net.count; e++) {
    if (!isConductance(types[e])) continue;
    const x = island.find(rep[net.a[e]]);
    const y = island.find(rep[net.b[e]]);
    if (x !== y) island.parent[x] = y;
  }
  const islandOf = new Int32Array(T);
  for (let t = 0; t < T; t++) islandOf[t] = island.find(rep[t]);
  const refIsland = net.referenceTerminal >= 0 ? islandOf[net.referenceTerminal] : -1;
  // Current sources (and alternators) whose ends lie in different islands have no return path.
  const deadSource = new Uint8Array(net.count);
  for (let e = 0; e < net.count; e++) {
    const t = types[e];
    if (t !== ISRC && t !== ALT) continue;
    const connected = net.wired[net.a[e]] || net.wired[net.b[e]];
    if (!connected) {
      deadSource[e] = 1; // reported as unconnected already
      altUsable[e] = 0;
    } else if (islandOf[net.a[e]] !== islandOf[net.b[e]]) {
      deadSource[e] = 1;
      altUsable[e] = 0;
      const amps = t === ISRC ? net.value[e] : net.g[e];
      if (amps !== 0) {
        issues.push({
          severity: "error",
          code: "no-return-path",
          message:
            t === ISRC
              ? `${name(e)} draws ${Math.round(amps * 10) / 10} A but one side of it has no path back to the other. Wire its negative (or case) to ground.`
              : `${name(e)} has no path from its case back to its output: its case is not grounded to the circuit it feeds. Wire the case to ground.`,
          ids: [name(e)],
        });
      }
    }
  }
  const fixed = new Int8Array(T);
  const fixedValue = new Float64Array(T);
  const floating = new Uint8Array(T);
  const islandFixed = new Set<number>();
  if (net.referenceTerminal >= 0) {
    const r = rep[net.referenceTerminal];
    fixed[r] = 1;
    fixedValue[r] = -off[net.referenceTerminal];
    islandFixed.add(refIsland);
  }
  for (let t = 0; t < T; t++) {
    if (islandOf[t] !== refIsland) floating[t] = 1;
    if (!islandFixed.has(islandOf[t])) {
      islandFixed.add(islandOf[t]);
      fixed[rep[t]] = 1;
      fixedValue[rep[t]] = -off[t];
    }
  }
  reportFloating(net, floating, islandOf, issues);

  // 3. Free unknowns, the matrix pattern, its ordering and symbolic factorisation.
  const index = new Int32Array(T).fill(-1);
  let n = 0;
  for (let t = 0; t < T; t++) if (rep[t] === t && !fixed[t]) index[t] = n++;
  const ea = new Int32Array(net.count);
  const eb = new Int32Array(net.count);
  let m = 0;
  for (let e = 0; e < net.count; e++) {
    if (!isConductance(types[e])) continue;
    const x = index[rep[net.a[e]]];
    const y = index[rep[net.b[e]]];
    if (x >= 0 && y >= 0 && x !== y) {
      ea[m] = x;
      eb[m] = y;
      m++;
    }
  }
  const pattern = buildPattern(n, ea, eb, m);
  const sym = symbolic(pattern, minimumDegree(pattern));
  const pos = new Int32Array(net.count * 4).fill(-1);
  for (let e = 0; e < net.count; e++) {
    if (!isConductance(types[e])) continue;
    const x = index[rep[net.a[e]]];
    const y = index[rep[net.b[e]]];
    if (x >= 0) pos[4 * e] = position(pattern, x, x);
    if (y >= 0) pos[4 * e + 1] = position(pattern, y, y);
    if (x >= 0 && y >= 0 && x !== y) {
      pos[4 * e + 2] = position(pattern, x, y);
      pos[4 * e + 3] = position(pattern, y, x);
    }
  }
  const st: Structure = {
    T,
    rep,
    off,
    tree,
    fixed,
    fixedValue,
    index,
    n,
    pattern,
    sym,
    pos,
    deadSource,
    alternators,
    altUsable,
    hasPower: false,
    baseAx: new Float64Array(pattern.rowIdx.length),
    baseRhs: new Float64Array(n),
    powerLoads: new Int32Array(0),
  };
  const powerLoads: number[] = [];
  for (let e = 0; e < net.count; e++) {
    const t = types[e];
    if (t === RES) stamp(net, st, e, net.g[e], 0, st.baseAx, st.baseRhs);
    else if (t === NORTON) stamp(net, st, e, net.g[e], -net.g[e] * net.value[e], st.baseAx, st.baseRhs);
    else if (t === ISRC) {
      if (!deadSource[e]) stamp(net, st, e, 0, net.value[e], st.baseAx, st.baseRhs);
    } else if (t === POWER) powerLoads.push(e);
  }
  st.powerLoads = Int32Array.from(powerLoads);
  st.hasPower = powerLoads.length > 0;
  return st;
}

/**
 * Stamps one element's linearised current g (v_a - v_b) + J into a matrix and right-hand side. A fixed node's voltage
 * (a supernode holding the reference or an island's anchor) goes to the right-hand side.
 */
function stamp(net: Netlist, st: Structure, e: number, g: number, J: number, A: Float64Array, R: Float64Array): void {
  const { rep, off, index, pos, fixedValue } = st;
  const ia = net.a[e];
  const ib = net.b[e];
  const ra = rep[ia];
  const rb = rep[ib];
  if (ra === rb) return;
  const c = g * (off[ia] - off[ib]) + J; // constant part of the current a -> b
  const xa = index[ra];
  const xb = index[rb];
  if (xa >= 0) {
    A[pos[4 * e]] += g;
    R[xa] -= c;
    if (xb >= 0) A[pos[4 * e + 2]] -= g;
    else R[xa] += g * fixedValue[rb];
  }
  if (xb >= 0) {
    A[pos[4 * e + 1]] += g;
    R[xb] += c;
    if (xa >= 0) A[pos[4 * e + 3]] -= g;
    else R[xb] += g * fixedValue[ra];
  }
}

/** The mode an alternator should switch to, judged from what it delivers and the voltage across it. */
function judgeMode(mode: AlternatorMode, delivered: number, volts: number, rated: number, vreg: number, toleranceA: number): AlternatorMode {
  if (mode === "regulating") {
    if (delivered > rated + toleranceA) return "current-limit";
    if (delivered < -toleranceA) return "blocked";
    return mode;
  }
  if (mode === "current-limit") return volts > vreg + 1e-9 ? "regulating" : mode;
  return volts < vreg - 1e-9 ? "regulating" : mode;
}

/** Newton iterations for one set of alternator modes, on the prepared structure. */
function iterate(
  net: Netlist,
  st: Structure,
  modes: AlternatorMode[],
  systemVoltage: number,
  options: SolveOptions,
  warm: Float64Array | undefined,
  final: boolean,
  probe: boolean,
): Network {
  const { T, rep, off, fixed, fixedValue, index, n, pattern, sym, deadSource, alternators, altUsable, hasPower, baseAx, baseRhs, powerLoads } = st;
  const issues: SolveIssue[] = [];
  const altMode = new Int8Array(net.count);
  alternators.forEach((e, k) => (altMode[e] = modes[k] === "regulating" ? REGULATING : modes[k] === "current-limit" ? LIMITED : 3));
  // Regulating alternators border the nodal matrix: one constraint row each.
  const active = alternators.filter((e) => altUsable[e] && altMode[e] === REGULATING);
  const mA = active.length;
  const Y = active.map(() => new Float64Array(n));
  const cvec = active.map(() => new Float64Array(n));
  const lambda = new Float64Array(mA);

  const vmin = options.powerMinVoltageFraction * systemVoltage;
  const V = new Float64Array(T); // by representative
  for (let t = 0; t < T; t++) if (fixed[t]) V[t] = fixedValue[t];
  if (warm) for (let t = 0; t < T; t++) if (rep[t] === t && !fixed[t]) V[t] = warm[t] - off[t];
  const ax = new Float64Array(pattern.rowIdx.length);
  const rhs = new Float64Array(n);
  const x = new Float64Array(n);
  const types = net.type;
  const ta = net.a;
  const tb = net.b;
  const eg = net.g;
  const ev = net.value;
  const volts = (e: number) => V[rep[ta[e]]] + off[ta[e]] - (V[rep[tb[e]]] + off[tb[e]]);
  let iterations = 0;
  let converged = false;
  let fixedPoint = false;
  let lastDv = 0;
  let early = false;
  const modeViolated = () => {
    for (let k = 0; k < mA; k++) {
      const e = active[k];
      if (judgeMode("regulating", lambda[k], 0, eg[e], ev[e], options.modeToleranceA) !== "regulating") return true;
    }
    for (let k = 0; k < alternators.length; k++) {
      const e = alternators[k];
      if (!altUsable[e] || modes[k] === "regulating") continue;
      if (judgeMode(modes[k], 0, volts(e), eg[e], ev[e], options.modeToleranceA) !== modes[k]) return true;
    }
    return false;
  };
  // Alternators held at their rated current are current sources (the rated current leaves at the out terminal, a:
  // a -> b is negative); constant-power loads are relinearised at each step.
  const limited = alternators.filter((e) => altMode[e] === LIMITED && !deadSource[e]);
  let baseAxModes = baseAx;
  let baseRhsModes = baseRhs;
  if (limited.length) {
    baseAxModes = baseAx.slice();
    baseRhsModes = baseRhs.slice();
    for (const e of limited) stamp(net, st, e, 0, -eg[e], baseAxModes, baseRhsModes);
  }
  for (let it = 0; it < options.maxNewtonIterations; it++) {
    iterations++;
    ax.set(baseAxModes);
    rhs.set(baseRhsModes);
    for (let k = 0; k < powerLoads.length; k++) {
      const e = powerLoads[k];
      const P = ev[e];
      const v0 = it === 0 && !warm ? systemVoltage : volts(e);
      if (v0 < vmin) stamp(net, st, e, P / (vmin * vmin), 0, ax, rhs);
      else if (fixedPoint) stamp(net, st, e, P / (v0 * v0), 0, ax, rhs);
      else stamp(net, st, e, -P / (v0 * v0), (2 * P) / v0, ax, rhs);
    }
    const bad = numeric(pattern, ax, sym);
    if (bad >= 0) {
      if (hasPower && !fixedPoint) {
        // Newton's Jacobian is not positive definite far from the answer: take a plain resistive step instead.
        fixedPoint = true;
        it--;
        iterations--;
        continue;
      }
      issues.push({ severity: "error", code: "numeric-failure", message: "The circuit's equations could not be solved (a singular system). Check for parts with no path to ground.", ids: [] });
      return { ok: false, v: new Float64Array(T), current: new Float64Array(net.count), iterations, residual: Infinity, issues };
    }
    solveFactored(sym, rhs, x);
    if (mA > 0) {
      // x = x0 + Y lambda with Y = K^-1 C^T; lambda from C x + known = Vreg (a small dense system).
      const S = new Float64Array(mA * mA);
      const r = new Float64Array(mA);
      active.forEach((e, k) => {
        const c = cvec[k];
        c.fill(0);
        const ia = ta[e];
        const ib = tb[e];
        const xa = index[rep[ia]];
        const xb = index[rep[ib]];
        let known = off[ia] - off[ib];
        if (xa >= 0) c[xa] += 1;
        else known += V[rep[ia]];
        if (xb >= 0) c[xb] -= 1;
        else known -= V[rep[ib]];
        solveFactored(sym, c, Y[k]);
        r[k] = ev[e] - known - (xa >= 0 ? x[xa] : 0) + (xb >= 0 ? x[xb] : 0);
      });
      active.forEach((_e, k) => {
        const c = cvec[k];
        for (let j = 0; j < mA; j++) {
          let sum = 0;
          const y = Y[j];
          for (let q = 0; q < n; q++) if (c[q] !== 0) sum += c[q] * y[q];
          S[k * mA + j] = sum;
        }
      });
      if (!solveDense(S, r, lambda, mA)) {
        const ids = active.map((e) => net.ownerIds[net.owner[e]]);
        issues.push({
          severity: "error",
          code: "ideal-source-loop",
          message: `${ids.join(", ")} are tied together with no resistance between them, so how they share the load is not defined. Give each its own output cable.`,
          ids,
        });
        return { ok: false, v: new Float64Array(T), current: new Float64Array(net.count), iterations, residual: Infinity, issues };
      }
      for (let k = 0; k < mA; k++) {
        const y = Y[k];
        const l = lambda[k];
        for (let q = 0; q < n; q++) x[q] += l * y[q];
      }
    }
    let dv = 0;
    for (let t = 0; t < T; t++) {
      const k = index[t];
      if (k < 0) continue;
      const d = Math.abs(x[k] - V[t]);
      if (d > dv) dv = d;
      V[t] = x[k];
    }
    lastDv = dv;
    if (probe && hasPower && modeViolated()) {
      // A pass whose modes will change anyway need not settle first: stop and let the active set switch.
      converged = true;
      early = true;
      break;
    }
    if (!hasPower) {
      converged = true;
      break;
    }
    if ((it > 0 || warm) && dv < options.voltageTolerance * Math.max(1, systemVoltage)) {
      converged = true;
      break;
    }
    fixedPoint = false;
  }

  // Terminal voltages and element currents.
  const v = new Float64Array(T);
  for (let t = 0; t < T; t++) v[t] = V[rep[t]] + off[t];
  const current = new Float64Array(net.count);
  const out = new Float64Array(T); // current leaving each terminal through non-ideal elements
  let largest = 0;
  const lambdaOf = new Map<number, number>();
  active.forEach((e, k) => lambdaOf.set(e, lambda[k]));
  for (let e = 0; e < net.count; e++) {
    const t = types[e];
    const dv = v[ta[e]] - v[tb[e]];
    let I = 0;
    if (t === RES) I = eg[e] * dv;
    else if (t === NORTON) I = eg[e] * (dv - ev[e]);
    else if (t === ISRC) I = deadSource[e] ? 0 : ev[e];
    else if (t === ALT) I = deadSource[e] ? 0 : altMode[e] === LIMITED ? -eg[e] : -(lambdaOf.get(e) ?? 0);
    else if (t === POWER) I = dv >= vmin ? ev[e] / dv : (dv * ev[e]) / (vmin * vmin);
    else continue;
    current[e] = I;
    out[ta[e]] += I;
    out[tb[e]] -= I;
    if (Math.abs(I) > largest) largest = Math.abs(I);
  }
  // Currents in ideal links and batteries: peel the supernode trees from their leaves.
  treeCurrents(net, st.tree, out, current, T);
  const worst = kclResidual(out, rep, fixed, T);
  if (!converged || (final && worst > 1e-6 * Math.max(1, largest))) {
    issues.push({
      severity: "error",
      code: "non-convergence",
      message: `The solution did not settle (${iterations} iterations, largest current mismatch ${worst.toExponential(2)} A, last step ${lastDv.toExponential(2)} V). A constant-power load may be asking more than the supply can give.`,
      ids: [],
    });
    return { ok: false, v, current, iterations, residual: worst, issues };
  }
  return { ok: true, v, current, iterations, residual: worst, issues, early };
}

/** Gaussian elimination with partial pivoting for the small bordered system; false when it is singular. */
function solveDense(A: Float64Array, b: Float64Array, out: Float64Array, m: number): boolean {
  const a = A.slice();
  const r = b.slice();
  let scale = 0;
  for (let i = 0; i < m * m; i++) scale = Math.max(scale, Math.abs(a[i]));
  for (let k = 0; k < m; k++) {
    let p = k;
    for (let i = k + 1; i < m; i++) if (Math.abs(a[i * m + k]) > Math.abs(a[p * m + k])) p = i;
    if (!(Math.abs(a[p * m + k]) > 1e-12 * scale)) return false;
    if (p !== k) {
      for (let j = 0; j < m; j++) [a[k * m + j], a[p * m + j]] = [a[p * m + j], a[k * m + j]];
      [r[k], r[p]] = [r[p], r[k]];
    }
    for (let i = k + 1; i < m; i++) {
      const f = a[i * m + k] / a[k * m + k];
      for (let j = k; j < m; j++) a[i * m + j] -= f * a[k * m + j];
      r[i] -= f * r[k];
    }
  }
  for (let k = m - 1; k >= 0; k--) {
    let sum = r[k];
    for (let j = k + 1; j < m; j++) sum -= a[k * m + j] * out[j];
    out[k] = sum / a[k * m + k];
  }
  return true;
}

function treeCurrents(net: Netlist, tree: number[], outIn: Float64Array, current: Float64Array, T: number): void {
  const out = outIn.slice();
  const deg = new Int32Array(T);
  for (const e of tree) {
    deg[net.a[e]]++;
    deg[net.b[e]]++;
  }
  // Adjacency of tree edges per terminal.
  const start = new Int32Array(T + 1);
  for (let t = 0; t < T; t++) start[t + 1] = start[t] + deg[t];
  const fill = start.slice(0, T);
  const edges = new Int32Array(start[T]);
  for (const e of tree) {
    edges[fill[net.a[e]]++] = e;
    edges[fill[net.b[e]]++] = e;
  }
  const used = new Uint8Array(net.count);
  const queue: number[] = [];
  for (let t = 0; t < T; t++) if (deg[t] === 1) queue.push(t);
  while (queue.length) {
    const t = queue.pop() as number;
    if (deg[t] !== 1) continue;
    let e = -1;
    for (let q = start[t]; q < start[t + 1]; q++) if (!used[edges[q]]) e = edges[q];
    if (e < 0) continue;
    used[e] = 1;
    const u = net.a[e] === t ? net.b[e] : net.a[e];
    // KCL at t: out[t] + (current leaving t through e) = 0.
    const leaving = -out[t];
    current[e] = net.a[e] === t ? leaving : -leaving;
    out[u] += out[t];
    out[t] = 0;
    deg[t]--;
    deg[u]--;
    if (deg[u] === 1) queue.push(u);
  }
}

/** Largest KCL mismatch at a free supernode (the fixed ones absorb their island's total). */
function kclResidual(out: Float64Array, rep: Int32Array, fixed: Int8Array, T: number): number {
  const sum = new Float64Array(T);
  for (let t = 0; t < T; t++) sum[rep[t]] += out[t];
  let worst = 0;
  for (let t = 0; t < T; t++) if (rep[t] === t && !fixed[t]) worst = Math.max(worst, Math.abs(sum[t]));
  return worst;
}

function reportFloating(net: Netlist, floating: Uint8Array, islandOf: Int32Array, issues: SolveIssue[]): void {
  const groups = new Map<number, Set<string>>();
  for (let t = 0; t < net.terminalNames.length; t++) {
    if (!floating[t] || !net.wired[t]) continue;
    let g = groups.get(islandOf[t]);
    if (!g) groups.set(islandOf[t], (g = new Set()));
    g.add(net.components[net.terminalComponent[t]].id);
  }
  for (const ids of groups.values()) {
    const list = [...ids];
    issues.push({
      severity: "warning",
      code: "floating-section",
      message: `${list.slice(0, 8).join(", ")}${list.length > 8 ? ` and ${list.length - 8} more` : ""} ${list.length > 1 ? "have" : "has"} no path to the 0 V reference, so their voltages are shown relative to their own lowest point. Wire them to ground or to the battery negative.`,
      ids: list,
    });
  }
}

function compose(
  doc: CircuitDocument,
  net: Netlist,
  nw: Network,
  modes: AlternatorMode[],
  alternators: number[],
  passes: number,
  iterations: number,
  issues: SolveIssue[],
  options: SolveOptions,
): SolveResult {
  const terminals: Record<string, number> = {};
  let bad = false;
  const clean = (x: number) => {
    if (!Number.isFinite(x)) {
      bad = true;
      return 0;
    }
    return Math.abs(x) < 1e-15 ? 0 : x;
  };
  const names = net.terminalNames;
  for (let t = 0; t < names.length; t++) terminals[names[t]] = clean(nw.v[t]);
  const components: Record<string, ComponentResult> = {};
  const modeByElement = new Map<number, AlternatorMode>();
  alternators.forEach((e, k) => modeByElement.set(e, modes[k]));
  const vmin = options.powerMinVoltageFraction * doc.systemVoltage;
  net.components.forEach((c, ci) => {
    const t0 = net.componentTerminal[ci];
    const va = clean(nw.v[t0]);
    if (c.kind === "junction" || c.kind === "ground") {
      components[c.id] = { voltage: va };
      return;
    }
    const vb = clean(nw.v[t0 + 1]);
    const e = net.componentElement[ci];
    const I = e >= 0 ? clean(nw.current[e]) : 0;
    const voltage = clean(va - vb);
    const r: ComponentResult = { current: I, voltage, power: clean(voltage * I) };
    if (c.kind === "alternator") r.mode = e >= 0 ? modeByElement.get(e) : "off";
    else if (c.kind === "load" && c.mode === "power") r.mode = e < 0 ? "off" : voltage >= vmin ? "constant-power" : "collapsed";
    else if ((c.kind === "load" || c.kind === "starter") && e < 0) r.mode = "off";
    else if (c.kind === "switch") r.mode = e >= 0 ? "closed" : "open";
    components[c.id] = r;
    if (c.kind === "fuse" && Math.abs(I) > c.rating) {
      issues.push({
        severity: "warning",
        code: "fuse-overload",
        message: `${c.id} carries ${Math.abs(I).toFixed(1)} A, more than its ${c.rating} A rating: it would open.`,
        ids: [c.id],
      });
    }
    if (r.mode === "collapsed") {
      issues.push({
        severity: "warning",
        code: "supply-collapse",
        message: `${c.id} gets only ${voltage.toFixed(2)} V, under half the system voltage: the supply cannot hold up its ${c.kind === "load" ? c.value : 0} W, so it is modelled as the resistance it would have at ${vmin} V.`,
        ids: [c.id],
      });
    }
  });
  const wires: Record<string, WireResult> = {};
  const pct = 100 / doc.systemVoltage;
  for (let wi = 0; wi < doc.wires.length; wi++) {
    const e = net.wireElement[wi];
    if (e < 0) continue;
    const I = clean(nw.current[e]);
    const drop = clean(nw.v[net.a[e]] - nw.v[net.b[e]]);
    const R = net.wireResistance[wi];
    wires[net.wireIds[wi]] = { current: I, resistance: R, drop, dropPercent: pct * Math.abs(drop), power: clean(I * I * R) };
  }
  const result: SolveResult = {
    status: issues.some((i) => i.severity === "error") || !nw.ok ? "error" : "ok",
    state: options.state,
    converged: nw.ok,
    iterations,
    activeSetPasses: passes,
    reference: net.referenceTerminal >= 0 ? net.terminalNames[net.referenceTerminal] : null,
    terminals,
    components,
    wires,
    issues,
  };
  // Never NaN or Infinity in a result: clean() put 0 in their place and says so here.
  if (bad) {
    result.status = "error";
    result.converged = false;
    issues.push({ severity: "error", code: "numeric-failure", message: "Some values could not be computed; they are shown as 0. Check the circuit for extreme values.", ids: [] });
  }
  return result;
}
