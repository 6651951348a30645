// Modified nodal analysis bookkeeping: which unknown is which (node voltages, then branch
// currents of voltage sources and inductors), and the real and complex sparse systems that the
// stamps are summed into before the LU. Where each stamp lands is pattern.ts's business.

import { ComplexSparseLu } from "./complex-lu.js";
import { MatrixPattern, type PatternSnapshot } from "./pattern.js";
import { RealSparseLu, type FactorStructure } from "./sparse-lu.js";
import { acquireArena, float64Views, NO_DOUBLES, releaseArena, type Arena } from "./views.js";

export type { PatternSnapshot } from "./pattern.js";
export type { FactorStructure } from "./sparse-lu.js";

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

/**
 * The unknowns of an elaborated circuit: the external nodes, numbered beforehand (see
 * nodeNumbering in elaborate.ts), then the internal nodes and branches the devices allocate.
 * Node "0" is ground. Descriptions are made on first request: a solve needs them only when it
 * reports.
 */
export class UnknownMap {
  private readonly byName: ReadonlyMap<string, Unknown>;
  private readonly nodeNames: readonly string[];
  /** Internal nodes and branches, after the external nodes. */
  private readonly extra: UnknownInfo[] = [];
  private infoCache: UnknownInfo[] | null = null;
  private readonly pinNames: readonly string[];
  private readonly pinNodes: Int32Array;
  /** Devices ask for their pins in element order, so the next request is usually this pin. */
  private nextPin = 0;

  /** The circuit's node numbering (nodeNumbering in elaborate.ts), shared and never changed. */
  constructor(numbering: { names: readonly string[]; index: ReadonlyMap<string, Unknown>; pinNames: readonly string[]; pinNodes: Int32Array }) {
    this.nodeNames = numbering.names;
    this.byName = numbering.index;
    this.pinNames = numbering.pinNames;
    this.pinNodes = numbering.pinNodes;
  }

  /** What each unknown is, in index order. */
  get info(): readonly UnknownInfo[] {
    if (this.infoCache && this.infoCache.length === this.size) return this.infoCache;
    const info: UnknownInfo[] = this.nodeNames.map((name) => ({ kind: "node" as const, name }));
    for (const e of this.extra) info.push(e);
    this.infoCache = info;
    return info;
  }

  /** External nodes are unknowns 0 .. nodeCount − 1. */
  get nodeCount(): number { return this.nodeNames.length; }

  /** Name of external node `index` (< nodeCount). */
  nodeName(index: Unknown): string { return this.nodeNames[index] as string; }

  /** Whether unknown `index` is a branch current (else a node voltage). */
  isBranch(index: Unknown): boolean {
    return index >= this.nodeNames.length && this.extra[index - this.nodeNames.length]?.kind === "branch";
  }

  node(name: string): Unknown {
    const pin = this.nextPin;
    if (this.pinNames[pin] === name) {
      this.nextPin = pin + 1;
      return this.pinNodes[pin] as number;
    }
    if (name === "0") return GROUND;
    const known = this.byName.get(name);
    if (known === undefined) throw new Error(`UnknownMap: node ${name} is not in the circuit's numbering`);
    return known;
  }

  internalNode(owner: string, label: string): Unknown {
    const index = this.size;
    this.extra.push({ kind: "internal-node", name: `${owner}#${label}`, owner });
    return index;
  }

  branch(owner: string): Unknown {
    const index = this.size;
    this.extra.push({ kind: "branch", name: owner, owner });
    return index;
  }

  lookup(name: string): Unknown | undefined {
    return name === "0" ? GROUND : this.byName.get(name);
  }

  get size(): number { return this.nodeNames.length + this.extra.length; }

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

export type SolveOutcome = { ok: true } | { ok: false; singularUnknown: Unknown };

export class RealSystem {
  readonly n: number;
  private readonly pattern: MatrixPattern;
  private values: Float64Array;
  readonly rhs: Float64Array;
  private cscValues: Float64Array = NO_DOUBLES;
  private readonly lu: RealSparseLu;
  /** A factorisation with the current pattern exists, so its pivot order can be re-used. */
  private factored = false;
  private base: Float64Array = NO_DOUBLES;
  private readonly baseRhs: Float64Array;
  /** Tape position after the constant part, where every later assembly continues. */
  private baseLength = 0;
  /** The matrix the current factors are of (slot values), to skip re-factorising an unchanged one. */
  private factoredValues: Float64Array = NO_DOUBLES;

