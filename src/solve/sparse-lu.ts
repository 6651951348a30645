// Sparse LU factorisation with partial pivoting (left-looking, Gilbert–Peierls): each column of
// L and U comes from a sparse triangular solve whose nonzero pattern is found by depth-first
// search, so the work is proportional to the arithmetic actually done. Columns are taken in a
// fill-reducing order; within a column the diagonal is preferred as pivot when it is within
// `pivotTolerance` of the largest candidate, which keeps that order's sparsity while still
// pivoting away from the zero diagonals that voltage-source branch rows put into an MNA matrix.
// A real and a complex variant share the symbolic machinery; values are kept in split
// re/im arrays so the complex path allocates nothing per operation.

import type { CscPattern } from "./ordering.js";

export type FactorOutcome = { ok: true } | { ok: false; singularColumn: number };

/** Candidate pivots smaller than this fraction of the column's largest original entry count as zero. */
const SINGULAR_RELATIVE = 1e-14;

class GrowableIndex {
  data: Int32Array;
  constructor(capacity: number) { this.data = new Int32Array(Math.max(16, capacity)); }
  ensure(size: number): void {
    if (size <= this.data.length) return;
    let cap = this.data.length;
    while (cap < size) cap *= 2;
    const grown = new Int32Array(cap);
    grown.set(this.data);
    this.data = grown;
  }
}

class GrowableValues {
  data: Float64Array;
  constructor(capacity: number) { this.data = new Float64Array(Math.max(16, capacity)); }
  ensure(size: number): void {
    if (size <= this.data.length) return;
    let cap = this.data.length;
    while (cap < size) cap *= 2;
    const grown = new Float64Array(cap);
    grown.set(this.data);
    this.data = grown;
  }
}

/** Pattern bookkeeping shared by the real and complex factorisations. */
abstract class SparseLuBase {
  readonly n: number;
  protected readonly Lp: Int32Array;
  protected readonly Up: Int32Array;
  protected readonly Li: GrowableIndex;
  protected readonly Ui: GrowableIndex;
  /** pinv[row] = pivot step that chose `row`, or −1 while the row is still free. */
  protected readonly pinv: Int32Array;
  protected order: Int32Array;
  protected readonly xi: Int32Array;
  protected readonly pstack: Int32Array;
  protected readonly mark: Int32Array;
  protected markStamp = 0;

  constructor(n: number, capacityHint: number) {
    this.n = n;
    this.Lp = new Int32Array(n + 1);
    this.Up = new Int32Array(n + 1);
    this.Li = new GrowableIndex(capacityHint);
    this.Ui = new GrowableIndex(capacityHint);
    this.pinv = new Int32Array(n);
    this.order = new Int32Array(n);
    this.xi = new Int32Array(n);
    this.pstack = new Int32Array(n);
    this.mark = new Int32Array(n);
  }

  /** Rows reachable from the pattern of A(:,col) through the columns of L built so far, topologically sorted into xi[top..n). */
  protected reach(pattern: CscPattern, col: number): number {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const Lp = this.Lp, Li = this.Li.data, pinv = this.pinv, xi = this.xi, pstack = this.pstack, mark = this.mark;
    const stamp = ++this.markStamp;
    let top = n;
    const end = colPtr[col + 1] as number;
    for (let p = colPtr[col] as number; p < end; p++) {
      const start = rowIdx[p] as number;
      if (mark[start] === stamp) continue;
      // Iterative DFS; xi doubles as the DFS stack from the bottom and the output from the top.
      let headPos = 0;
      xi[0] = start;
      while (headPos >= 0) {
        const j = xi[headPos] as number;
        const jnew = pinv[j] as number;
        if (mark[j] !== stamp) {
          mark[j] = stamp;
          pstack[headPos] = jnew < 0 ? 0 : (Lp[jnew] as number) + 1; // skip L's unit diagonal
        }
        let done = true;
        const pEnd = jnew < 0 ? 0 : (Lp[jnew + 1] as number);
        for (let q = pstack[headPos] as number; q < pEnd; q++) {
          const i = Li[q] as number;
          if (mark[i] === stamp) continue;
          pstack[headPos] = q + 1;
          xi[++headPos] = i;
          done = false;
          break;
        }
        if (done) {
          headPos--;
          xi[--top] = j;
        }
      }
    }
    return top;
  }

