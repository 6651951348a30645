// The sparsity pattern of an MNA matrix as the stamps reveal it. Stamps arrive as (row, col,
// value) triples; the first assembly discovers the pattern, each new (row, col) getting the next
// "slot" of the value array. Later assemblies usually repeat the same sequence of stamps, so a
// tape remembers the slot of each call and a repeat costs two integer compares instead of a hash
// lookup. A stamp that was not on the tape falls back to the slot table and, if it is a new
// matrix entry, triggers a fresh symbolic analysis (CSC pattern and fill-reducing order) before
// the next factorisation. A pattern can hand its state to the next system over the same circuit
// (snapshot), which then skips all of that.

import { minimumDegreeOrder, type CscPattern } from "./ordering.js";
import { int32Views, NO_INTS } from "./views.js";

/** The pattern of a system that has not been analysed yet. */
const NO_PATTERN: CscPattern = { n: 0, colPtr: new Int32Array(1), rowIdx: NO_INTS };

class SlotTape {
  rows: Int32Array;
  cols: Int32Array;
  slots: Int32Array;
  length = 0;
  /** The arrays belong to a snapshot too: copy before the first write. */
  shared = false;
  /** A new tape of `capacity` positions, or (given arrays) one sharing a snapshot's arrays. */
  constructor(capacity: number, shared?: { rows: Int32Array; cols: Int32Array; slots: Int32Array; length: number }) {
    if (shared) {
      ({ rows: this.rows, cols: this.cols, slots: this.slots, length: this.length } = shared);
      this.shared = true;
      return;
    }
    [this.rows, this.cols, this.slots] = int32Views([capacity, capacity, capacity] as const);
  }
  record(position: number, row: number, col: number, slot: number): void {
    if (position >= this.rows.length || this.shared) {
      const cap = position >= this.rows.length ? this.rows.length * 2 : this.rows.length;
      const [rows, cols, slots] = int32Views([cap, cap, cap] as const);
      rows.set(this.rows);
      cols.set(this.cols);
      slots.set(this.slots);
      this.rows = rows;
      this.cols = cols;
      this.slots = slots;
      this.shared = false;
    }
    this.rows[position] = row;
    this.cols[position] = col;
    this.slots[position] = slot;
    if (position >= this.length) this.length = position + 1;
  }
}

/**
 * (row, col) → slot, open addressing over typed arrays: the first assembly of a circuit looks up
 * every stamp here, and a general-purpose Map costs several times more per lookup and in garbage.
 */
class SlotTable {
  table: Int32Array;
  mask: number;
  rows: Int32Array;
  cols: Int32Array;
  count = 0;
  /** The arrays belong to a snapshot too: copy before the first write. */
  shared = false;

  /** A new table for about `capacity` slots, or (given arrays) one sharing a snapshot's arrays. */
  constructor(capacity: number, shared?: { table: Int32Array; mask: number; rows: Int32Array; cols: Int32Array; count: number }) {
    if (shared) {
      ({ table: this.table, mask: this.mask, rows: this.rows, cols: this.cols, count: this.count } = shared);
      this.shared = true;
      return;
    }
    let size = 16;
    while (size < 2 * capacity) size *= 2;
    [this.table, this.rows, this.cols] = int32Views([size, capacity, capacity] as const);
    this.table.fill(-1);
    this.mask = size - 1;
  }

  private static hash(row: number, col: number): number {
    return Math.imul(row, 0x9e3779b1) ^ Math.imul(col, 0x85ebca77);
  }

  /** The slot of (row, col), or −1. */
  find(row: number, col: number): number {
    const table = this.table, mask = this.mask;
    for (let h = SlotTable.hash(row, col) & mask; ; h = (h + 1) & mask) {
      const slot = table[h] as number;
      if (slot < 0 || (this.rows[slot] === row && this.cols[slot] === col)) return slot;
    }
  }

  /** Adds (row, col), known to be absent, as the next slot. */
  insert(row: number, col: number): number {
    const slot = this.count++;
    if (slot >= this.rows.length || this.shared) {
      const cap = slot >= this.rows.length ? this.rows.length * 2 : this.rows.length;
      const [rows, cols] = int32Views([cap, cap] as const);
      rows.set(this.rows);
      cols.set(this.cols);
      this.rows = rows;
      this.cols = cols;
    }
    this.rows[slot] = row;
    this.cols[slot] = col;
    if (2 * this.count > this.table.length) this.rehash(this.table.length * 2);
    else if (this.shared) this.rehash(this.table.length);
    else this.place(slot);
    this.shared = false;
    return slot;
  }

  private place(slot: number): void {
    const table = this.table, mask = this.mask;
    let h = SlotTable.hash(this.rows[slot] as number, this.cols[slot] as number) & mask;
    while ((table[h] as number) >= 0) h = (h + 1) & mask;
    table[h] = slot;
  }

  private rehash(size: number): void {
    this.table = new Int32Array(size).fill(-1);
    this.mask = size - 1;
    for (let s = 0; s < this.count; s++) this.place(s);
  }
}

/**
 * A pattern's state after its first symbolic analysis, to start another system over the same
 * circuit from (see MatrixPattern.snapshot). Read-only: the systems that share it copy an array
 * before they write to it.
 */
export interface PatternSnapshot {
  readonly n: number;
  readonly table: Int32Array;
  readonly mask: number;
  readonly rows: Int32Array;
  readonly cols: Int32Array;
  readonly count: number;
  readonly tapeRows: Int32Array;
  readonly tapeCols: Int32Array;
  readonly tapeSlots: Int32Array;
  readonly tapeLength: number;
  readonly csc: CscPattern;
  readonly slotToCsc: Int32Array;
  readonly order: Int32Array;
}