  /**
   * Where the system's arrays, and its LU's, come from: one buffer sized for a typical circuit
   * matrix, plus `extraDoubles` for the caller's own vectors.
   */
  readonly arena: Arena;

  /**
   * The structure of this system's first factorisation (null before it, or when it came from
   * `startFactors`), for the next system over the same circuit.
   */
  firstFactors: FactorStructure | null = null;
  /** An earlier system's first factorisation, tried (and kept only if exact) before a pivot search. */
  private startFactors: FactorStructure | null;

  /**
   * `from`: the pattern of an earlier system over the same circuit (see firstPattern), and
   * `factors` the structure of its first factorisation (see firstFactors).
   */
  constructor(n: number, from?: PatternSnapshot, extraDoubles = 0, factors: FactorStructure | null = null) {
    this.n = n;
    this.startFactors = from ? factors : null;
    this.pattern = new MatrixPattern(n, from);
    const slots = Math.max(6 * n + 16, this.pattern.slotCount);
    const entries = Math.max(16, 4 * n);
    const arena = (this.arena = acquireArena(4 * n + 4 * slots + 4 * entries + extraDoubles, 8 * n + 2 * slots + 5 * entries + 16));
    this.values = arena.f64(slots);
    this.rhs = arena.f64(n);
    this.baseRhs = arena.f64(n);
    this.lu = new RealSparseLu(n, arena);
  }

  /**
   * The pattern as this system's first symbolic analysis left it (null before that, or when the
   * system started from an earlier system's snapshot), for the next system over the same circuit.
   */
  firstPattern: PatternSnapshot | null = null;

  /**
   * Hands the arrays back for the next system (see releaseArena): the system, its LU and every
   * vector taken from `arena` are unusable afterwards.
   */
  release(): void {
    releaseArena(this.arena);
  }

  /** The first assembly did not replay the snapshot this system started from (see MatrixPattern.offSnapshot). */
  get offSnapshot(): boolean { return this.pattern.offSnapshot; }

  /** Starts a new assembly: clears values and right-hand side. */
  begin(): void {
    this.pattern.rewind();
    this.values.fill(0);
    this.rhs.fill(0);
  }

  /** Remembers what has been assembled so far (the constant part of every Newton iteration). */
  saveBase(): void {
    this.base = this.arena.f64(this.pattern.slotCount);
    this.base.set(this.values.subarray(0, this.pattern.slotCount));
    this.baseRhs.set(this.rhs);
    this.baseLength = this.pattern.position;
  }

