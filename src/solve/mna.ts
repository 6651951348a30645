// Modified nodal analysis bookkeeping: which unknown is which (node voltages, then branch
// currents of voltage sources and inductors), and the real and complex sparse systems that the
// stamps are summed into before the LU.
//
// Stamps arrive as (row, col, value) triples. The first assembly discovers the pattern; later
// assemblies usually repeat the same sequence of stamps, so a "tape" remembers the slot of each
// call and a repeat costs two integer compares instead of a hash lookup. A stamp that was not on
// the tape falls back to the hash map and, if it is a new matrix entry, triggers a fresh
// symbolic analysis (CSC pattern and fill-reducing order) before the next factorisation.

import { minimumDegreeOrder, type CscPattern } from "./ordering.js";
import { ComplexSparseLu, RealSparseLu } from "./sparse-lu.js";

/** Index of an unknown in the solution vector; the reference node has none. */
export type Unknown = number;
export const GROUND: Unknown = -1;

export type UnknownKind = "node" | "internal-node" | "branch";

export interface UnknownInfo {
  kind: UnknownKind;
  /** Node name, `Q1#collector` style for internal nodes, element name for branches. */
  name: string;
  /** Element that owns an internal node or branch. */
  owner?: string;
}

/** Allocates unknowns while the circuit is elaborated. Node "0" is ground. */
export class UnknownMap {
  private readonly byName = new Map<string, Unknown>();
  readonly info: UnknownInfo[] = [];

  node(name: string): Unknown {
    if (name === "0") return GROUND;
    const known = this.byName.get(name);
    if (known !== undefined) return known;
    const index = this.info.length;
    this.info.push({ kind: "node", name });
    this.byName.set(name, index);
    return index;
  }

  internalNode(owner: string, label: string): Unknown {
    const index = this.info.length;
    this.info.push({ kind: "internal-node", name: `${owner}#${label}`, owner });
    return index;
  }

  branch(owner: string): Unknown {
    const index = this.info.length;
    this.info.push({ kind: "branch", name: owner, owner });
    return index;
  }

  lookup(name: string): Unknown | undefined {
    return name === "0" ? GROUND : this.byName.get(name);
  }

  get size(): number { return this.info.length; }

  describe(index: Unknown): string {
    const info = this.info[index];
    if (!info) return `unknown ${index}`;
    if (info.kind === "node") return `node ${info.name}`;
    if (info.kind === "internal-node") return `internal node ${info.name}`;
    return `branch current of ${info.name}`;
  }
}

/** Diagonal preference for pivots: accept the diagonal if within this factor of the column's best. */
const PIVOT_TOLERANCE = 0.1;
/** A re-used pivot may shrink to this fraction of its column before a fresh pivot search is forced. */
const REFACTOR_TOLERANCE = 1e-3;

class SlotTape {
  rows: Int32Array = new Int32Array(64);
  cols: Int32Array = new Int32Array(64);
  slots: Int32Array = new Int32Array(64);
  length = 0;
  record(position: number, row: number, col: number, slot: number): void {
    if (position >= this.rows.length) {
      const cap = this.rows.length * 2;
      const grow = (a: Int32Array): Int32Array => { const g = new Int32Array(cap); g.set(a); return g; };
      this.rows = grow(this.rows);
      this.cols = grow(this.cols);
      this.slots = grow(this.slots);
    }
    this.rows[position] = row;
    this.cols[position] = col;
    this.slots[position] = slot;
    if (position >= this.length) this.length = position + 1;
  }
}

/** Slot registry, stamp tape and symbolic analysis, shared by the real and complex systems. */
class MatrixPattern {
  readonly n: number;
  private readonly slotOf = new Map<number, number>();
  private slotRow: number[] = [];
  private slotCol: number[] = [];
  private readonly tape = new SlotTape();
  private cursor = 0;
  private symbolicStale = true;
  csc: CscPattern = { n: 0, colPtr: new Int32Array(1), rowIdx: new Int32Array(0) };
  /** Position of each slot inside the CSC value array. */
  slotToCsc: Int32Array = new Int32Array(0);
  order: Int32Array = new Int32Array(0);

  constructor(n: number) { this.n = n; }

  get slotCount(): number { return this.slotRow.length; }

  rewind(): void { this.cursor = 0; }

  /** Slot for (row, col), both already known to be non-ground. */
  slot(row: number, col: number): number {
    const position = this.cursor++;
    const tape = this.tape;
    if (position < tape.length && tape.rows[position] === row && tape.cols[position] === col) {
      return tape.slots[position] as number;
    }
    const key = row * this.n + col;
    let slot = this.slotOf.get(key);
    if (slot === undefined) {
      slot = this.slotRow.length;
      this.slotOf.set(key, slot);
      this.slotRow.push(row);
      this.slotCol.push(col);
      this.symbolicStale = true;
    }
    tape.record(position, row, col, slot);
    return slot;
  }

