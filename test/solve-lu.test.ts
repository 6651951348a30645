// The linear-algebra core: sparse LU with partial pivoting on MNA systems. Checks are the
// defining property (A·x = b to rounding, for random sparse matrices including zero diagonals),
// singular detection naming the unknown, and a closed-form circuit fact: an R-2R ladder halves
// the voltage at every rung (common practice / any DAC text).

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ComplexSystem, RealSystem } from "../src/solve/mna.js";
import { solveOperatingPoint } from "../src/solve/index.js";
import type { Element } from "../src/solve/netlist.js";

interface Entry { row: number; col: number; value: number }

/** Random sparse matrix: a permuted nonsingular diagonal (so zero diagonals occur) plus noise. */
const sparseSystem = fc.integer({ min: 1, max: 40 }).chain((n) =>
  fc.record({
    n: fc.constant(n),
    perm: fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
    pivots: fc.array(fc.double({ min: 0.5, max: 10, noNaN: true }), { minLength: n, maxLength: n }),
    extra: fc.array(
      fc.record({ row: fc.integer({ min: 0, max: n - 1 }), col: fc.integer({ min: 0, max: n - 1 }), value: fc.double({ min: -0.1, max: 0.1, noNaN: true }) }),
      { maxLength: 3 * n },
    ),
    x: fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
  }),
);

function entriesOf(s: { n: number; perm: number[]; pivots: number[]; extra: Entry[] }): Entry[] {
  // Row i has its dominant entry in column perm[i]: a permutation matrix scaled, plus small noise,
  // so the matrix is nonsingular but its diagonal is often zero.
  return [...s.perm.map((col, row) => ({ row, col, value: (s.pivots[row] ?? 1) * (row % 2 ? -1 : 1) })), ...s.extra];
}

describe("sparse LU", () => {
  it("solves random sparse systems with zero diagonals to rounding (real)", () => {
    fc.assert(
      fc.property(sparseSystem, (s) => {
        const entries = entriesOf(s);
        const sys = new RealSystem(s.n);
        sys.begin();
        for (const e of entries) sys.add(e.row, e.col, e.value);
        const b = new Float64Array(s.n);
        for (const e of entries) b[e.row] = (b[e.row] ?? 0) + e.value * (s.x[e.col] ?? 0);
        for (let i = 0; i < s.n; i++) sys.addRhs(i, b[i] ?? 0);
        const out = new Float64Array(s.n);
        const r = sys.solve(out);
        expect(r.ok).toBe(true);
        for (let i = 0; i < s.n; i++) expect(Math.abs((out[i] ?? NaN) - (s.x[i] ?? 0))).toBeLessThan(1e-9);
      }),
      { numRuns: 150 },
    );
  });

  it("solves random sparse systems (complex), re-using the symbolic analysis across assemblies", () => {
    fc.assert(
      fc.property(sparseSystem, fc.double({ min: -3, max: 3, noNaN: true }), (s, twist) => {
        const entries = entriesOf(s);
        const sys = new ComplexSystem(s.n);
        for (let pass = 0; pass < 2; pass++) {
          // Second pass: same pattern, different values (what an AC sweep does per frequency).
          const w = pass === 0 ? 0.3 : twist;
          sys.begin();
          const bRe = new Float64Array(s.n), bIm = new Float64Array(s.n);
          for (const e of entries) {
            const ar = e.value, ai = w * e.value;
            sys.add(e.row, e.col, ar, ai);
            const xr = s.x[e.col] ?? 0, xi = -(s.x[e.col] ?? 0) / 2;
            bRe[e.row] = (bRe[e.row] ?? 0) + ar * xr - ai * xi;
            bIm[e.row] = (bIm[e.row] ?? 0) + ar * xi + ai * xr;
          }
          for (let i = 0; i < s.n; i++) sys.addRhs(i, bRe[i] ?? 0, bIm[i] ?? 0);
          const outRe = new Float64Array(s.n), outIm = new Float64Array(s.n);
          expect(sys.solve(outRe, outIm).ok).toBe(true);
          for (let i = 0; i < s.n; i++) {
            expect(Math.abs((outRe[i] ?? NaN) - (s.x[i] ?? 0))).toBeLessThan(1e-8);
            expect(Math.abs((outIm[i] ?? NaN) + (s.x[i] ?? 0) / 2)).toBeLessThan(1e-8);
          }
        }
      }),
      { numRuns: 100 },
    );
  });

  it("reports the unknown whose column has no pivot", () => {
    const sys = new RealSystem(3);
    sys.begin();
    sys.add(0, 0, 2);
    sys.add(2, 2, 1);
    // Unknown 1 appears in no equation: a floating node.
    sys.addRhs(0, 1);
    const r = sys.solve(new Float64Array(3));
    expect(r).toEqual({ ok: false, singularUnknown: 1 });
  });

  it("detects linearly dependent rows (two sources fixing the same node)", () => {
    // Unknowns: V(a), I1, I2.  KCL at a: I1 + I2 = 0;  V(a) = 5;  V(a) = 5.
    const sys = new RealSystem(3);
    sys.begin();
    sys.add(0, 1, 1); sys.add(0, 2, 1);
    sys.add(1, 0, 1); sys.addRhs(1, 5);
    sys.add(2, 0, 1); sys.addRhs(2, 5);
    expect(sys.solve(new Float64Array(3)).ok).toBe(false);
  });
});

describe("MNA on a closed-form circuit", () => {
  it("an R-2R ladder of 200 rungs halves the voltage at each rung", () => {
    // Node k is fed from node k−1 through R and loaded by 2R to ground; the last rung ends in 2R,
    // so every node sees 2R looking right and V(k) = V(k−1)/2 exactly.
    const R = 1e3;
    const rungs = 200;
    const elements: Element[] = [{ kind: "V", name: "VREF", pos: "n0", neg: "0", dc: 1 }];
    for (let k = 1; k <= rungs; k++) {
      elements.push({ kind: "R", name: `RS${k}`, a: `n${k - 1}`, b: `n${k}`, ohms: R });
      elements.push({ kind: "R", name: `RP${k}`, a: `n${k}`, b: "0", ohms: 2 * R });
    }
    // Terminating the last rung with a second 2R makes every node see 2R ∥ 2R = R below it.
    elements.push({ kind: "R", name: "RT", a: `n${rungs}`, b: "0", ohms: 2 * R });
    const op = solveOperatingPoint({ title: "R-2R ladder", elements });
    expect(op.converged).toBe(true);
    for (let k = 1; k <= 40; k++) {
      const expected = Math.pow(0.5, k);
      expect(Math.abs((op.nodeVoltages[`n${k}`] ?? NaN) / expected - 1)).toBeLessThan(1e-9);
    }
    // Current from the reference: the ladder's input resistance is 2R → 0.5 mA delivered.
    expect(op.deliveredCurrents["VREF"]).toBeCloseTo(1 / (2 * R), 12);
  });
});
