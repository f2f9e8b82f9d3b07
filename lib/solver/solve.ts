import { TERMINALS, type CircuitDocument } from "@/lib/circuit/schema";
import { applyState, buildNetlist, EL, type Netlist } from "./netlist";
import { buildPattern, minimumDegree, numeric, position, solveFactored, symbolic } from "./sparse";
import { defaultOptions, type ComponentResult, type SolveIssue, type SolveOptions, type SolveResult, type WireResult } from "./types";

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
  floating: Uint8Array;
};

/**
 * Solves one operating state of a circuit document: modified nodal analysis with ideal sources and zero-ohm links
 * folded into supernodes, Newton iteration for constant-power loads, and an active-set iteration for alternator
 * modes. Problems come back as issues in the result, never as exceptions.
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

  // Active set over alternator modes: start regulating, solve, switch the ones whose mode is violated.
  const alternators: number[] = [];
  for (let e = 0; e < net.count; e++) if (net.type[e] === EL.alternator) alternators.push(e);
  const modes: AlternatorMode[] = alternators.map(() => "regulating");
  const visited = new Set<string>();
  let passes = 0;
  let iterations = 0;
  let result: Network | undefined;
  let cycled = false;
  for (;;) {
    passes++;
    visited.add(modes.join(","));
    result = solveNetwork(net, alternators, modes, doc.systemVoltage, options);
    iterations += result.iterations;
    if (!result.ok) break;
    let changed = false;
    alternators.forEach((e, k) => {
      const delivered = -result!.current[e] * (modes[k] === "regulating" ? 1 : 0);
      const volts = result!.v[net.a[e]] - result!.v[net.b[e]];
      const rated = net.g[e];
      const vreg = net.value[e];
      let next = modes[k];
      if (modes[k] === "regulating") {
        if (delivered > rated + options.modeToleranceA) next = "current-limit";
        else if (delivered < -options.modeToleranceA) next = "blocked";
      } else if (modes[k] === "current-limit") {
        if (volts > vreg + 1e-9) next = "regulating";
      } else if (volts < vreg - 1e-9) next = "regulating";
      if (next !== modes[k]) {
        modes[k] = next;
        changed = true;
      }
    });
    if (!changed) break;
    if (visited.has(modes.join(","))) {
      cycled = true;
      break;
    }
    if (passes > 2 * alternators.length + 10) {
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
  for (const c of net.components) {
    const names = TERMINALS[c.kind].map((t) => `${c.id}.${t}`);
    const touched = names.filter((n) => net.wired[net.terminalIndex.get(n) as number]);
    if (touched.length === 0) {
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

function solveNetwork(net: Netlist, alternators: number[], modes: AlternatorMode[], systemVoltage: number, options: SolveOptions): Network {
  const T = net.terminalNames.length;
  const issues: SolveIssue[] = [];
  const modeOf = new Map<number, AlternatorMode>();
  alternators.forEach((e, k) => modeOf.set(e, modes[k]));
  const uf = new OffsetUnion(T);
  const tree: number[] = [];
  const sourceLoop = new Set<string>();
  const name = (e: number) => net.ownerIds[net.owner[e]];

  // 1. Ideal links and ideal sources fold terminals into supernodes.
  const ideal = (e: number) => {
    const t = net.type[e];
    if (t === EL.link) return 0;
    if (t === EL.vsource) return net.value[e];
    if (t === EL.alternator && modeOf.get(e) === "regulating") return net.value[e];
    return undefined;
  };
  for (let e = 0; e < net.count; e++) {
    const E = ideal(e);
    if (E === undefined) continue;
    const ia = net.a[e];
    const ib = net.b[e];
    const ra = uf.find(ia);
    const rb = uf.find(ib);
    const oa = uf.offset(ia);
    const ob = uf.offset(ib);
    if (ra === rb) {
      if (net.type[e] !== EL.link || Math.abs(oa - ob) > 1e-12) sourceLoop.add(name(e));
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
  if (sourceLoop.size) {
    // Name every ideal source sharing a supernode with the offending one.
    const roots = new Set<number>();
    for (let e = 0; e < net.count; e++) if (sourceLoop.has(name(e))) roots.add(rep[net.a[e]]);
    const names = new Set<string>();
    for (let e = 0; e < net.count; e++) {
      const E = ideal(e);
      if (E !== undefined && roots.has(rep[net.a[e]]) && net.type[e] !== EL.link) names.add(name(e));
    }
    for (let e = 0; e < net.count; e++) if (sourceLoop.has(name(e)) && net.type[e] !== EL.link) names.add(name(e));
    issues.push({
      severity: "error",
      code: "ideal-source-loop",
      message: `${[...names].join(", ")} form a loop of ideal sources and zero-ohm connections, so the current between them is not defined (or their voltages contradict each other). Give a battery its internal resistance, or a cable its length.`,
      ids: [...names],
    });
  }
  for (let e = 0; e < net.count; e++) {
    if (net.type[e] === EL.norton && rep[net.a[e]] === rep[net.b[e]] && Math.abs(off[net.a[e]] - off[net.b[e]]) < 1e-12) {
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
  const isConductance = (t: number) => t === EL.resistor || t === EL.norton || t === EL.power;
  const island = new OffsetUnion(T);
  for (let e = 0; e < net.count; e++) {
    if (!isConductance(net.type[e])) continue;
    const x = island.find(rep[net.a[e]]);
    const y = island.find(rep[net.b[e]]);
    if (x !== y) island.parent[x] = y;
  }
  const islandOf = new Int32Array(T);
  for (let t = 0; t < T; t++) islandOf[t] = island.find(rep[t]);
  const refIsland = net.referenceTerminal >= 0 ? islandOf[net.referenceTerminal] : -1;
  // Current sources whose ends lie in different islands have no return path.
  const deadSource = new Uint8Array(net.count);
  for (let e = 0; e < net.count; e++) {
    const t = net.type[e];
    const isCurrent = t === EL.isource || (t === EL.alternator && modeOf.get(e) === "current-limit");
    const connected = net.wired[net.a[e]] || net.wired[net.b[e]];
    if (isCurrent && !connected) deadSource[e] = 1; // reported as unconnected already
    else if (isCurrent && islandOf[net.a[e]] !== islandOf[net.b[e]]) {
      const amps = t === EL.isource ? net.value[e] : net.g[e];
      if (amps !== 0) {
        deadSource[e] = 1;
        issues.push({
          severity: "error",
          code: "no-return-path",
          message: `${name(e)} draws ${Math.round(amps * 10) / 10} A but one side of it has no path back to the other. Wire its ${t === EL.isource ? "negative (or case)" : "case"} to ground.`,
          ids: [name(e)],
        });
      }
    }
  }

  // Fixed value of each representative: the reference node, and one node per floating island.
  const fixed = new Int8Array(T);
  const fixedValue = new Float64Array(T);
  const floating = new Uint8Array(T);
  const islandFixed = new Map<number, number>();
  if (net.referenceTerminal >= 0) {
    const r = rep[net.referenceTerminal];
    fixed[r] = 1;
    fixedValue[r] = -off[net.referenceTerminal];
    islandFixed.set(refIsland, r);
  }
  for (let t = 0; t < T; t++) {
    const r = rep[t];
    if (islandOf[t] !== refIsland) floating[t] = 1;
    if (!islandFixed.has(islandOf[t])) {
      islandFixed.set(islandOf[t], r);
      fixed[r] = 1;
      fixedValue[r] = -off[t];
    }
  }
  reportFloating(net, floating, islandOf, issues);

  // 3. Free unknowns and the matrix pattern.
  const index = new Int32Array(T).fill(-1);
  let n = 0;
  for (let t = 0; t < T; t++) if (rep[t] === t && !fixed[t]) index[t] = n++;
  const ea = new Int32Array(net.count);
  const eb = new Int32Array(net.count);
  let m = 0;
  for (let e = 0; e < net.count; e++) {
    if (!isConductance(net.type[e])) continue;
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
    if (!isConductance(net.type[e])) continue;
    const x = index[rep[net.a[e]]];
    const y = index[rep[net.b[e]]];
    if (x >= 0) pos[4 * e] = position(pattern, x, x);
    if (y >= 0) pos[4 * e + 1] = position(pattern, y, y);
    if (x >= 0 && y >= 0 && x !== y) {
      pos[4 * e + 2] = position(pattern, x, y);
      pos[4 * e + 3] = position(pattern, y, x);
    }
  }

  // 4. Newton iterations (a single linear solve when there is no constant-power load).
  const vmin = options.powerMinVoltageFraction * systemVoltage;
  const V = new Float64Array(T); // by representative
  for (let t = 0; t < T; t++) if (fixed[t]) V[t] = fixedValue[t];
  const ax = new Float64Array(pattern.rowIdx.length);
  const rhs = new Float64Array(n);
  const x = new Float64Array(n);
  const hasPower = net.type.subarray(0, net.count).some((t) => t === EL.power);
  const volts = (e: number) => V[rep[net.a[e]]] + off[net.a[e]] - (V[rep[net.b[e]]] + off[net.b[e]]);
  let iterations = 0;
  let converged = false;
  let fixedPoint = false;
  const lastDv = new Float64Array(1);
  for (let it = 0; it < options.maxNewtonIterations; it++) {
    iterations++;
    ax.fill(0);
    rhs.fill(0);
    for (let e = 0; e < net.count; e++) {
      const t = net.type[e];
      let g = 0;
      let J = 0;
      if (t === EL.resistor) g = net.g[e];
      else if (t === EL.norton) {
        g = net.g[e];
        J = -net.g[e] * net.value[e];
      } else if (t === EL.isource) J = deadSource[e] ? 0 : net.value[e];
      else if (t === EL.alternator && modeOf.get(e) === "current-limit") {
        // The rated current leaves the alternator at its out terminal (a): from a through it to b is negative.
        J = deadSource[e] ? 0 : -net.g[e];
      } else if (t === EL.power) {
        const P = net.value[e];
        const v0 = it === 0 ? systemVoltage : volts(e);
        if (v0 < vmin) g = P / (vmin * vmin);
        else if (fixedPoint) g = P / (v0 * v0);
        else {
          g = -P / (v0 * v0);
          J = (2 * P) / v0;
        }
      } else continue;
      const ra = rep[net.a[e]];
      const rb = rep[net.b[e]];
      const c = g * (off[net.a[e]] - off[net.b[e]]) + J; // constant part of the current a -> b
      const xa = index[ra];
      const xb = index[rb];
      if (ra === rb) continue;
      if (xa >= 0) {
        ax[pos[4 * e]] += g;
        rhs[xa] -= c;
        if (xb >= 0) ax[pos[4 * e + 2]] -= g;
        else rhs[xa] += g * V[rb];
      }
      if (xb >= 0) {
        ax[pos[4 * e + 1]] += g;
        rhs[xb] += c;
        if (xa >= 0) ax[pos[4 * e + 3]] -= g;
        else rhs[xb] += g * V[ra];
      }
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
      issues.push({
        severity: "error",
        code: "numeric-failure",
        message: "The circuit's equations could not be solved (a singular system). Check for parts with no path to ground.",
        ids: [],
      });
      return { ok: false, v: new Float64Array(T), current: new Float64Array(net.count), iterations, residual: Infinity, issues, floating };
    }
    solveFactored(sym, rhs, x);
    let dv = 0;
    for (let t = 0; t < T; t++) {
      const k = index[t];
      if (k < 0) continue;
      const d = Math.abs(x[k] - V[t]);
      if (d > dv) dv = d;
      V[t] = x[k];
    }
    lastDv[0] = dv;
    if (!hasPower) {
      converged = true;
      break;
    }
    if (it > 0 && dv < options.voltageTolerance * Math.max(1, systemVoltage)) {
      converged = true;
      break;
    }
    fixedPoint = false;
  }

  // 5. Terminal voltages and element currents.
  const v = new Float64Array(T);
  for (let t = 0; t < T; t++) v[t] = V[rep[t]] + off[t];
  const current = new Float64Array(net.count);
  const out = new Float64Array(T); // current leaving each terminal through non-ideal elements
  let largest = 0;
  for (let e = 0; e < net.count; e++) {
    const t = net.type[e];
    const dv = v[net.a[e]] - v[net.b[e]];
    let I = 0;
    if (t === EL.resistor) I = net.g[e] * dv;
    else if (t === EL.norton) I = net.g[e] * (dv - net.value[e]);
    else if (t === EL.isource) I = deadSource[e] ? 0 : net.value[e];
    else if (t === EL.alternator && modeOf.get(e) === "current-limit") I = deadSource[e] ? 0 : -net.g[e];
    else if (t === EL.power) I = dv >= vmin ? net.value[e] / dv : (dv * net.value[e]) / (vmin * vmin);
    else continue;
    current[e] = I;
    out[net.a[e]] += I;
    out[net.b[e]] -= I;
    if (Math.abs(I) > largest) largest = Math.abs(I);
  }
  // Currents in ideal links and sources: peel the supernode trees from their leaves.
  treeCurrents(net, tree, out, current, T);
  const worst = kclResidual(out, rep, fixed, T);
  if (!converged || worst > 1e-6 * Math.max(1, largest)) {
    issues.push({
      severity: "error",
      code: "non-convergence",
      message: `The solution did not settle (${iterations} iterations, largest current mismatch ${worst.toExponential(2)} A, last step ${lastDv[0].toExponential(2)} V). A constant-power load may be asking more than the supply can give.`,
      ids: [],
    });
    return { ok: false, v, current, iterations, residual: worst, issues, floating };
  }
  return { ok: true, v, current, iterations, residual: worst, issues, floating };
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
  net.terminalNames.forEach((tn, t) => {
    if (!floating[t] || !net.wired[t]) return;
    const cid = tn.slice(0, tn.lastIndexOf("."));
    let g = groups.get(islandOf[t]);
    if (!g) groups.set(islandOf[t], (g = new Set()));
    g.add(cid);
  });
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
  const clean = (x: number) => (Number.isFinite(x) ? (Math.abs(x) < 1e-15 ? 0 : x) : NaN);
  net.terminalNames.forEach((tn, t) => (terminals[tn] = clean(nw.v[t])));
  const components: Record<string, ComponentResult> = {};
  const modeByElement = new Map<number, AlternatorMode>();
  alternators.forEach((e, k) => modeByElement.set(e, modes[k]));
  const vmin = options.powerMinVoltageFraction * doc.systemVoltage;
  net.components.forEach((c, ci) => {
    const names = TERMINALS[c.kind];
    const va = terminals[`${c.id}.${names[0]}`];
    if (names.length === 1) {
      components[c.id] = { voltage: va };
      return;
    }
    const vb = terminals[`${c.id}.${names[1]}`];
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
  doc.wires.forEach((w, wi) => {
    const e = net.wireElement[wi];
    if (e < 0) return;
    const I = clean(nw.current[e]);
    const drop = clean(terminals[w.from] - terminals[w.to]);
    const R = net.wireResistance[wi];
    wires[w.id] = { current: I, resistance: R, drop, dropPercent: (100 * Math.abs(drop)) / doc.systemVoltage, power: clean(I * I * R) };
  });
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
  // Never NaN or Infinity in a result.
  const json = JSON.stringify(result, (_k, val) => (typeof val === "number" && !Number.isFinite(val) ? "__bad__" : val));
  if (json.includes("__bad__")) {
    return {
      ...JSON.parse(json.replace(/"__bad__"/g, "0")),
      status: "error",
      converged: false,
      issues: [...issues, { severity: "error", code: "numeric-failure", message: "Some values could not be computed; they are shown as 0. Check the circuit for extreme values.", ids: [] }],
    };
  }
  return result;
}