  /** Starts an assembly from the saved constant part instead of from zero. */
  beginFromBase(): void {
    this.pattern.rewind(this.baseLength);
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

  /** Where each slot's value goes in the LU's factor arrays; rebuilt after every factor(). */
  private slotPositions: Int32Array | null = null;

  /** Factors the assembled matrix and solves into `out`. */
  solve(out: Float64Array): SolveOutcome {
    const pattern = this.pattern;
    const firstAnalysis = pattern.neverPrepared;
    const symbolicChanged = pattern.prepare();
    if (firstAnalysis) this.firstPattern = pattern.snapshot();
    const count = pattern.slotCount;
    if (this.values.length < count) {
      const grown = new Float64Array(count);
      grown.set(this.values);
      this.values = grown;
    }
    const values = this.values;
    if (this.factored && !symbolicChanged) {
      // A Newton step that changed no conductance (a linear circuit's second iteration) has its factors already.
      if (sameValues(values, this.factoredValues, count)) {
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
      const positions = (this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc, this.arena.i32(count)));
      if (this.lu.refactor(pattern.csc, values, count, positions, REFACTOR_TOLERANCE)) {
        this.factoredValues.set(values.subarray(0, count));
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
    }
    if (symbolicChanged || this.cscValues.length !== count) {
      this.cscValues = this.arena.f64(count);
      this.factoredValues = this.arena.f64(count);
    }
    const start = this.startFactors;
    this.startFactors = null;
    if (start && !this.factored && !symbolicChanged) {
      const positions = this.lu.refactorAsFactor(start, pattern.csc, pattern.order, values, count, pattern.slotToCsc, PIVOT_TOLERANCE);
      if (positions) {
        this.slotPositions = positions;
        this.factored = true;
        this.factoredValues.set(values.subarray(0, count));
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
    }
    const firstFactorisation = !this.factored && this.firstFactors === null && start === null;
    // Every CSC position belongs to exactly one slot, so the copy overwrites all of them.
    const csc = this.cscValues, map = pattern.slotToCsc;
    for (let s = 0; s < count; s++) csc[map[s] as number] = values[s] as number;
    this.slotPositions = null;
    const outcome = this.lu.factor(pattern.csc, csc, pattern.order, PIVOT_TOLERANCE);
    this.factored = outcome.ok;
    if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    if (firstFactorisation) this.firstFactors = this.lu.exportStructure(pattern.csc);
    this.factoredValues.set(values.subarray(0, count));
    this.lu.solve(this.rhs, out);
    return { ok: true };
  }

  get factorNonzeros(): number { return this.lu.factorNonzeros; }
  get matrixNonzeros(): number { return this.pattern.slotCount; }
}

export class ComplexSystem {
  readonly n: number;
  private readonly pattern: MatrixPattern;
  private re: Float64Array;
  private im: Float64Array;
  readonly rhsRe: Float64Array;
  readonly rhsIm: Float64Array;
  private cscRe: Float64Array = NO_DOUBLES;
  private cscIm: Float64Array = NO_DOUBLES;
  private readonly lu: ComplexSparseLu;
  private factored = false;
  private slotPositions: Int32Array | null = null;
  /** The LU holds Y0 and Y1 in its factor layout for the current pivots. */
  private affineLoaded = false;
  /**
   * Set by beginAt(ω) until something is stamped on top: the matrix is then exactly Y0 + ω·Y1
   * and is formed straight into the factors instead of into the slot values first.
   */
  private pendingOmega: number | null = null;

  constructor(n: number) {
    this.n = n;
    this.pattern = new MatrixPattern(n);
    [this.re, this.im, this.rhsRe, this.rhsIm] = float64Views([6 * n + 16, 6 * n + 16, n, n] as const);
    this.lu = new ComplexSparseLu(n);
  }

  begin(): void {
    this.pattern.rewind();
    this.pendingOmega = null;
    this.re.fill(0);
    this.im.fill(0);
    this.rhsRe.fill(0);
    this.rhsIm.fill(0);
  }

  private y0Re: Float64Array = NO_DOUBLES;
  private y0Im: Float64Array = NO_DOUBLES;
  private y1Re: Float64Array = NO_DOUBLES;
  private y1Im: Float64Array = NO_DOUBLES;
  private rhs0Re: Float64Array = NO_DOUBLES;
  private rhs0Im: Float64Array = NO_DOUBLES;

  /**
   * Affine-in-ω assembly, Y(ω) = Y0 + ω·Y1: call after assembling at ω = 0 (which = 0), then
   * after assembling again at ω = 1 (which = 1). Afterwards beginAt(ω) starts from Y(ω), so only
   * elements that are not affine in ω need stamping per point.
   */
  saveAffinePart(which: 0 | 1): void {
    const count = this.pattern.slotCount;
    this.affineLoaded = false;
    if (which === 0) {
      this.y0Re = this.re.slice(0, count);
      this.y0Im = this.im.slice(0, count);
      this.rhs0Re = this.rhsRe.slice();
      this.rhs0Im = this.rhsIm.slice();
      return;
    }
    // Entries first stamped at ω = 1 are zero at ω = 0.
    const y0Re = new Float64Array(count), y0Im = new Float64Array(count);
    y0Re.set(this.y0Re.subarray(0, count));
    y0Im.set(this.y0Im.subarray(0, count));
    this.y0Re = y0Re;
    this.y0Im = y0Im;
    this.y1Re = new Float64Array(count);
    this.y1Im = new Float64Array(count);
    for (let s = 0; s < count; s++) {
      this.y1Re[s] = (this.re[s] as number) - (y0Re[s] as number);
      this.y1Im[s] = (this.im[s] as number) - (y0Im[s] as number);
    }
  }

  beginAt(omega: number): void {
    this.pattern.rewind();
    this.pendingOmega = omega;
    this.rhsRe.set(this.rhs0Re);
    this.rhsIm.set(this.rhs0Im);
  }

  /** Writes Y0 + ω·Y1 into the slot values, for stamps on top or a full factorisation. */
  private materialise(): void {
    const omega = this.pendingOmega;
    if (omega === null) return;
    this.pendingOmega = null;
    const re = this.re, im = this.im, y0r = this.y0Re, y0i = this.y0Im, y1r = this.y1Re, y1i = this.y1Im;
    const count = y1r.length;
    for (let s = 0; s < count; s++) {
      re[s] = (y0r[s] as number) + omega * (y1r[s] as number);
      im[s] = (y0i[s] as number) + omega * (y1i[s] as number);
    }
    re.fill(0, count);
    im.fill(0, count);
  }

  add(row: Unknown, col: Unknown, re: number, im: number): void {
    if (row < 0 || col < 0) return;
    if (this.pendingOmega !== null) this.materialise();
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
    const count = pattern.slotCount;
    if (this.re.length < count) {
      const gr = new Float64Array(count); gr.set(this.re); this.re = gr;
      const gi = new Float64Array(count); gi.set(this.im); this.im = gi;
    }
    if (this.factored && !symbolicChanged) {
      const positions = (this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc));
      const omega = this.pendingOmega;
      let ok: boolean;
      if (omega !== null && this.y1Re.length === count) {
        if (!this.affineLoaded) {
          this.lu.loadAffine(pattern.csc, this.y0Re, this.y0Im, this.y1Re, this.y1Im, count, positions);
          this.affineLoaded = true;
        }
        ok = this.lu.refactorAffine(omega, REFACTOR_TOLERANCE);
      } else {
        this.materialise();
        ok = this.lu.refactor(pattern.csc, this.re, this.im, count, positions, REFACTOR_TOLERANCE);
      }
      if (ok) {
        this.lu.solve(this.rhsRe, this.rhsIm, outRe, outIm);
        return { ok: true };
      }
    }
    this.materialise();
    if (symbolicChanged || this.cscRe.length !== count) {
      this.cscRe = new Float64Array(count);
      this.cscIm = new Float64Array(count);
    }
    const cr = this.cscRe, ci = this.cscIm, map = pattern.slotToCsc, re = this.re, im = this.im;
    for (let s = 0; s < count; s++) {
      const p = map[s] as number;
      cr[p] = re[s] as number;
      ci[p] = im[s] as number;
    }
    this.slotPositions = null;
    this.affineLoaded = false;
    const outcome = this.lu.factor(pattern.csc, cr, ci, pattern.order, PIVOT_TOLERANCE);
    this.factored = outcome.ok;
    if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    this.lu.solve(this.rhsRe, this.rhsIm, outRe, outIm);
    return { ok: true };
  }

  /**
   * Two points of a sweep whose matrix is exactly Y0 + ω·Y1 (nothing stamped per point), solved
   * together with the current pivots; false, with nothing written, when that is not possible
   * (no factorisation yet, new entries, or a pivot that needs a fresh search) — the caller then
   * takes the two points through beginAt/solve one at a time. The caller must not have
   * per-point stamps.
   */
  solveAffinePair(omegaA: number, omegaB: number, aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array): boolean {
    const pattern = this.pattern, count = pattern.slotCount;
    if (!this.factored || pattern.stale || this.y1Re.length !== count) return false;
    const positions = (this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc));
    if (!this.affineLoaded) {
      this.lu.loadAffine(pattern.csc, this.y0Re, this.y0Im, this.y1Re, this.y1Im, count, positions);
      this.affineLoaded = true;
    }
    if (!this.lu.refactorAffinePair(omegaA, omegaB, REFACTOR_TOLERANCE)) return false;
    this.lu.solvePair(this.rhs0Re, this.rhs0Im, aRe, aIm, bRe, bIm);
    return true;
  }

  get factorNonzeros(): number { return this.lu.factorNonzeros; }
  get matrixNonzeros(): number { return this.pattern.slotCount; }
}

function sameValues(a: Float64Array, b: Float64Array, count: number): boolean {
  if (b.length < count) return false;
  for (let i = 0; i < count; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Slot → factor position, through the slot's CSC position. */
function composePositions(cscToFactor: Int32Array, slotToCsc: Int32Array, out = new Int32Array(slotToCsc.length)): Int32Array {
  for (let s = 0; s < out.length; s++) out[s] = cscToFactor[slotToCsc[s] as number] as number;
  return out;
}
