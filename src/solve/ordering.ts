// Fill-reducing column order for the sparse LU: minimum degree on the symmetric pattern A + Aᵀ.
// Circuit matrices are structurally near-symmetric (a conductance between two nodes stamps both
// (i,j) and (j,i)), so ordering the symmetric pattern is the usual choice and keeps the diagonal
// a good pivot candidate. Exact elimination graph with explicit cliques: quadratic in the worst
// case, but circuit nodes are eliminated low-degree first, so a 3000-unknown ladder orders in
// milliseconds.

/** Column-compressed sparsity pattern of an n × n matrix (row indices per column). */
export interface CscPattern {
  n: number;
  colPtr: Int32Array;
  rowIdx: Int32Array;
}

export function minimumDegreeOrder(pattern: CscPattern): Int32Array {
  const { n, colPtr, rowIdx } = pattern;
  const adjacency: Set<number>[] = [];
  for (let i = 0; i < n; i++) adjacency.push(new Set<number>());
  for (let col = 0; col < n; col++) {
    const end = colPtr[col + 1] ?? 0;
    for (let p = colPtr[col] ?? 0; p < end; p++) {
      const row = rowIdx[p] ?? 0;
      if (row === col) continue;
      adjacency[row]?.add(col);
      adjacency[col]?.add(row);
    }
  }

  // Degree buckets as doubly linked lists so picking the minimum is cheap.
  const head = new Int32Array(n + 1).fill(-1);
  const next = new Int32Array(n).fill(-1);
  const prev = new Int32Array(n).fill(-1);
  const degree = new Int32Array(n);
  const insert = (v: number, d: number): void => {
    degree[v] = d;
    prev[v] = -1;
    const h = head[d] ?? -1;
    next[v] = h;
    if (h >= 0) prev[h] = v;
    head[d] = v;
  };
  const remove = (v: number): void => {
    const d = degree[v] ?? 0;
    const p = prev[v] ?? -1;
    const nx = next[v] ?? -1;
    if (p >= 0) next[p] = nx;
    else head[d] = nx;
    if (nx >= 0) prev[nx] = p;
  };
  for (let v = n - 1; v >= 0; v--) insert(v, Math.min(n, adjacency[v]?.size ?? 0));

  const order = new Int32Array(n);
  let minDegree = 0;
  for (let step = 0; step < n; step++) {
    while (minDegree <= n && (head[minDegree] ?? -1) < 0) minDegree++;
    const v = head[minDegree] ?? -1;
    if (v < 0) throw new Error("minimumDegreeOrder: bucket structure corrupted");
    remove(v);
    order[step] = v;
    const neighbours = [...(adjacency[v] ?? [])];
    adjacency[v] = new Set<number>();
    for (const u of neighbours) adjacency[u]?.delete(v);
    // Eliminating v joins its neighbours into a clique (the fill the LU will create).
    for (let a = 0; a < neighbours.length; a++) {
      const u = neighbours[a] ?? 0;
      const setU = adjacency[u];
      if (!setU) continue;
      for (let b = a + 1; b < neighbours.length; b++) {
        const w = neighbours[b] ?? 0;
        if (!setU.has(w)) {
          setU.add(w);
          adjacency[w]?.add(u);
        }
      }
    }
    for (const u of neighbours) {
      remove(u);
      const d = Math.min(n, adjacency[u]?.size ?? 0);
      insert(u, d);
      if (d < minDegree) minDegree = d;
    }
  }
  return order;
}
