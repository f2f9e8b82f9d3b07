/**
 * A compact sparse LDL^T kernel on typed arrays for the symmetric positive definite systems nodal analysis gives:
 * a minimum-degree ordering, a symbolic factorisation (elimination tree and column counts) that is reused while
 * only the values change (Newton steps), and the up-looking numeric factorisation of T. A. Davis's LDL.
 * Written here because mathjs's sparse LU measured about 40 ms at 1,000 nodes (see scripts/bench-solver.ts).
 */

/** A symmetric matrix pattern in compressed sparse columns, both triangles stored, diagonal included. */
export type Pattern = { n: number; colPtr: Int32Array; rowIdx: Int32Array };

/** Builds the pattern from edge lists (a[k], b[k]) between 0..n-1; every diagonal is present. */
export function buildPattern(n: number, ea: Int32Array, eb: Int32Array, m: number): Pattern {
  const count = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) count[i]++;
  for (let k = 0; k < m; k++) {
    if (ea[k] === eb[k]) continue;
    count[ea[k]]++;
    count[eb[k]]++;
  }
  const start = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) start[i + 1] = start[i] + count[i];
  const fill = start.slice(0, n);
  const rows = new Int32Array(start[n]);
  for (let i = 0; i < n; i++) rows[fill[i]++] = i;
  for (let k = 0; k < m; k++) {
    const a = ea[k];
    const b = eb[k];
    if (a === b) continue;
    rows[fill[a]++] = b;
    rows[fill[b]++] = a;
  }
  // Sort each column and drop duplicates.
  const colPtr = new Int32Array(n + 1);
  let w = 0;
  for (let j = 0; j < n; j++) {
    const s = start[j];
    const e = start[j + 1];
    const seg = rows.subarray(s, e);
    seg.sort();
    colPtr[j] = w;
    let last = -1;
    for (let p = s; p < e; p++) {
      const r = rows[p];
      if (r !== last) rows[w++] = r;
      last = r;
    }
  }
  colPtr[n] = w;
  return { n, colPtr, rowIdx: rows.slice(0, w) };
}

/** Position of entry (row, col) in the pattern's value array, or -1. */
export function position(p: Pattern, row: number, col: number): number {
  let lo = p.colPtr[col];
  let hi = p.colPtr[col + 1] - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const r = p.rowIdx[mid];
    if (r === row) return mid;
    if (r < row) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/**
 * Minimum-degree ordering on the explicit elimination graph. Harness circuits are nearly trees with a few hubs
 * (ground points, bus bars), so fill is small. Hubs with more than max(32, 2 sqrt(n)) neighbours are left out of the
 * graph and ordered last (as approximate minimum degree does with dense rows); the rest keep their neighbour lists in
 * one typed-array pool with room to grow, and degrees in doubly linked buckets.
 */
export function minimumDegree(p: Pattern): Int32Array {
  const n = p.n;
  const order = new Int32Array(n);
  if (n === 0) return order;
  const denseAbove = Math.max(32, Math.floor(2 * Math.sqrt(n)));
  const dense = new Uint8Array(n);
  let denseCount = 0;
  for (let j = 0; j < n; j++) {
    if (p.colPtr[j + 1] - p.colPtr[j] - 1 > denseAbove) {
      dense[j] = 1;
      denseCount++;
    }
  }
  // Neighbour lists: node v's are pool[start[v] .. start[v] + len[v]), with cap[v] slots.
  const start = new Int32Array(n);
  const len = new Int32Array(n);
  const cap = new Int32Array(n);
  let used = 0;
  for (let j = 0; j < n; j++) {
    start[j] = used;
    cap[j] = p.colPtr[j + 1] - p.colPtr[j] + 4;
    used += cap[j];
  }
  let pool = new Int32Array(used * 2);
  for (let j = 0; j < n; j++) {
    if (dense[j]) continue;
    let w = start[j];
    for (let q = p.colPtr[j]; q < p.colPtr[j + 1]; q++) {
      const i = p.rowIdx[q];
      if (i !== j && !dense[i]) pool[w++] = i;
    }
    len[j] = w - start[j];
  }
  const append = (v: number, u: number) => {
    if (len[v] === cap[v]) {
      const c = 2 * cap[v] + 4;
      if (used + c > pool.length) {
        const bigger = new Int32Array(2 * (used + c));
        bigger.set(pool.subarray(0, used));
        pool = bigger;
      }
      pool.copyWithin(used, start[v], start[v] + len[v]);
      start[v] = used;
      cap[v] = c;
      used += c;
    }
    pool[start[v] + len[v]++] = u;
  };
  // Degree buckets as doubly linked lists.
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n);
  const prev = new Int32Array(n);
  const link = (v: number) => {
    const d = len[v];
    next[v] = head[d];
    prev[v] = -1;
    if (head[d] >= 0) prev[head[d]] = v;
    head[d] = v;
  };
  const unlink = (v: number) => {
    if (prev[v] >= 0) next[prev[v]] = next[v];
    else head[len[v]] = next[v];
    if (next[v] >= 0) prev[next[v]] = prev[v];
  };
  for (let j = n - 1; j >= 0; j--) if (!dense[j]) link(j);
  const mark = new Int32Array(n);
  let stamp = 0;
  const nb = new Int32Array(n);
  let minD = 0;
  const sparseCount = n - denseCount;
  for (let k = 0; k < sparseCount; k++) {
    while (head[minD] < 0) minD++;
    const v = head[minD];
    unlink(v);
    order[k] = v;
    const m = len[v];
    const sv = start[v];
    for (let i = 0; i < m; i++) nb[i] = pool[sv + i];
    len[v] = 0;
    // Take v out of its neighbours' lists (their degrees change: out of their buckets first).
    for (let i = 0; i < m; i++) {
      const u = nb[i];
      unlink(u);
      const su = start[u];
      const e = su + len[u];
      for (let q = su; q < e; q++) {
        if (pool[q] === v) {
          pool[q] = pool[e - 1];
          len[u]--;
          break;
        }
      }
    }
    // The neighbours become a clique (the fill of eliminating v).
    for (let i = 0; i < m; i++) {
      const u = nb[i];
      stamp++;
      mark[u] = stamp;
      const su = start[u];
      const e = su + len[u];
      for (let q = su; q < e; q++) mark[pool[q]] = stamp;
      for (let j = 0; j < m; j++) if (mark[nb[j]] !== stamp) append(u, nb[j]);
    }
    for (let i = 0; i < m; i++) {
      const u = nb[i];
      link(u);
      if (len[u] < minD) minD = len[u];
    }
  }
  // The hubs last, fewest neighbours first.
  const hubs: number[] = [];
  for (let j = 0; j < n; j++) if (dense[j]) hubs.push(j);
  hubs.sort((x, y) => p.colPtr[x + 1] - p.colPtr[x] - (p.colPtr[y + 1] - p.colPtr[y]));
  for (let i = 0; i < hubs.length; i++) order[sparseCount + i] = hubs[i];
  return order;
}