  /** Rebuilds the CSC pattern (every diagonal included) and the column order if new entries appeared. */
  prepare(): boolean {
    if (!this.symbolicStale) return false;
    const n = this.n;
    // Every diagonal gets an entry so a pivot candidate always exists where the order expects one.
    for (let i = 0; i < n; i++) {
      const key = i * n + i;
      if (!this.slotOf.has(key)) {
        this.slotOf.set(key, this.slotRow.length);
        this.slotRow.push(i);
        this.slotCol.push(i);
      }
    }
    const count = this.slotRow.length;
    const colCount = new Int32Array(n + 1);
    for (let s = 0; s < count; s++) {
      const c = (this.slotCol[s] as number) + 1;
      colCount[c] = (colCount[c] as number) + 1;
    }
    for (let c = 0; c < n; c++) colCount[c + 1] = (colCount[c + 1] as number) + (colCount[c] as number);
    const colPtr = colCount.slice();
    const fill = colCount.slice(0, n);
    const rowIdx = new Int32Array(count);
    const slotToCsc = new Int32Array(count);
    // Rows sorted within each column (bucket by row first) for cache-friendly scatter.
    const byRow: number[][] = Array.from({ length: n }, () => []);
    for (let s = 0; s < count; s++) byRow[this.slotRow[s] as number]?.push(s);
    for (let r = 0; r < n; r++) {
      for (const s of byRow[r] ?? []) {
        const c = this.slotCol[s] as number;
        const pos = fill[c] as number;
        fill[c] = pos + 1;
        rowIdx[pos] = r;
        slotToCsc[s] = pos;
      }
    }
    this.csc = { n, colPtr, rowIdx };
    this.slotToCsc = slotToCsc;
    this.order = minimumDegreeOrder(this.csc);
    this.symbolicStale = false;
    return true;
  }
}

export type SolveOutcome = { ok: true } | { ok: false; singularUnknown: Unknown };

export class RealSystem {
  readonly n: number;
  private readonly pattern: MatrixPattern;
  private values = new Float64Array(64);
  readonly rhs: Float64Array;
  private cscValues = new Float64Array(0);
  private readonly lu: RealSparseLu;
  /** A factorisation with the current pattern exists, so its pivot order can be re-used. */
  private factored = false;

  constructor(n: number) {
    this.n = n;
    this.pattern = new MatrixPattern(n);
    this.rhs = new Float64Array(n);
    this.lu = new RealSparseLu(n);
  }

  private base = new Float64Array(0);
  private baseRhs = new Float64Array(0);

  /** Starts a new assembly: clears values and right-hand side. */
  begin(): void {
    this.pattern.rewind();
    this.values.fill(0);
    this.rhs.fill(0);
  }

  /** Remembers what has been assembled so far (the constant part of every Newton iteration). */
  saveBase(): void {
    this.base = this.values.slice(0, this.pattern.slotCount);
    this.baseRhs = this.rhs.slice();
  }

  /** Starts an assembly from the saved constant part instead of from zero. */
  beginFromBase(): void {
    this.pattern.rewind();
    this.values.fill(0);
    this.values.set(this.base);
    this.rhs.set(this.baseRhs);
  }

  add(row: Unknown, col: Unknown, value: number): void {
    if (row < 0 || col < 0) return;
    const slot = this.pattern.slot(row, col);
    if (slot >= this.values.length) {
      const grown = new Float64Array(this.values.length * 2 + slot);
      grown.set(this.values);
      this.values = grown;
    }
    this.values[slot] = (this.values[slot] as number) + value;
  }

  addRhs(row: Unknown, value: number): void {
    if (row >= 0) this.rhs[row] = (this.rhs[row] as number) + value;
  }

  /** Factors the assembled matrix and solves into `out`. */
  solve(out: Float64Array): SolveOutcome {
    const pattern = this.pattern;
    const symbolicChanged = pattern.prepare();
    if (symbolicChanged || this.cscValues.length !== pattern.slotCount) {
      this.cscValues = new Float64Array(pattern.slotCount);
    }
    if (this.values.length < pattern.slotCount) {
      const grown = new Float64Array(pattern.slotCount);
      grown.set(this.values);
      this.values = grown;
    }
    // Every CSC position belongs to exactly one slot, so the copy overwrites all of them.
    const csc = this.cscValues, map = pattern.slotToCsc, values = this.values;
    const count = pattern.slotCount;
    for (let s = 0; s < count; s++) csc[map[s] as number] = values[s] as number;
    if (!(this.factored && !symbolicChanged && this.lu.refactor(pattern.csc, csc, REFACTOR_TOLERANCE))) {
      const outcome = this.lu.factor(pattern.csc, csc, pattern.order, PIVOT_TOLERANCE);
      this.factored = outcome.ok;
      if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    }
    this.lu.solve(this.rhs, out);
    return { ok: true };
  }

  get factorNonzeros(): number { return this.lu.factorNonzeros; }
  get matrixNonzeros(): number { return this.pattern.slotCount; }
}

