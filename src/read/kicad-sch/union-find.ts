// Disjoint sets over dense integer ids with path halving and union by size: near-constant time per
// operation, so connectivity stays linear in the number of items.

export class UnionFind {
  private parent: Int32Array;
  private size: Int32Array;
  private count = 0;

  constructor(capacity = 1024) {
    this.parent = new Int32Array(Math.max(16, capacity));
    this.size = new Int32Array(Math.max(16, capacity));
  }

  /** Adds a singleton set and returns its id. */
  add(): number {
    if (this.count === this.parent.length) this.grow();
    const id = this.count++;
    this.parent[id] = id;
    this.size[id] = 1;
    return id;
  }

  get length(): number {
    return this.count;
  }

  find(id: number): number {
    const parent = this.parent;
    let x = id;
    while (parent[x] !== x) {
      const p = parent[x] ?? x;
      const gp = parent[p] ?? p;
      parent[x] = gp;
      x = gp;
    }
    return x;
  }

  union(a: number, b: number): number {
    let ra = this.find(a);
    let rb = this.find(b);
    if (ra === rb) return ra;
    if ((this.size[ra] ?? 0) < (this.size[rb] ?? 0)) { const t = ra; ra = rb; rb = t; }
    this.parent[rb] = ra;
    this.size[ra] = (this.size[ra] ?? 0) + (this.size[rb] ?? 0);
    return ra;
  }

  private grow(): void {
    const n = this.parent.length * 2;
    const p = new Int32Array(n);
    p.set(this.parent);
    const s = new Int32Array(n);
    s.set(this.size);
    this.parent = p;
    this.size = s;
  }
}
