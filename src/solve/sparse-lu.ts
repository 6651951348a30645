// Sparse LU factorisation with partial pivoting (left-looking, Gilbert–Peierls): each column of
// L and U comes from a sparse triangular solve whose nonzero pattern is found by depth-first
// search, so the work is proportional to the arithmetic actually done. Columns are taken in a
// fill-reducing order; within a column the diagonal is preferred as pivot when it is within
// `pivotTolerance` of the largest candidate, which keeps that order's sparsity while still
// pivoting away from the zero diagonals that voltage-source branch rows put into an MNA matrix.
// The real variant lives here with the symbolic machinery it shares with the complex one
// (complex-lu.ts).
//
// Re-factorising a matrix with the same pattern and pivots (every Newton iteration, every AC
// frequency) runs from a plan compiled once per pivot order: for each column update the L
// column to apply and, per entry, the position in the factor array it lands on. The numeric
// pass then works in place on the factors — no scatter into a dense work vector, no gather back,
// no per-column clearing — and performs the same operations in the same order as the
// left-looking factorisation, so its results are bit-for-bit the same.

import type { CscPattern } from "./ordering.js";
import { float64Views, int32Views, NO_DOUBLES, type Arena } from "./views.js";

export type FactorOutcome = { ok: true } | { ok: false; singularColumn: number };

/** Candidate pivots smaller than this fraction of the column's largest original entry count as zero. */
export const SINGULAR_RELATIVE = 1e-14;

export class GrowableIndex {
  constructor(public data: Int32Array) {}
  ensure(size: number): void {
    if (size <= this.data.length) return;
    let cap = this.data.length;
    while (cap < size) cap *= 2;
    const grown = new Int32Array(cap);
    grown.set(this.data);
    this.data = grown;
  }
}

export class GrowableValues {
  constructor(public data: Float64Array) {}
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
export abstract class SparseLuBase {
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

  /** Where a real factorisation inside a solve takes its arrays from (see Arena). */
  protected readonly arena: Arena | undefined;

  constructor(n: number, capacity: number, arena?: Arena) {
    this.n = n;
    this.arena = arena;
    const [Lp, Up, pinv, order, xi, pstack, mark, Li, Ui] = arena
      ? [arena.i32(n + 1), arena.i32(n + 1), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(capacity), arena.i32(capacity)]
      : int32Views([n + 1, n + 1, n, n, n, n, n, capacity, capacity] as const);
    this.Lp = Lp;
    this.Up = Up;
    this.pinv = pinv;
    this.order = order;
    this.xi = xi;
    this.pstack = pstack;
    this.mark = mark;
    this.Li = new GrowableIndex(Li);
    this.Ui = new GrowableIndex(Ui);
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
    this.plan = null;
  }

  /**
   * Factor values live in one array per part: U's entries (column by column, diagonal last) at
   * [0, unz), L's entries at unz + their L position. A column update can then name its target
   * with one index whether it lands in U, on the diagonal or in L.
   */
  protected plan: RefactorPlan | null = null;

  /** The refactorisation plan for the current pivot order, compiled on first use. */
  protected planFor(pattern: CscPattern): RefactorPlan {
    if (this.plan) return this.plan;
    const n = this.n;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, pinv = this.pinv, order = this.order;
    const unz = Up[n] as number;
    // Sizes first: one group per U entry whose L column has entries below the diagonal.
    let groups = 0, count = 0;
    for (let k = 0; k < n; k++) {
      const uEnd = (Up[k + 1] as number) - 1;
      for (let p = Up[k] as number; p < uEnd; p++) {
        const j = Ui[p] as number;
        const below = (Lp[j + 1] as number) - (Lp[j] as number) - 1;
        if (below > 0) { groups++; count += below; }
      }
    }
    const lengths = [n + 1, groups, groups, groups + 1, count, pattern.colPtr[n] as number, n] as const;
    const arena = this.arena;
    const [columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor, positionOf] = arena
      ? [arena.i32(lengths[0]), arena.i32(lengths[1]), arena.i32(lengths[2]), arena.i32(lengths[3]), arena.i32(lengths[4]), arena.i32(lengths[5]), arena.i32(lengths[6])]
      : int32Views(lengths);
    let g = 0, t = 0;
    for (let k = 0; k < n; k++) {
      columnGroups[k] = g;
      const uStart = Up[k] as number, uEnd = Up[k + 1] as number;
      for (let p = uStart; p < uEnd; p++) positionOf[Ui[p] as number] = p;
      const lEnd = Lp[k + 1] as number;
      for (let q = (Lp[k] as number) + 1; q < lEnd; q++) positionOf[Li[q] as number] = unz + q;
      for (let p = uStart; p < uEnd - 1; p++) {
        const j = Ui[p] as number;
        const start = (Lp[j] as number) + 1, end = Lp[j + 1] as number;
        if (start >= end) continue;
        multiplier[g] = p;
        lFirst[g] = unz + start;
        groupTargets[g] = t;
        for (let q = start; q < end; q++) targets[t++] = positionOf[Li[q] as number] as number;
        g++;
      }
      const col = order[k] as number;
      const aEnd = pattern.colPtr[col + 1] as number;
      for (let p = pattern.colPtr[col] as number; p < aEnd; p++) {
        cscToFactor[p] = positionOf[pinv[pattern.rowIdx[p] as number] as number] as number;
      }
    }
    columnGroups[n] = g;
    groupTargets[g] = t;
    this.plan = { size: unz + (Lp[n] as number), unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor };
    return this.plan;
  }

