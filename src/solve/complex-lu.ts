// Complex sparse LU for the AC sweep: the left-looking factorisation of sparse-lu.ts on complex
// values, kept in split re/im arrays so nothing is allocated per operation, and the in-place
// refactorisation from its plan — also for two frequencies at once, which reads every index of
// the plan once for both matrices (each still sees exactly the operations it would alone).

import type { CscPattern } from "./ordering.js";
import { GrowableValues, SINGULAR_RELATIVE, SparseLuBase, type FactorOutcome, type RefactorPlan } from "./sparse-lu.js";
import { float64Views, NO_DOUBLES } from "./views.js";

export class ComplexSparseLu extends SparseLuBase {
  private readonly Lr: GrowableValues;
  private readonly Lm: GrowableValues;
  private readonly Ur: GrowableValues;
  private readonly Um: GrowableValues;
  /** Real and imaginary factors in the layout of SparseLuBase.plan. */
  private Fr: Float64Array = NO_DOUBLES;
  private Fm: Float64Array = NO_DOUBLES;
  private readonly xr: Float64Array;
  private readonly xm: Float64Array;
  private readonly yr: Float64Array;
  private readonly ym: Float64Array;

  constructor(n: number, capacityHint = 4 * n) {
    const capacity = Math.max(16, capacityHint);
    super(n, capacity);
    const [Lr, Lm, Ur, Um, xr, xm, yr, ym] = float64Views([capacity, capacity, capacity, capacity, n, n, n, n] as const);
    this.Lr = new GrowableValues(Lr);
    this.Lm = new GrowableValues(Lm);
    this.Ur = new GrowableValues(Ur);
    this.Um = new GrowableValues(Um);
    this.xr = xr;
    this.xm = xm;
    this.yr = yr;
    this.ym = ym;
  }

  private ensureFactorArrays(size: number): void {
    if (this.Fr.length >= size) return;
    [this.Fr, this.Fm] = float64Views([size, size] as const);
  }

  factor(pattern: CscPattern, re: Float64Array, im: Float64Array, order: Int32Array, pivotTolerance: number): FactorOutcome {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, xr = this.xr, xm = this.xm, xi = this.xi, Lp = this.Lp, Up = this.Up;
    this.order = order;
    pinv.fill(-1);
    const tol2 = pivotTolerance * pivotTolerance;
    let lnz = 0, unz = 0;
    for (let k = 0; k < n; k++) {
      Lp[k] = lnz;
      Up[k] = unz;
      this.Li.ensure(lnz + n); this.Lr.ensure(lnz + n); this.Lm.ensure(lnz + n);
      this.Ui.ensure(unz + n); this.Ur.ensure(unz + n); this.Um.ensure(unz + n);
      const Li = this.Li.data, Lr = this.Lr.data, Lm = this.Lm.data;
      const Ui = this.Ui.data, Ur = this.Ur.data, Um = this.Um.data;
      const col = order[k] as number;
      const top = this.reach(pattern, col);
      for (let p = top; p < n; p++) { const i = xi[p] as number; xr[i] = 0; xm[i] = 0; }
      let colMax2 = 0;
      const aEnd = colPtr[col + 1] as number;
      for (let p = colPtr[col] as number; p < aEnd; p++) {
        const i = rowIdx[p] as number;
        const vr = re[p] as number, vm = im[p] as number;
        xr[i] = vr; xm[i] = vm;
        const m2 = vr * vr + vm * vm;
        if (m2 > colMax2) colMax2 = m2;
      }
      for (let px = top; px < n; px++) {
        const j = xi[px] as number;
        const J = pinv[j] as number;
        if (J < 0) continue;
        const ar = xr[j] as number, am = xm[j] as number;
        if (ar === 0 && am === 0) continue;
        const end = Lp[J + 1] as number;
        for (let p = (Lp[J] as number) + 1; p < end; p++) {
          const i = Li[p] as number;
          const lr = Lr[p] as number, lm = Lm[p] as number;
          xr[i] = (xr[i] as number) - (lr * ar - lm * am);
          xm[i] = (xm[i] as number) - (lr * am + lm * ar);
        }
      }
      let ipiv = -1, best2 = -1;
      for (let p = top; p < n; p++) {
        const i = xi[p] as number;
        if ((pinv[i] as number) < 0) {
          const vr = xr[i] as number, vm = xm[i] as number;
          const t = vr * vr + vm * vm;
          if (t > best2) { best2 = t; ipiv = i; }
        } else {
          Ui[unz] = pinv[i] as number;
          Ur[unz] = xr[i] as number;
          Um[unz++] = xm[i] as number;
        }
      }
      const rel2 = SINGULAR_RELATIVE * SINGULAR_RELATIVE;
      if (ipiv < 0 || !(best2 > rel2 * colMax2) || best2 === 0) return { ok: false, singularColumn: col };
      if ((pinv[col] as number) < 0) {
        const dr = xr[col] as number, dm = xm[col] as number;
        if (dr * dr + dm * dm >= best2 * tol2) ipiv = col;
      }
      const pr = xr[ipiv] as number, pm = xm[ipiv] as number;
      const pmag2 = pr * pr + pm * pm;
      // 1/pivot = conj(pivot)/|pivot|²
      const invR = pr / pmag2, invM = -pm / pmag2;
      Ui[unz] = k;
      Ur[unz] = pr;
      Um[unz++] = pm;
      pinv[ipiv] = k;
      Li[lnz] = ipiv;
      Lr[lnz] = 1;
      Lm[lnz++] = 0;
      for (let p = top; p < n; p++) {
        const i = xi[p] as number;
        if ((pinv[i] as number) < 0) {
          const vr = xr[i] as number, vm = xm[i] as number;
          Li[lnz] = i;
          Lr[lnz] = vr * invR - vm * invM;
          Lm[lnz++] = vr * invM + vm * invR;
        }
        xr[i] = 0;
        xm[i] = 0;
      }
    }
    Lp[n] = lnz;
    Up[n] = unz;
    this.finishPattern();
    this.ensureFactorArrays(unz + lnz);
    const Fr = this.Fr, Fm = this.Fm;
    Fr.set(this.Ur.data.subarray(0, unz), 0);
    Fm.set(this.Um.data.subarray(0, unz), 0);
    Fr.set(this.Lr.data.subarray(0, lnz), unz);
    Fm.set(this.Lm.data.subarray(0, lnz), unz);
    return { ok: true };
  }