  /** Entries in L and U (fill report). */
  get factorNonzeros(): number { return (this.Lp[this.n] as number) + (this.Up[this.n] as number); }

  /** Renumbers L's row indices from original rows to pivot order once all columns are done. */
  protected finishPattern(): void {
    const lnz = this.Lp[this.n] as number;
    const Li = this.Li.data, pinv = this.pinv;
    for (let p = 0; p < lnz; p++) Li[p] = pinv[Li[p] as number] as number;
  }
}

export class RealSparseLu extends SparseLuBase {
  private readonly Lx: GrowableValues;
  private readonly Ux: GrowableValues;
  private readonly x: Float64Array;
  private readonly y: Float64Array;

  constructor(n: number, capacityHint = 4 * n) {
    super(n, capacityHint);
    this.Lx = new GrowableValues(capacityHint);
    this.Ux = new GrowableValues(capacityHint);
    this.x = new Float64Array(n);
    this.y = new Float64Array(n);
  }

  factor(pattern: CscPattern, values: Float64Array, order: Int32Array, pivotTolerance: number): FactorOutcome {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, x = this.x, xi = this.xi, Lp = this.Lp, Up = this.Up;
    this.order = order;
    pinv.fill(-1);
    let lnz = 0, unz = 0;
    for (let k = 0; k < n; k++) {
      Lp[k] = lnz;
      Up[k] = unz;
      this.Li.ensure(lnz + n); this.Lx.ensure(lnz + n);
      this.Ui.ensure(unz + n); this.Ux.ensure(unz + n);
      const Li = this.Li.data, Lx = this.Lx.data, Ui = this.Ui.data, Ux = this.Ux.data;
      const col = order[k] as number;
      const top = this.reach(pattern, col);
      for (let p = top; p < n; p++) x[xi[p] as number] = 0;
      let colMax = 0;
      const aEnd = colPtr[col + 1] as number;
      for (let p = colPtr[col] as number; p < aEnd; p++) {
        const v = values[p] as number;
        x[rowIdx[p] as number] = v;
        if (Math.abs(v) > colMax) colMax = Math.abs(v);
      }
      // x = L \ A(:,col) over the reach, in topological order.
      for (let px = top; px < n; px++) {
        const j = xi[px] as number;
        const J = pinv[j] as number;
        if (J < 0) continue;
        const xj = x[j] as number;
        if (xj === 0) continue;
        const end = Lp[J + 1] as number;
        for (let p = (Lp[J] as number) + 1; p < end; p++) {
          const i = Li[p] as number;
          x[i] = (x[i] as number) - (Lx[p] as number) * xj;
        }
      }
      let ipiv = -1, best = -1;
      for (let p = top; p < n; p++) {
        const i = xi[p] as number;
        if ((pinv[i] as number) < 0) {
          const t = Math.abs(x[i] as number);
          if (t > best) { best = t; ipiv = i; }
        } else {
          Ui[unz] = pinv[i] as number;
          Ux[unz++] = x[i] as number;
        }
      }
      if (ipiv < 0 || !(best > SINGULAR_RELATIVE * colMax) || best === 0) {
        return { ok: false, singularColumn: col };
      }
      if ((pinv[col] as number) < 0 && Math.abs(x[col] as number) >= best * pivotTolerance) ipiv = col;
      const pivot = x[ipiv] as number;
      Ui[unz] = k;
      Ux[unz++] = pivot;
      pinv[ipiv] = k;
      Li[lnz] = ipiv;
      Lx[lnz++] = 1;
      for (let p = top; p < n; p++) {
        const i = xi[p] as number;
        if ((pinv[i] as number) < 0) {
          Li[lnz] = i;
          Lx[lnz++] = (x[i] as number) / pivot;
        }
        x[i] = 0;
      }
    }
    Lp[n] = lnz;
    Up[n] = unz;
    this.finishPattern();
    return { ok: true };
  }