  /** Where each entry of the CSC value array goes in the factor arrays (valid until the next factor()). */
  factorPositions(pattern: CscPattern): Int32Array {
    return this.planFor(pattern).cscToFactor;
  }
}

/**
 * See SparseLuBase.planFor. Column k's updates are the groups columnGroups[k] ..
 * columnGroups[k + 1]; group g multiplies the L column starting at factor position lFirst[g] by
 * the finished U entry at multiplier[g] and subtracts it at targets[groupTargets[g] ..
 * groupTargets[g + 1]). U entries whose L column is only the unit diagonal have no group.
 */
/** See RealSparseLu.exportStructure. */
export interface FactorStructure {
  readonly n: number;
  readonly Lp: Int32Array;
  readonly Li: Int32Array;
  readonly Up: Int32Array;
  readonly Ui: Int32Array;
  readonly pinv: Int32Array;
  readonly order: Int32Array;
  readonly pivotRank: Int32Array;
  /** Per step, the place of the column's own row among the candidates (−1: not one of them). */
  readonly ownRank: Int32Array;
  readonly plan: RefactorPlan;
}

export interface RefactorPlan {
  size: number;
  unz: number;
  columnGroups: Int32Array;
  multiplier: Int32Array;
  lFirst: Int32Array;
  groupTargets: Int32Array;
  targets: Int32Array;
  cscToFactor: Int32Array;
}

export class RealSparseLu extends SparseLuBase {
  /** factor()'s work space, grown column by column. */
  private readonly Lx: GrowableValues;
  private readonly Ux: GrowableValues;
  /** The factors in the layout of SparseLuBase.plan: U at [0, unz), L at unz + L position. */
  private F: Float64Array = NO_DOUBLES;
  private readonly x: Float64Array;
  private readonly y: Float64Array;
  /** Per pivot step, the pivot's place among the candidate rows in the order factor() met them. */
  private readonly pivotRank: Int32Array;

  constructor(n: number, arena?: Arena, capacityHint = 4 * n) {
    const capacity = Math.max(16, capacityHint);
    super(n, capacity, arena);
    const [Lx, Ux, x, y] = arena
      ? [arena.f64(capacity), arena.f64(capacity), arena.f64(n), arena.f64(n)]
      : float64Views([capacity, capacity, n, n] as const);
    this.Lx = new GrowableValues(Lx);
    this.Ux = new GrowableValues(Ux);
    this.x = x;
    this.y = y;
    this.pivotRank = arena ? arena.i32(n) : new Int32Array(n);
  }

  private factorArray(size: number): Float64Array {
    if (this.F.length < size) this.F = this.arena ? this.arena.f64(size) : new Float64Array(size);
    return this.F;
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
      // Where the pivot stood among the candidates (for refactorAsFactor's check of the same choice).
      let rank = 0;
      for (let p = top; p < n; p++) {
        const i = xi[p] as number;
        if (i === ipiv) break;
        if ((pinv[i] as number) < 0) rank++;
      }
      this.pivotRank[k] = rank;
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
    const F = this.factorArray(unz + lnz);
    F.set(this.Ux.data.subarray(0, unz), 0);
    F.set(this.Lx.data.subarray(0, lnz), unz);
    return { ok: true };
  }