  /** Complex counterpart of RealSparseLu.refactor. */
  refactor(pattern: CscPattern, re: Float64Array, im: Float64Array, count: number, positions: Int32Array, pivotTolerance: number): boolean {
    const plan = this.planFor(pattern);
    const Fr = this.Fr, Fm = this.Fm;
    Fr.fill(0, 0, plan.size);
    Fm.fill(0, 0, plan.size);
    for (let i = 0; i < count; i++) {
      const f = positions[i] as number;
      Fr[f] = re[i] as number;
      Fm[f] = im[i] as number;
    }
    return this.eliminate(plan, pivotTolerance);
  }

  /**
   * An affine-in-ω matrix Y0 + ω·Y1 in the factors' layout: Y0 in full (zero where L and U fill
   * in), Y1 only where it is not zero (the capacitances — a fraction of the entries).
   */
  private affine: {
    plan: RefactorPlan;
    y0r: Float64Array; y0m: Float64Array;
    at: Int32Array; y1r: Float64Array; y1m: Float64Array;
  } | null = null;

  /**
   * Remembers Y0 and Y1 (slot values placed by `positions`) for refactorAffine, which then forms
   * Y0 + ω·Y1 as a copy of Y0 plus ω·Y1 where Y1 has entries.
   */
  loadAffine(pattern: CscPattern, y0Re: Float64Array, y0Im: Float64Array, y1Re: Float64Array, y1Im: Float64Array, count: number, positions: Int32Array): void {
    const plan = this.planFor(pattern);
    let varying = 0;
    for (let i = 0; i < count; i++) if (y1Re[i] !== 0 || y1Im[i] !== 0) varying++;
    const [y0r, y0m, y1r, y1m] = float64Views([plan.size, plan.size, varying, varying] as const);
    const at = new Int32Array(varying);
    for (let i = 0, v = 0; i < count; i++) {
      const f = positions[i] as number;
      y0r[f] = y0Re[i] as number;
      y0m[f] = y0Im[i] as number;
      if (y1Re[i] !== 0 || y1Im[i] !== 0) {
        at[v] = f;
        y1r[v] = y1Re[i] as number;
        y1m[v++] = y1Im[i] as number;
      }
    }
    this.affine = { plan, y0r, y0m, at, y1r, y1m };
  }