/** Slot registry, stamp tape and symbolic analysis, shared by the real and complex systems. */
export class MatrixPattern {
  readonly n: number;
  private readonly slots: SlotTable;
  private readonly tape: SlotTape;
  private cursor = 0;
  private symbolicStale = true;
  /** No symbolic analysis yet, neither made nor inherited from a snapshot. */
  neverPrepared = true;
  /** Started from a snapshot (see snapshot()). */
  fromSnapshot = false;
  /**
   * Started from a snapshot, and the first assembly did not replay its stamps: the circuit is
   * not the one the snapshot was made from (an element edited in place).
   */
  offSnapshot = false;
  /** The first factorisation has been asked for (prepare() called), so a first assembly is over. */
  private assembled = false;
  csc: CscPattern = NO_PATTERN;
  /** Position of each slot inside the CSC value array. */
  slotToCsc: Int32Array = NO_INTS;
  order: Int32Array = NO_INTS;

  constructor(n: number, from?: PatternSnapshot) {
    this.n = n;
    if (from && from.n === n) {
      // Same circuit, same stamps: start where that system's first analysis ended.
      this.slots = new SlotTable(0, from);
      this.tape = new SlotTape(0, { rows: from.tapeRows, cols: from.tapeCols, slots: from.tapeSlots, length: from.tapeLength });
      this.csc = from.csc;
      this.slotToCsc = from.slotToCsc;
      this.order = from.order;
      this.symbolicStale = false;
      this.neverPrepared = false;
      this.fromSnapshot = true;
      return;
    }
    // MNA matrices of circuits carry a handful of entries per unknown; the tables grow if not.
    this.slots = new SlotTable(6 * n + 16);
    this.tape = new SlotTape(12 * n + 16);
  }

  /**
   * The current state for another system over the same circuit (valid after prepare()). Both
   * then share the arrays until one of them meets a stamp the other has not seen.
   */
  snapshot(): PatternSnapshot {
    const { slots, tape } = this;
    slots.shared = true;
    tape.shared = true;
    return {
      n: this.n,
      table: slots.table, mask: slots.mask, rows: slots.rows, cols: slots.cols, count: slots.count,
      tapeRows: tape.rows, tapeCols: tape.cols, tapeSlots: tape.slots, tapeLength: tape.length,
      csc: this.csc, slotToCsc: this.slotToCsc, order: this.order,
    };
  }

  get slotCount(): number { return this.slots.count; }

  /** New entries wait for the next prepare(). */
  get stale(): boolean { return this.symbolicStale; }

  /** Starts a new sequence of stamps at tape position `position` (0: from the beginning). */
  rewind(position = 0): void { this.cursor = position; }

  get position(): number { return this.cursor; }

  /** Slot for (row, col), both already known to be non-ground. */
  slot(row: number, col: number): number {
    const position = this.cursor++;
    const tape = this.tape;
    if (position < tape.length && tape.rows[position] === row && tape.cols[position] === col) {
      return tape.slots[position] as number;
    }
    if (this.fromSnapshot && !this.assembled) this.offSnapshot = true;
    let slot = this.slots.find(row, col);
    if (slot < 0) {
      slot = this.slots.insert(row, col);
      this.symbolicStale = true;
    }
    tape.record(position, row, col, slot);
    return slot;
  }

  /** Rebuilds the CSC pattern (every diagonal included) and the column order if new entries appeared. */
  prepare(): boolean {
    this.assembled = true;
    if (!this.symbolicStale) return false;
    const n = this.n;
    const table = this.slots;
    // Every diagonal gets an entry so a pivot candidate always exists where the order expects one.
    for (let i = 0; i < n; i++) if (table.find(i, i) < 0) table.insert(i, i);
    const count = table.count;
    const slotRow = table.rows, slotCol = table.cols;
    // Counting sort by row, then stably by column: rows come out sorted within each column.
    const [rowStart, byRow, colPtr, fill, rowIdx, slotToCsc] = int32Views([n + 1, count, n + 1, n, count, count] as const);
    for (let s = 0; s < count; s++) { const r = (slotRow[s] as number) + 1; rowStart[r] = (rowStart[r] as number) + 1; }
    for (let r = 0; r < n; r++) rowStart[r + 1] = (rowStart[r + 1] as number) + (rowStart[r] as number);
    for (let s = 0; s < count; s++) {
      const r = slotRow[s] as number;
      const at = rowStart[r] as number;
      byRow[at] = s;
      rowStart[r] = at + 1;
    }
    for (let s = 0; s < count; s++) { const c = (slotCol[s] as number) + 1; colPtr[c] = (colPtr[c] as number) + 1; }
    for (let c = 0; c < n; c++) colPtr[c + 1] = (colPtr[c + 1] as number) + (colPtr[c] as number);
    fill.set(colPtr.subarray(0, n));
    for (let i = 0; i < count; i++) {
      const s = byRow[i] as number;
      const c = slotCol[s] as number;
      const pos = fill[c] as number;
      fill[c] = pos + 1;
      rowIdx[pos] = slotRow[s] as number;
      slotToCsc[s] = pos;
    }
    this.csc = { n, colPtr, rowIdx };
    this.slotToCsc = slotToCsc;
    this.order = minimumDegreeOrder(this.csc);
    this.symbolicStale = false;
    this.neverPrepared = false;
    return true;
  }
}