export type Symbolic = {
  n: number;
  perm: Int32Array;
  pinv: Int32Array;
  parent: Int32Array;
  lp: Int32Array;
  li: Int32Array;
  lx: Float64Array;
  d: Float64Array;
  // work arrays
  lnz: Int32Array;
  flag: Int32Array;
  y: Float64Array;
  pattern: Int32Array;
  x: Float64Array;
};

/** Elimination tree and column counts of the permuted matrix. */
export function symbolic(p: Pattern, perm: Int32Array): Symbolic {
  const n = p.n;
  const pinv = new Int32Array(n);
  for (let k = 0; k < n; k++) pinv[perm[k]] = k;
  const parent = new Int32Array(n);
  const lnz = new Int32Array(n);
  const flag = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    parent[k] = -1;
    flag[k] = k;
    lnz[k] = 0;
    const kk = perm[k];
    for (let q = p.colPtr[kk]; q < p.colPtr[kk + 1]; q++) {
      let i = pinv[p.rowIdx[q]];
      if (i < k) {
        for (; flag[i] !== k; i = parent[i]) {
          if (parent[i] === -1) parent[i] = k;
          lnz[i]++;
          flag[i] = k;
        }
      }
    }
  }
  const lp = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) lp[k + 1] = lp[k] + lnz[k];
  return {
    n,
    perm,
    pinv,
    parent,
    lp,
    li: new Int32Array(lp[n]),
    lx: new Float64Array(lp[n]),
    d: new Float64Array(n),
    lnz,
    flag,
    y: new Float64Array(n),
    pattern: new Int32Array(n),
    x: new Float64Array(n),
  };
}

/**
 * Numeric LDL^T of the matrix with values ax on pattern p. Returns -1 on success, or the column whose pivot was not
 * positive (the matrix is not positive definite: a singular or indefinite system).
 */
export function numeric(p: Pattern, ax: Float64Array, s: Symbolic): number {
  const { n, perm, pinv, parent, lp, li, lx, d, lnz, flag, y, pattern } = s;
  const colPtr = p.colPtr;
  const rowIdx = p.rowIdx;
  for (let k = 0; k < n; k++) {
    y[k] = 0;
    let top = n;
    flag[k] = k;
    lnz[k] = 0;
    const kk = perm[k];
    for (let q = colPtr[kk]; q < colPtr[kk + 1]; q++) {
      let i = pinv[rowIdx[q]];
      if (i <= k) {
        y[i] += ax[q];
        let len = 0;
        for (; flag[i] !== k; i = parent[i]) {
          pattern[len++] = i;
          flag[i] = k;
        }
        while (len > 0) pattern[--top] = pattern[--len];
      }
    }
    let dk = y[k];
    y[k] = 0;
    for (; top < n; top++) {
      const i = pattern[top];
      const yi = y[i];
      y[i] = 0;
      const p2 = lp[i] + lnz[i];
      for (let q = lp[i]; q < p2; q++) y[li[q]] -= lx[q] * yi;
      const lki = yi / d[i];
      dk -= lki * yi;
      li[p2] = k;
      lx[p2] = lki;
      lnz[i]++;
    }
    if (!(dk > 0)) return k;
    d[k] = dk;
  }
  return -1;
}

/** Solves A x = b with the factorisation; b is not changed, the answer is written to out. */
export function solveFactored(s: Symbolic, b: Float64Array, out: Float64Array): void {
  const { n, perm, lp, li, lx, d, x } = s;
  for (let k = 0; k < n; k++) x[k] = b[perm[k]];
  for (let j = 0; j < n; j++) {
    const xj = x[j];
    if (xj !== 0) for (let q = lp[j]; q < lp[j + 1]; q++) x[li[q]] -= lx[q] * xj;
  }
  for (let j = 0; j < n; j++) x[j] /= d[j];
  for (let j = n - 1; j >= 0; j--) {
    let xj = x[j];
    for (let q = lp[j]; q < lp[j + 1]; q++) xj -= lx[q] * x[li[q]];
    x[j] = xj;
  }
  for (let k = 0; k < n; k++) out[perm[k]] = x[k];
}