  /**
   * Numeric-only factorisation of a matrix with the same pattern, re-using the previous pivot
   * order and L/U structure (no search, no depth-first reach). Returns false — and leaves the
   * factors unusable — when a re-used pivot has become too small against its column, so the
   * caller must fall back to factor().
   */
  refactor(pattern: CscPattern, values: Float64Array, pivotTolerance: number): boolean {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, x = this.x, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Lx = this.Lx.data, Up = this.Up, Ui = this.Ui.data, Ux = this.Ux.data;
    for (let k = 0; k < n; k++) {
      const uStart = Up[k] as number, uEnd = Up[k + 1] as number;
      const lStart = Lp[k] as number, lEnd = Lp[k + 1] as number;
      for (let p = uStart; p < uEnd; p++) x[Ui[p] as number] = 0;
      for (let p = lStart + 1; p < lEnd; p++) x[Li[p] as number] = 0;
      const col = order[k] as number;
      const aEnd = colPtr[col + 1] as number;
      for (let p = colPtr[col] as number; p < aEnd; p++) x[pinv[rowIdx[p] as number] as number] = values[p] as number;
      for (let p = uStart; p < uEnd - 1; p++) {
        const j = Ui[p] as number;
        const xj = x[j] as number;
        Ux[p] = xj;
        if (xj === 0) continue;
        const end = Lp[j + 1] as number;
        for (let q = (Lp[j] as number) + 1; q < end; q++) {
          const i = Li[q] as number;
          x[i] = (x[i] as number) - (Lx[q] as number) * xj;
        }
      }
      const pivot = x[k] as number;
      Ux[uEnd - 1] = pivot;
      let largest = 0;
      for (let p = lStart + 1; p < lEnd; p++) largest = Math.max(largest, Math.abs(x[Li[p] as number] as number));
      if (!(Math.abs(pivot) > 0) || Math.abs(pivot) < pivotTolerance * largest) return false;
      for (let p = lStart + 1; p < lEnd; p++) Lx[p] = (x[Li[p] as number] as number) / pivot;
    }
    return true;
  }

  /** Solves A·out = b with the last successful factorisation. */
  solve(b: Float64Array, out: Float64Array): void {
    const n = this.n, pinv = this.pinv, y = this.y, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Lx = this.Lx.data, Up = this.Up, Ui = this.Ui.data, Ux = this.Ux.data;
    for (let i = 0; i < n; i++) y[pinv[i] as number] = b[i] as number;
    for (let j = 0; j < n; j++) {
      const yj = y[j] as number;
      if (yj === 0) continue;
      const end = Lp[j + 1] as number;
      for (let p = (Lp[j] as number) + 1; p < end; p++) {
        const i = Li[p] as number;
        y[i] = (y[i] as number) - (Lx[p] as number) * yj;
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = (Up[j + 1] as number) - 1;
      const yj = (y[j] as number) / (Ux[last] as number);
      y[j] = yj;
      if (yj === 0) continue;
      for (let p = Up[j] as number; p < last; p++) {
        const i = Ui[p] as number;
        y[i] = (y[i] as number) - (Ux[p] as number) * yj;
      }
    }
    for (let k = 0; k < n; k++) out[order[k] as number] = y[k] as number;
  }

}

export class ComplexSparseLu extends SparseLuBase {
  private readonly Lr: GrowableValues;
  private readonly Lm: GrowableValues;
  private readonly Ur: GrowableValues;
  private readonly Um: GrowableValues;
  private readonly xr: Float64Array;
  private readonly xm: Float64Array;
  private readonly yr: Float64Array;
  private readonly ym: Float64Array;

  constructor(n: number, capacityHint = 4 * n) {
    super(n, capacityHint);
    this.Lr = new GrowableValues(capacityHint);
    this.Lm = new GrowableValues(capacityHint);
    this.Ur = new GrowableValues(capacityHint);
    this.Um = new GrowableValues(capacityHint);
    this.xr = new Float64Array(n);
    this.xm = new Float64Array(n);
    this.yr = new Float64Array(n);
    this.ym = new Float64Array(n);
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
    return { ok: true };
  }

