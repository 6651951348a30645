// "Which segments pass through this point?" in logarithmic time. Segments are filed by the line
// they lie on — horizontal (by y), vertical (by x), the two 45° diagonals (by x−y and x+y) — and
// collinear segments on one line that overlap or touch are merged into one interval, reporting the
// merge so the caller can join them (the editor merges overlapping collinear wires; KiCad format
// notes §8.2 rule 7). Any other slope is rare and checked one by one, up to a bounded number.

/** Free-angle segments per sheet checked for points on their interior; beyond this they still
 * connect at their ends, and the caller is told how many were left out. */
export const MAX_FREE_ANGLE_SEGMENTS = 2000;

interface Row {
  starts: number[];
  ends: number[];
  reps: number[];
}

type Family = Map<number, Row>;

export class SegmentIndex {
  private readonly families: Family[] = [new Map(), new Map(), new Map(), new Map()];
  private readonly general: number[] = [];
  /** Free-angle segments left out of interior checks (over MAX_FREE_ANGLE_SEGMENTS). */
  overflow = 0;

  /**
   * @param segs flat [x1, y1, x2, y2, …]; segment i gets id `i`.
   * @param onMerge called for each pair of collinear segments that overlap or touch.
   */
  constructor(segs: number[], onMerge: (a: number, b: number) => void) {
    const raw: Map<number, number[]>[] = [new Map(), new Map(), new Map(), new Map()];
    const n = segs.length >> 2;
    for (let i = 0; i < n; i++) {
      const x1 = segs[4 * i] ?? 0, y1 = segs[4 * i + 1] ?? 0, x2 = segs[4 * i + 2] ?? 0, y2 = segs[4 * i + 3] ?? 0;
      const dx = x2 - x1, dy = y2 - y1;
      let family: number, key: number, lo: number, hi: number;
      if (dy === 0) { family = 0; key = y1; lo = Math.min(x1, x2); hi = Math.max(x1, x2); }
      else if (dx === 0) { family = 1; key = x1; lo = Math.min(y1, y2); hi = Math.max(y1, y2); }
      else if (dx === dy) { family = 2; key = x1 - y1; lo = Math.min(x1, x2); hi = Math.max(x1, x2); }
      else if (dx === -dy) { family = 3; key = x1 + y1; lo = Math.min(x1, x2); hi = Math.max(x1, x2); }
      else {
        if (this.general.length / 5 < MAX_FREE_ANGLE_SEGMENTS) this.general.push(x1, y1, x2, y2, i);
        else this.overflow++;
        continue;
      }
      const fam = raw[family] as Map<number, number[]>;
      let list = fam.get(key);
      if (!list) { list = []; fam.set(key, list); }
      list.push(lo, hi, i);
    }
    for (let f = 0; f < 4; f++) {
      const out = this.families[f] as Family;
      for (const [key, list] of raw[f] as Map<number, number[]>) out.set(key, mergeRow(list, onMerge));
    }
  }

  /** Calls `visit` once per merged interval (by one representative id) that contains the point.
   * Axis and 45° lines match exactly on the grid; other slopes within one grid unit. */
  forEachAt(x: number, y: number, visit: (id: number) => void): void {
    probe(this.families[0]?.get(y), x, visit);
    probe(this.families[1]?.get(x), y, visit);
    probe(this.families[2]?.get(x - y), x, visit);
    probe(this.families[3]?.get(x + y), x, visit);
    const g = this.general;
    for (let k = 0; k < g.length; k += 5) {
      const x1 = g[k] ?? 0, y1 = g[k + 1] ?? 0, x2 = g[k + 2] ?? 0, y2 = g[k + 3] ?? 0;
      if (x < Math.min(x1, x2) - 1 || x > Math.max(x1, x2) + 1 || y < Math.min(y1, y2) - 1 || y > Math.max(y1, y2) + 1) continue;
      const dx = x2 - x1, dy = y2 - y1;
      const cross = (x - x1) * dy - (y - y1) * dx;
      // distance to the line = |cross| / length; within one grid unit
      if (cross * cross <= dx * dx + dy * dy) visit(g[k + 4] ?? 0);
    }
  }
}

function mergeRow(list: number[], onMerge: (a: number, b: number) => void): Row {
  const count = list.length / 3;
  const order = Array.from({ length: count }, (_, i) => i);
  order.sort((a, b) => (list[3 * a] ?? 0) - (list[3 * b] ?? 0));
  const row: Row = { starts: [], ends: [], reps: [] };
  let curStart = 0, curEnd = 0, curRep = -1;
  for (const i of order) {
    const lo = list[3 * i] ?? 0, hi = list[3 * i + 1] ?? 0, id = list[3 * i + 2] ?? 0;
    if (curRep >= 0 && lo <= curEnd) {
      onMerge(curRep, id);
      if (hi > curEnd) curEnd = hi;
      continue;
    }
    if (curRep >= 0) { row.starts.push(curStart); row.ends.push(curEnd); row.reps.push(curRep); }
    curStart = lo; curEnd = hi; curRep = id;
  }
  if (curRep >= 0) { row.starts.push(curStart); row.ends.push(curEnd); row.reps.push(curRep); }
  return row;
}

function probe(row: Row | undefined, t: number, visit: (id: number) => void): void {
  if (!row) return;
  const { starts, ends, reps } = row;
  let lo = 0, hi = starts.length - 1, found = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if ((starts[mid] ?? 0) <= t) { found = mid; lo = mid + 1; } else hi = mid - 1;
  }
  if (found >= 0 && (ends[found] ?? 0) >= t) visit(reps[found] ?? 0);
}
