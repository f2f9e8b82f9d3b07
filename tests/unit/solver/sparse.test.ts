import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildPattern, minimumDegree, numeric, position, solveFactored, symbolic } from "@/lib/solver/sparse";

describe("sparse LDL^T kernel", () => {
  it("solves random weighted-Laplacian systems (grounded) to 1e-10 against the residual", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 60 }), fc.integer({ min: 0, max: 1_000_000 }), (n, seed) => {
        let s = seed;
        const rnd = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
        const m = n * 2;
        const ea = new Int32Array(m);
        const eb = new Int32Array(m);
        const g = new Float64Array(m);
        for (let k = 0; k < m; k++) {
          ea[k] = k < n - 1 ? k : Math.floor(rnd() * n);
          eb[k] = k < n - 1 ? k + 1 : Math.floor(rnd() * n);
          g[k] = 0.001 + rnd() * 1000;
        }
        const p = buildPattern(n, ea, eb, m);
        const ax = new Float64Array(p.rowIdx.length);
        for (let k = 0; k < m; k++) {
          if (ea[k] === eb[k]) continue;
          ax[position(p, ea[k], ea[k])] += g[k];
          ax[position(p, eb[k], eb[k])] += g[k];
          ax[position(p, ea[k], eb[k])] -= g[k];
          ax[position(p, eb[k], ea[k])] -= g[k];
        }
        ax[position(p, 0, 0)] += 1; // a path to ground
        const sym = symbolic(p, minimumDegree(p));
        expect(numeric(p, ax, sym)).toBe(-1);
        const b = Float64Array.from({ length: n }, () => rnd() - 0.5);
        const x = new Float64Array(n);
        solveFactored(sym, b, x);
        let worst = 0;
        let scale = 0;
        for (let j = 0; j < n; j++) {
          let r = -b[j];
          for (let q = p.colPtr[j]; q < p.colPtr[j + 1]; q++) r += ax[q] * x[p.rowIdx[q]];
          worst = Math.max(worst, Math.abs(r));
          scale = Math.max(scale, Math.abs(b[j]));
        }
        expect(worst).toBeLessThan(1e-10 * Math.max(1, scale) * 1000);
      }),
      { numRuns: 100 },
    );
  });

  it("orders every node once; a tree gets no fill, and a hub's fill stays in the hub's own row", () => {
    // A tree has an elimination order with no fill (leaves first): George and Liu, "Computer Solution of Large Sparse
    // Positive Definite Systems" (1981), on perfect elimination orderings (from memory). A hub with very many
    // neighbours is ordered last without taking part in the degree count (as approximate minimum degree treats dense
    // rows), so eliminating its neighbours may fill its row of L, and nothing else.
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 3000 }), fc.integer({ min: 0, max: 1_000_000 }), fc.boolean(), (n, seed, star) => {
        let s = seed;
        const rnd = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
        const ea = new Int32Array(n - 1);
        const eb = new Int32Array(n - 1);
        const edges = new Set<number>();
        // A random tree, or a star around node 0 with random branches.
        for (let k = 1; k < n; k++) {
          ea[k - 1] = k;
          eb[k - 1] = star && rnd() < 0.7 ? 0 : Math.floor(rnd() * k);
          edges.add(k * n + eb[k - 1]).add(eb[k - 1] * n + k);
        }
        const p = buildPattern(n, ea, eb, n - 1);
        const order = minimumDegree(p);
        expect([...order].sort((x, y) => x - y)).toEqual(Array.from({ length: n }, (_, i) => i));
        const sym = symbolic(p, order);
        const ax = new Float64Array(p.rowIdx.length);
        for (let k = 0; k < n - 1; k++) {
          ax[position(p, ea[k], ea[k])] += 1;
          ax[position(p, eb[k], eb[k])] += 1;
          ax[position(p, ea[k], eb[k])] -= 1;
          ax[position(p, eb[k], ea[k])] -= 1;
        }
        ax[position(p, 0, 0)] += 1;
        expect(numeric(p, ax, sym)).toBe(-1);
        const hubs = new Set<number>();
        for (let j = 0; j < n; j++) if (p.colPtr[j + 1] - p.colPtr[j] - 1 > Math.max(32, Math.floor(2 * Math.sqrt(n)))) hubs.add(j);
        for (let j = 0; j < n; j++) {
          for (let q = sym.lp[j]; q < sym.lp[j + 1]; q++) {
            const row = order[sym.li[q]];
            const col = order[j];
            if (!edges.has(row * n + col)) expect(hubs.has(row)).toBe(true);
          }
        }
        if (hubs.size === 0) expect(sym.lp[n]).toBe(n - 1);
      }),
      { numRuns: 60 },
    );
  });

  it("reports a matrix that is not positive definite", () => {
    const p = buildPattern(2, Int32Array.of(0), Int32Array.of(1), 1);
    const ax = new Float64Array(p.rowIdx.length);
    ax[position(p, 0, 0)] = 1;
    ax[position(p, 1, 1)] = 1;
    ax[position(p, 0, 1)] = -1;
    ax[position(p, 1, 0)] = -1; // a floating pair: singular
    expect(numeric(p, ax, symbolic(p, minimumDegree(p)))).toBeGreaterThanOrEqual(0);
  });
});