export class ComplexSystem {
  readonly n: number;
  private readonly pattern: MatrixPattern;
  private re = new Float64Array(64);
  private im = new Float64Array(64);
  readonly rhsRe: Float64Array;
  readonly rhsIm: Float64Array;
  private cscRe = new Float64Array(0);
  private cscIm = new Float64Array(0);
  private readonly lu: ComplexSparseLu;
  private factored = false;

  constructor(n: number) {
    this.n = n;
    this.pattern = new MatrixPattern(n);
    this.rhsRe = new Float64Array(n);
    this.rhsIm = new Float64Array(n);
    this.lu = new ComplexSparseLu(n);
  }

  begin(): void {
    this.pattern.rewind();
    this.re.fill(0);
    this.im.fill(0);
    this.rhsRe.fill(0);
    this.rhsIm.fill(0);
  }

  private y0Re = new Float64Array(0);
  private y0Im = new Float64Array(0);
  private y1Re = new Float64Array(0);
  private y1Im = new Float64Array(0);
  private rhs0Re = new Float64Array(0);
  private rhs0Im = new Float64Array(0);

  /**
   * Affine-in-ω assembly, Y(ω) = Y0 + ω·Y1: call after assembling at ω = 0 (which = 0), then
   * after assembling again at ω = 1 (which = 1). Afterwards beginAt(ω) starts from Y(ω) in one
   * pass over the entries, so only elements that are not affine in ω need stamping per point.
   */
  saveAffinePart(which: 0 | 1): void {
    const count = this.pattern.slotCount;
    if (which === 0) {
      this.y0Re = this.re.slice(0, count);
      this.y0Im = this.im.slice(0, count);
      this.rhs0Re = this.rhsRe.slice();
      this.rhs0Im = this.rhsIm.slice();
      return;
    }
    this.y1Re = new Float64Array(count);
    this.y1Im = new Float64Array(count);
    for (let s = 0; s < count; s++) {
      this.y1Re[s] = (this.re[s] as number) - (this.y0Re[s] ?? 0);
      this.y1Im[s] = (this.im[s] as number) - (this.y0Im[s] ?? 0);
    }
  }

  beginAt(omega: number): void {
    this.pattern.rewind();
    const re = this.re, im = this.im, y0r = this.y0Re, y0i = this.y0Im, y1r = this.y1Re, y1i = this.y1Im;
    const count = y1r.length;
    for (let s = 0; s < count; s++) {
      re[s] = (y0r[s] ?? 0) + omega * (y1r[s] as number);
      im[s] = (y0i[s] ?? 0) + omega * (y1i[s] as number);
    }
    re.fill(0, count);
    im.fill(0, count);
    this.rhsRe.set(this.rhs0Re);
    this.rhsIm.set(this.rhs0Im);
  }

  add(row: Unknown, col: Unknown, re: number, im: number): void {
    if (row < 0 || col < 0) return;
    const slot = this.pattern.slot(row, col);
    if (slot >= this.re.length) {
      const size = this.re.length * 2 + slot;
      const gr = new Float64Array(size); gr.set(this.re); this.re = gr;
      const gi = new Float64Array(size); gi.set(this.im); this.im = gi;
    }
    this.re[slot] = (this.re[slot] as number) + re;
    this.im[slot] = (this.im[slot] as number) + im;
  }

  addRhs(row: Unknown, re: number, im: number): void {
    if (row < 0) return;
    this.rhsRe[row] = (this.rhsRe[row] as number) + re;
    this.rhsIm[row] = (this.rhsIm[row] as number) + im;
  }

  solve(outRe: Float64Array, outIm: Float64Array): SolveOutcome {
    const pattern = this.pattern;
    const symbolicChanged = pattern.prepare();
    if (symbolicChanged || this.cscRe.length !== pattern.slotCount) {
      this.cscRe = new Float64Array(pattern.slotCount);
      this.cscIm = new Float64Array(pattern.slotCount);
    }
    if (this.re.length < pattern.slotCount) {
      const gr = new Float64Array(pattern.slotCount); gr.set(this.re); this.re = gr;
      const gi = new Float64Array(pattern.slotCount); gi.set(this.im); this.im = gi;
    }
    const cr = this.cscRe, ci = this.cscIm, map = pattern.slotToCsc;
    const count = pattern.slotCount;
    for (let s = 0; s < count; s++) {
      const p = map[s] as number;
      cr[p] = this.re[s] as number;
      ci[p] = this.im[s] as number;
    }
    if (!(this.factored && !symbolicChanged && this.lu.refactor(pattern.csc, cr, ci, REFACTOR_TOLERANCE))) {
      const outcome = this.lu.factor(pattern.csc, cr, ci, pattern.order, PIVOT_TOLERANCE);
      this.factored = outcome.ok;
      if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    }
    this.lu.solve(this.rhsRe, this.rhsIm, outRe, outIm);
    return { ok: true };
  }

  get factorNonzeros(): number { return this.lu.factorNonzeros; }
  get matrixNonzeros(): number { return this.pattern.slotCount; }
}