  /** Complex counterpart of RealSparseLu.refactor. */
  refactor(pattern: CscPattern, re: Float64Array, im: Float64Array, pivotTolerance: number): boolean {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, xr = this.xr, xm = this.xm, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Lr = this.Lr.data, Lm = this.Lm.data;
    const Up = this.Up, Ui = this.Ui.data, Ur = this.Ur.data, Um = this.Um.data;
    const tol2 = pivotTolerance * pivotTolerance;
    for (let k = 0; k < n; k++) {
      const uStart = Up[k] as number, uEnd = Up[k + 1] as number;
      const lStart = Lp[k] as number, lEnd = Lp[k + 1] as number;
      for (let p = uStart; p < uEnd; p++) { const i = Ui[p] as number; xr[i] = 0; xm[i] = 0; }
      for (let p = lStart + 1; p < lEnd; p++) { const i = Li[p] as number; xr[i] = 0; xm[i] = 0; }
      const col = order[k] as number;
      const aEnd = colPtr[col + 1] as number;
      for (let p = colPtr[col] as number; p < aEnd; p++) {
        const i = pinv[rowIdx[p] as number] as number;
        xr[i] = re[p] as number;
        xm[i] = im[p] as number;
      }
      for (let p = uStart; p < uEnd - 1; p++) {
        const j = Ui[p] as number;
        const ar = xr[j] as number, am = xm[j] as number;
        Ur[p] = ar;
        Um[p] = am;
        if (ar === 0 && am === 0) continue;
        const end = Lp[j + 1] as number;
        for (let q = (Lp[j] as number) + 1; q < end; q++) {
          const i = Li[q] as number;
          const lr = Lr[q] as number, lm = Lm[q] as number;
          xr[i] = (xr[i] as number) - (lr * ar - lm * am);
          xm[i] = (xm[i] as number) - (lr * am + lm * ar);
        }
      }
      const pr = xr[k] as number, pm = xm[k] as number;
      Ur[uEnd - 1] = pr;
      Um[uEnd - 1] = pm;
      const pmag2 = pr * pr + pm * pm;
      let largest2 = 0;
      for (let p = lStart + 1; p < lEnd; p++) {
        const i = Li[p] as number;
        const vr = xr[i] as number, vm = xm[i] as number;
        largest2 = Math.max(largest2, vr * vr + vm * vm);
      }
      if (!(pmag2 > 0) || pmag2 < tol2 * largest2) return false;
      const invR = pr / pmag2, invM = -pm / pmag2;
      for (let p = lStart + 1; p < lEnd; p++) {
        const i = Li[p] as number;
        const vr = xr[i] as number, vm = xm[i] as number;
        Lr[p] = vr * invR - vm * invM;
        Lm[p] = vr * invM + vm * invR;
      }
    }
    return true;
  }

  solve(bRe: Float64Array, bIm: Float64Array, outRe: Float64Array, outIm: Float64Array): void {
    const n = this.n, pinv = this.pinv, yr = this.yr, ym = this.ym, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Lr = this.Lr.data, Lm = this.Lm.data;
    const Up = this.Up, Ui = this.Ui.data, Ur = this.Ur.data, Um = this.Um.data;
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
        const lr = Lr[p] as number, lm = Lm[p] as number;
        yr[i] = (yr[i] as number) - (lr * ar - lm * am);
        ym[i] = (ym[i] as number) - (lr * am + lm * ar);
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = (Up[j + 1] as number) - 1;
      const dr = Ur[last] as number, dm = Um[last] as number;
      const d2 = dr * dr + dm * dm;
      const vr = yr[j] as number, vm = ym[j] as number;
      const ar = (vr * dr + vm * dm) / d2;
      const am = (vm * dr - vr * dm) / d2;
      yr[j] = ar;
      ym[j] = am;
      if (ar === 0 && am === 0) continue;
      for (let p = Up[j] as number; p < last; p++) {
        const i = Ui[p] as number;
        const ur = Ur[p] as number, um = Um[p] as number;
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
}
