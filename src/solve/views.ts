// Typed arrays carved out of one ArrayBuffer. Each `new Int32Array(n)` beyond a few dozen bytes
// is a native allocation (hundreds of nanoseconds, and external memory the collector accounts
// for); a solve needs dozens of such arrays, sized together, so they share one buffer instead.

/** Zero-length arrays, shared by every field that has nothing yet (they hold nothing to change). */
export const NO_DOUBLES: Float64Array<ArrayBuffer> = new Float64Array(0);
export const NO_INTS: Int32Array<ArrayBuffer> = new Int32Array(0);

type Views<T extends readonly number[]> = { -readonly [K in keyof T]: Int32Array<ArrayBuffer> };
type FloatViews<T extends readonly number[]> = { -readonly [K in keyof T]: Float64Array<ArrayBuffer> };

/** Zero-filled Int32Arrays of the given lengths, backed by one buffer. */
export function int32Views<const T extends readonly number[]>(lengths: T): Views<T> {
  let total = 0;
  for (const n of lengths) total += n;
  const buffer = new ArrayBuffer(4 * total);
  let offset = 0;
  return lengths.map((n) => {
    const view = new Int32Array(buffer, 4 * offset, n);
    offset += n;
    return view;
  }) as Views<T>;
}

/** Zero-filled Float64Arrays of the given lengths, backed by one buffer. */
export function float64Views<const T extends readonly number[]>(lengths: T): FloatViews<T> {
  let total = 0;
  for (const n of lengths) total += n;
  const buffer = new ArrayBuffer(8 * total);
  let offset = 0;
  return lengths.map((n) => {
    const view = new Float64Array(buffer, 8 * offset, n);
    offset += n;
    return view;
  }) as FloatViews<T>;
}

/**
 * Zeroed typed arrays handed out from two buffers sized up front for everything one solve needs;
 * once a buffer is used up, fresh arrays. Nothing is handed out twice, so the arrays are as
 * independent as separately allocated ones. A solve whose arrays do not outlive it returns its
 * arena (releaseArena) for the next solve: a fresh buffer of tens of kilobytes costs more in
 * allocation and collector pressure than clearing the part that was used.
 */
export class Arena {
  private readonly doubles: Float64Array<ArrayBuffer>;
  private readonly ints: Int32Array<ArrayBuffer>;
  private doublesUsed = 0;
  private intsUsed = 0;

  constructor(doubles: number, ints: number) {
    // One buffer: the doubles first, so both kinds stay aligned.
    const buffer = new ArrayBuffer(8 * doubles + 4 * ints);
    this.doubles = new Float64Array(buffer, 0, doubles);
    this.ints = new Int32Array(buffer, 8 * doubles, ints);
  }

  get doubleCapacity(): number { return this.doubles.length; }
  get intCapacity(): number { return this.ints.length; }

  f64(length: number): Float64Array<ArrayBuffer> {
    const end = this.doublesUsed + length;
    if (end > this.doubles.length) return new Float64Array(length);
    const view = this.doubles.subarray(this.doublesUsed, end);
    this.doublesUsed = end;
    return view;
  }

  i32(length: number): Int32Array<ArrayBuffer> {
    const end = this.intsUsed + length;
    if (end > this.ints.length) return new Int32Array(length);
    const view = this.ints.subarray(this.intsUsed, end);
    this.intsUsed = end;
    return view;
  }

  /** Clears what was handed out and makes all of it available again. */
  reset(): void {
    this.doubles.fill(0, 0, this.doublesUsed);
    this.ints.fill(0, 0, this.intsUsed);
    this.doublesUsed = 0;
    this.intsUsed = 0;
  }
}

/** Arenas returned by finished solves, for the next ones. */
const spareArenas: Arena[] = [];
const SPARE_ARENAS = 4;

/** An arena with room for `doubles` and `ints`: a spare one, cleared, or a new one. */
export function acquireArena(doubles: number, ints: number): Arena {
  for (let i = spareArenas.length - 1; i >= 0; i--) {
    const arena = spareArenas[i] as Arena;
    if (arena.doubleCapacity >= doubles && arena.intCapacity >= ints) {
      spareArenas.splice(i, 1);
      arena.reset();
      return arena;
    }
  }
  return new Arena(doubles, ints);
}

/** Gives an arena back; every array it handed out must be unreachable from here on. */
export function releaseArena(arena: Arena): void {
  if (spareArenas.length >= SPARE_ARENAS) spareArenas.shift();
  spareArenas.push(arena);
}