  /** refactor() of Y0 + ω·Y1 as given to loadAffine; false also when nothing is loaded for this plan. */
  refactorAffine(omega: number, pivotTolerance: number): boolean {
    const a = this.affine;
    if (!a || a.plan !== this.plan) return false;
    const Fr = this.Fr, Fm = this.Fm, { y0r, y0m, at, y1r, y1m } = a;
    // Where Y1 is zero, Y0 + ω·0 is Y0 exactly (Y0, a sum started from +0, is never −0).
    Fr.set(y0r);
    Fm.set(y0m);
    for (let v = 0; v < at.length; v++) {
      const f = at[v] as number;
      Fr[f] = (y0r[f] as number) + omega * (y1r[v] as number);
      Fm[f] = (y0m[f] as number) + omega * (y1m[v] as number);
    }
    return this.eliminate(a.plan, pivotTolerance);
  }

  private eliminate(plan: RefactorPlan, pivotTolerance: number): boolean {
    const n = this.n, Fr = this.Fr, Fm = this.Fm, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    const tol2 = pivotTolerance * pivotTolerance;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1] as number;
      for (; g < gEnd; g++) {
        const m = multiplier[g] as number;
        const ar = Fr[m] as number, am = Fm[m] as number;
        if (ar === 0 && am === 0) continue;
        const end = groupTargets[g + 1] as number;
        for (let t = groupTargets[g] as number, q = lFirst[g] as number; t < end; t++, q++) {
          const i = targets[t] as number;
          const lr = Fr[q] as number, lm = Fm[q] as number;
          Fr[i] = (Fr[i] as number) - (lr * ar - lm * am);
          Fm[i] = (Fm[i] as number) - (lr * am + lm * ar);
        }
      }
      const d = (Up[k + 1] as number) - 1;
      const pr = Fr[d] as number, pm = Fm[d] as number;
      const pmag2 = pr * pr + pm * pm;
      const invR = pr / pmag2, invM = -pm / pmag2;
      const lStart = unz + (Lp[k] as number) + 1, lEnd = unz + (Lp[k + 1] as number);
      let largest2 = 0;
      for (let q = lStart; q < lEnd; q++) {
        const vr = Fr[q] as number, vm = Fm[q] as number;
        largest2 = Math.max(largest2, vr * vr + vm * vm);
        Fr[q] = vr * invR - vm * invM;
        Fm[q] = vr * invM + vm * invR;
      }
      if (!(pmag2 > 0) || pmag2 < tol2 * largest2) return false;
    }
    return true;
  }

  solve(bRe: Float64Array, bIm: Float64Array, outRe: Float64Array, outIm: Float64Array): void {
    const n = this.n, pinv = this.pinv, yr = this.yr, ym = this.ym, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, Fr = this.Fr, Fm = this.Fm;
    const unz = Up[n] as number;
    for (let i = 0; i < n; i++) {
      const k = pinv[i] as number;
      yr[k] = bRe[i] as number;
      ym[k] = bIm[i] as number;
    }
    for (let j = 0; j < n; j++) {
      const ar = yr[j] as number, am = ym[j] as number;
      if (ar === 0 && am === 0) continue;
      const end = Lp[j + 1] as number;
      for (let p = (Lp[j] as number) + 1; p < end; p++) {
        const i = Li[p] as number;
        const lr = Fr[unz + p] as number, lm = Fm[unz + p] as number;
        yr[i] = (yr[i] as number) - (lr * ar - lm * am);
        ym[i] = (ym[i] as number) - (lr * am + lm * ar);
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = (Up[j + 1] as number) - 1;
      const dr = Fr[last] as number, dm = Fm[last] as number;
      const d2 = dr * dr + dm * dm;
      const vr = yr[j] as number, vm = ym[j] as number;
      const ar = (vr * dr + vm * dm) / d2;
      const am = (vm * dr - vr * dm) / d2;
      yr[j] = ar;
      ym[j] = am;
      if (ar === 0 && am === 0) continue;
      for (let p = Up[j] as number; p < last; p++) {
        const i = Ui[p] as number;
        const ur = Fr[p] as number, um = Fm[p] as number;
        yr[i] = (yr[i] as number) - (ur * ar - um * am);
        ym[i] = (ym[i] as number) - (ur * am + um * ar);
      }
    }
    for (let k = 0; k < n; k++) {
      const o = order[k] as number;
      outRe[o] = yr[k] as number;
      outIm[o] = ym[k] as number;
    }
  }

  /** Factors of the second matrix of a pair (see refactorAffinePair), in the layout of Fr/Fm. */
  private Gr: Float64Array = NO_DOUBLES;
  private Gm: Float64Array = NO_DOUBLES;
  private zr: Float64Array = NO_DOUBLES;
  private zm: Float64Array = NO_DOUBLES;

  /**
   * refactorAffine at two frequencies in one pass over the plan: each index is read once for
   * both matrices. Each matrix sees exactly the operations refactorAffine would do; false when
   * either needs fresh pivots (the caller then takes the points one at a time).
   */
  refactorAffinePair(omegaA: number, omegaB: number, pivotTolerance: number): boolean {
    const a = this.affine;
    if (!a || a.plan !== this.plan) return false;
    const plan = a.plan, size = plan.size;
    if (this.Gr.length < size) [this.Gr, this.Gm] = float64Views([size, size] as const);
    const Fr = this.Fr, Fm = this.Fm, Gr = this.Gr, Gm = this.Gm, { y0r, y0m, at, y1r, y1m } = a;
    Fr.set(y0r);
    Fm.set(y0m);
    Gr.set(y0r);
    Gm.set(y0m);
    for (let v = 0; v < at.length; v++) {
      const f = at[v] as number;
      const r0 = y0r[f] as number, m0 = y0m[f] as number, r1 = y1r[v] as number, m1 = y1m[v] as number;
      Fr[f] = r0 + omegaA * r1;
      Fm[f] = m0 + omegaA * m1;
      Gr[f] = r0 + omegaB * r1;
      Gm[f] = m0 + omegaB * m1;
    }
    const n = this.n, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    const tol2 = pivotTolerance * pivotTolerance;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1] as number;
      for (; g < gEnd; g++) {
        const m = multiplier[g] as number;
        const ar = Fr[m] as number, am = Fm[m] as number, br = Gr[m] as number, bm = Gm[m] as number;
        const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
        if (skipA && skipB) continue;
        const start = groupTargets[g] as number, end = groupTargets[g + 1] as number, q0 = lFirst[g] as number;
        if (!skipA && !skipB) {
          for (let t = start, q = q0; t < end; t++, q++) {
            const i = targets[t] as number;
            const lr = Fr[q] as number, lm = Fm[q] as number, kr = Gr[q] as number, km = Gm[q] as number;
            Fr[i] = (Fr[i] as number) - (lr * ar - lm * am);
            Fm[i] = (Fm[i] as number) - (lr * am + lm * ar);
            Gr[i] = (Gr[i] as number) - (kr * br - km * bm);
            Gm[i] = (Gm[i] as number) - (kr * bm + km * br);
          }
        } else {
          const Xr = skipA ? Gr : Fr, Xm = skipA ? Gm : Fm, xr = skipA ? br : ar, xm = skipA ? bm : am;
          for (let t = start, q = q0; t < end; t++, q++) {
            const i = targets[t] as number;
            const lr = Xr[q] as number, lm = Xm[q] as number;
            Xr[i] = (Xr[i] as number) - (lr * xr - lm * xm);
            Xm[i] = (Xm[i] as number) - (lr * xm + lm * xr);
          }
        }
      }
      const d = (Up[k + 1] as number) - 1;
      const pr = Fr[d] as number, pm = Fm[d] as number, sr = Gr[d] as number, sm = Gm[d] as number;
      const pmag2 = pr * pr + pm * pm, smag2 = sr * sr + sm * sm;
      const invR = pr / pmag2, invM = -pm / pmag2, jnvR = sr / smag2, jnvM = -sm / smag2;
      const lStart = unz + (Lp[k] as number) + 1, lEnd = unz + (Lp[k + 1] as number);
      let largestA = 0, largestB = 0;
      for (let q = lStart; q < lEnd; q++) {
        const vr = Fr[q] as number, vm = Fm[q] as number, wr = Gr[q] as number, wm = Gm[q] as number;
        largestA = Math.max(largestA, vr * vr + vm * vm);
        largestB = Math.max(largestB, wr * wr + wm * wm);
        Fr[q] = vr * invR - vm * invM;
        Fm[q] = vr * invM + vm * invR;
        Gr[q] = wr * jnvR - wm * jnvM;
        Gm[q] = wr * jnvM + wm * jnvR;
      }
      if (!(pmag2 > 0) || pmag2 < tol2 * largestA || !(smag2 > 0) || smag2 < tol2 * largestB) return false;
    }
    return true;
  }

  /** solve() with both factorisations of the last refactorAffinePair, for one right-hand side. */
  solvePair(bRe: Float64Array, bIm: Float64Array, aRe: Float64Array, aIm: Float64Array, cRe: Float64Array, cIm: Float64Array): void {
    const n = this.n, pinv = this.pinv, order = this.order;
    if (this.zr.length < n) [this.zr, this.zm] = float64Views([n, n] as const);
    const yr = this.yr, ym = this.ym, zr = this.zr, zm = this.zm;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, Fr = this.Fr, Fm = this.Fm, Gr = this.Gr, Gm = this.Gm;
    const unz = Up[n] as number;
    // A sweep drives one source: the right-hand side has a nonzero or two, so clear and place
    // those (its entries are sums started from +0, never −0, so skipping the zeros is exact).
    yr.fill(0, 0, n);
    ym.fill(0, 0, n);
    for (let i = 0; i < n; i++) {
      const re = bRe[i] as number, im = bIm[i] as number;
      if (re === 0 && im === 0) continue;
      const k = pinv[i] as number;
      yr[k] = re;
      ym[k] = im;
    }
    zr.set(yr.subarray(0, n));
    zm.set(ym.subarray(0, n));
    for (let j = 0; j < n; j++) {
      const ar = yr[j] as number, am = ym[j] as number, br = zr[j] as number, bm = zm[j] as number;
      const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
      if (skipA && skipB) continue;
      const end = Lp[j + 1] as number;
      for (let p = (Lp[j] as number) + 1; p < end; p++) {
        const i = Li[p] as number;
        if (!skipA) {
          const lr = Fr[unz + p] as number, lm = Fm[unz + p] as number;
          yr[i] = (yr[i] as number) - (lr * ar - lm * am);
          ym[i] = (ym[i] as number) - (lr * am + lm * ar);
        }
        if (!skipB) {
          const kr = Gr[unz + p] as number, km = Gm[unz + p] as number;
          zr[i] = (zr[i] as number) - (kr * br - km * bm);
          zm[i] = (zm[i] as number) - (kr * bm + km * br);
        }
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = (Up[j + 1] as number) - 1;
      const dr = Fr[last] as number, dm = Fm[last] as number, er = Gr[last] as number, em = Gm[last] as number;
      const d2 = dr * dr + dm * dm, e2 = er * er + em * em;
      const vr = yr[j] as number, vm = ym[j] as number, wr = zr[j] as number, wm = zm[j] as number;
      const ar = (vr * dr + vm * dm) / d2, am = (vm * dr - vr * dm) / d2;
      const br = (wr * er + wm * em) / e2, bm = (wm * er - wr * em) / e2;
      yr[j] = ar;
      ym[j] = am;
      zr[j] = br;
      zm[j] = bm;
      const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
      if (skipA && skipB) continue;
      for (let p = Up[j] as number; p < last; p++) {
        const i = Ui[p] as number;
        if (!skipA) {
          const ur = Fr[p] as number, um = Fm[p] as number;
          yr[i] = (yr[i] as number) - (ur * ar - um * am);
          ym[i] = (ym[i] as number) - (ur * am + um * ar);
        }
        if (!skipB) {
          const vr2 = Gr[p] as number, vm2 = Gm[p] as number;
          zr[i] = (zr[i] as number) - (vr2 * br - vm2 * bm);
          zm[i] = (zm[i] as number) - (vr2 * bm + vm2 * br);
        }
      }
    }
    for (let k = 0; k < n; k++) {
      const o = order[k] as number;
      aRe[o] = yr[k] as number;
      aIm[o] = ym[k] as number;
      cRe[o] = zr[k] as number;
      cIm[o] = zm[k] as number;
    }
  }
}