  /**
   * Numeric-only factorisation of a matrix with the same pattern, re-using the pivot order and
   * L/U structure of the last factor(). `values[i]` is the matrix entry that belongs at factor
   * position `positions[i]` (see factorPositions). Returns false — and leaves the factors
   * unusable — when a re-used pivot has become too small against its column, so the caller must
   * fall back to factor().
   */
  refactor(pattern: CscPattern, values: Float64Array, count: number, positions: Int32Array, pivotTolerance: number): boolean {
    const plan = this.planFor(pattern);
    const F = this.F;
    F.fill(0, 0, plan.size);
    for (let i = 0; i < count; i++) F[positions[i] as number] = values[i] as number;
    return this.eliminate(plan, pivotTolerance);
  }

  /** The in-place column updates of the plan, in the left-looking factorisation's order. */
  private eliminate(plan: RefactorPlan, pivotTolerance: number): boolean {
    const n = this.n, F = this.F, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1] as number;
      for (; g < gEnd; g++) {
        const xj = F[multiplier[g] as number] as number;
        if (xj === 0) continue;
        const end = groupTargets[g + 1] as number;
        for (let t = groupTargets[g] as number, q = lFirst[g] as number; t < end; t++, q++) {
          const i = targets[t] as number;
          F[i] = (F[i] as number) - (F[q] as number) * xj;
        }
      }
      const pivot = F[(Up[k + 1] as number) - 1] as number;
      const lStart = unz + (Lp[k] as number) + 1, lEnd = unz + (Lp[k + 1] as number);
      let largest = 0;
      for (let q = lStart; q < lEnd; q++) {
        const v = F[q] as number;
        largest = Math.max(largest, Math.abs(v));
        F[q] = v / pivot;
      }
      if (!(Math.abs(pivot) > 0) || Math.abs(pivot) < pivotTolerance * largest) return false;
    }
    return true;
  }

  /**
   * The pivot order and L/U structure of the last factor(), with its refactorisation plan, in
   * arrays of its own: what a later solve of the same circuit can start from (adopt).
   */
  exportStructure(pattern: CscPattern): FactorStructure {
    const n = this.n, Lp = this.Lp, Up = this.Up, pinv = this.pinv, order = this.order, pivotRank = this.pivotRank;
    const plan = this.planFor(pattern);
    const lnz = Lp[n] as number, unz = Up[n] as number;
    const groups = plan.multiplier.length;
    const [lp, li, up, ui, pv, or, pr, cr, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor] = int32Views([
      n + 1, lnz, n + 1, unz, n, n, n, n,
      n + 1, groups, groups, groups + 1, plan.targets.length, plan.cscToFactor.length,
    ] as const);
    lp.set(Lp.subarray(0, n + 1));
    li.set(this.Li.data.subarray(0, lnz));
    up.set(Up.subarray(0, n + 1));
    ui.set(this.Ui.data.subarray(0, unz));
    pv.set(pinv);
    or.set(order);
    pr.set(pivotRank);
    // Where column k's own row (order[k]) stands among its candidates, or −1 if it is not one.
    const Li = this.Li.data;
    for (let k = 0; k < n; k++) {
      const own = pinv[order[k] as number] as number;
      if (own === k) { cr[k] = pivotRank[k] as number; continue; }
      cr[k] = -1;
      if (own < k) continue;
      const start = (Lp[k] as number) + 1, end = Lp[k + 1] as number;
      for (let q = start; q < end; q++) {
        if (Li[q] !== own) continue;
        const place = q - start;
        cr[k] = place < (pivotRank[k] as number) ? place : place + 1;
        break;
      }
    }
    columnGroups.set(plan.columnGroups);
    multiplier.set(plan.multiplier);
    lFirst.set(plan.lFirst);
    groupTargets.set(plan.groupTargets);
    targets.set(plan.targets);
    cscToFactor.set(plan.cscToFactor);
    return {
      n, Lp: lp, Li: li, Up: up, Ui: ui, pinv: pv, order: or, pivotRank: pr, ownRank: cr,
      plan: { size: plan.size, unz: plan.unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor },
    };
  }

  /**
   * factor() by way of a structure exported earlier: the same pivot order and L/U pattern, kept
   * only if, column by column, factor() would have chosen exactly the pivots the structure has
   * from exactly these values — then the factors are factor()'s to the last bit, found without
   * its pivot search and depth-first reach. False (factors unusable) when any choice differs.
   */
  refactorAsFactor(structure: FactorStructure, pattern: CscPattern, order: Int32Array, values: Float64Array, count: number,
    slotToCsc: Int32Array, pivotTolerance: number): Int32Array | null {
    const n = this.n;
    if (structure.n !== n || structure.plan.cscToFactor.length !== (pattern.colPtr[n] as number)) return null;
    for (let k = 0; k < n; k++) if (structure.order[k] !== order[k]) return null;
    const lnz = structure.Lp[n] as number, unz = structure.Up[n] as number;
    this.Lp.set(structure.Lp);
    this.Up.set(structure.Up);
    this.Li.ensure(lnz);
    this.Li.data.set(structure.Li);
    this.Ui.ensure(unz);
    this.Ui.data.set(structure.Ui);
    this.pinv.set(structure.pinv);
    this.order = order;
    this.pivotRank.set(structure.pivotRank);
    const plan = structure.plan;
    this.plan = plan;
    const F = this.factorArray(plan.size);
    F.fill(0, 0, plan.size);
    const positions = new Int32Array(count);
    for (let s = 0; s < count; s++) {
      const f = plan.cscToFactor[slotToCsc[s] as number] as number;
      positions[s] = f;
      F[f] = values[s] as number;
    }
    return this.eliminateAsFactor(structure, pattern, pivotTolerance) ? positions : null;
  }

  /** eliminate(), checking each pivot against factor()'s choice (see refactorAsFactor). */
  private eliminateAsFactor(structure: FactorStructure, pattern: CscPattern, pivotTolerance: number): boolean {
    const n = this.n, F = this.F, Lp = this.Lp, Up = this.Up, order = this.order;
    const { plan, pivotRank, ownRank } = structure;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor } = plan;
    const { colPtr } = pattern;
    let g = 0;
    for (let k = 0; k < n; k++) {
      // factor()'s singularity test compares with the column as assembled, before any update.
      const col = order[k] as number;
      let colMax = 0;
      const aEnd = colPtr[col + 1] as number;
      for (let p = colPtr[col] as number; p < aEnd; p++) {
        const v = Math.abs(F[cscToFactor[p] as number] as number);
        if (v > colMax) colMax = v;
      }
      const gEnd = columnGroups[k + 1] as number;
      for (; g < gEnd; g++) {
        const xj = F[multiplier[g] as number] as number;
        if (xj === 0) continue;
        const end = groupTargets[g + 1] as number;
        for (let t = groupTargets[g] as number, q = lFirst[g] as number; t < end; t++, q++) {
          const i = targets[t] as number;
          F[i] = (F[i] as number) - (F[q] as number) * xj;
        }
      }
      // The candidates in factor()'s order are column k's L entries with the pivot at its rank.
      const pivot = F[(Up[k + 1] as number) - 1] as number;
      const lStart = unz + (Lp[k] as number) + 1, lEnd = unz + (Lp[k + 1] as number);
      const rank = pivotRank[k] as number, own = ownRank[k] as number;
      let best = -1, first = -1, ownMagnitude = 0;
      for (let q = lStart, place = 0; ; place++) {
        let t: number;
        if (place === rank) t = Math.abs(pivot);
        else if (q < lEnd) t = Math.abs(F[q++] as number);
        else break;
        if (t > best) { best = t; first = place; }
        if (place === own) ownMagnitude = t;
      }
      if (first < 0 || !(best > SINGULAR_RELATIVE * colMax) || best === 0) return false;
      const chosen = own >= 0 && ownMagnitude >= best * pivotTolerance ? own : first;
      if (chosen !== rank) return false;
      for (let q = lStart; q < lEnd; q++) F[q] = (F[q] as number) / pivot;
    }
    return true;
  }

  /** Solves A·out = b with the last successful factorisation. */
  solve(b: Float64Array, out: Float64Array): void {
    const n = this.n, pinv = this.pinv, y = this.y, order = this.order, F = this.F;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data;
    const unz = Up[n] as number;
    for (let i = 0; i < n; i++) y[pinv[i] as number] = b[i] as number;
    for (let j = 0; j < n; j++) {
      const yj = y[j] as number;
      if (yj === 0) continue;
      const end = Lp[j + 1] as number;
      for (let p = (Lp[j] as number) + 1; p < end; p++) {
        const i = Li[p] as number;
        y[i] = (y[i] as number) - (F[unz + p] as number) * yj;
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = (Up[j + 1] as number) - 1;
      const yj = (y[j] as number) / (F[last] as number);
      y[j] = yj;
      if (yj === 0) continue;
      for (let p = Up[j] as number; p < last; p++) {
        const i = Ui[p] as number;
        y[i] = (y[i] as number) - (F[p] as number) * yj;
      }
    }
    for (let k = 0; k < n; k++) out[order[k] as number] = y[k] as number;
  }
}
