// Fill-reducing column order for the sparse LU: minimum degree on the symmetric pattern A + Aᵀ.
// Circuit matrices are structurally near-symmetric (a conductance between two nodes stamps both
// (i,j) and (j,i)), so ordering the symmetric pattern is the usual choice and keeps the diagonal
// a good pivot candidate. Exact elimination graph with explicit cliques: quadratic in the worst
// case, but circuit nodes are eliminated low-degree first, so a 3000-unknown ladder orders in
// milliseconds.
//
// Neighbour lists are plain arrays kept in first-insertion order, and ties between equal degrees
// go to the most recently re-bucketed vertex; both are part of the order's definition (the same
// matrix always gets the same order, hence the same factors to the last bit).

import { int32Views } from "./views.js";

/** Column-compressed sparsity pattern of an n × n matrix (row indices per column). */
export interface CscPattern {
  n: number;
  colPtr: Int32Array;
  rowIdx: Int32Array;
}

/**
 * Neighbours of every vertex in A + Aᵀ, each list in the order a column-by-column scan of A
 * first meets them: for vertex v, the columns c < v that have an entry in row v, then the rows of
 * column v, then the columns c > v with an entry in row v.
 */
function symmetricNeighbours(pattern: CscPattern): number[][] {
  const { n, colPtr, rowIdx } = pattern;
  const nnz = colPtr[n] as number;
  // Row-wise view (columns ascending within each row) by a counting sort of the CSC entries.
  const [rowPtr, next, colIdx, mark] = int32Views([n + 1, n, nnz, n] as const);
  for (let p = 0; p < nnz; p++) { const r = (rowIdx[p] as number) + 1; rowPtr[r] = (rowPtr[r] as number) + 1; }
  for (let r = 0; r < n; r++) rowPtr[r + 1] = (rowPtr[r + 1] as number) + (rowPtr[r] as number);
  next.set(rowPtr.subarray(0, n));
  for (let c = 0; c < n; c++) {
    const end = colPtr[c + 1] as number;
    for (let p = colPtr[c] as number; p < end; p++) {
      const r = rowIdx[p] as number;
      const at = next[r] as number;
      colIdx[at] = c;
      next[r] = at + 1;
    }
  }
  mark.fill(-1);
  const lists: number[][] = new Array<number[]>(n);
  for (let v = 0; v < n; v++) {
    const list: number[] = [];
    mark[v] = v;
    const rEnd = rowPtr[v + 1] as number;
    let q = rowPtr[v] as number;
    for (; q < rEnd && (colIdx[q] as number) < v; q++) {
      const c = colIdx[q] as number;
      if (mark[c] !== v) { mark[c] = v; list.push(c); }
    }
    const cEnd = colPtr[v + 1] as number;
    for (let p = colPtr[v] as number; p < cEnd; p++) {
      const r = rowIdx[p] as number;
      if (mark[r] !== v) { mark[r] = v; list.push(r); }
    }
    for (; q < rEnd; q++) {
      const c = colIdx[q] as number;
      if (mark[c] !== v) { mark[c] = v; list.push(c); }
    }
    lists[v] = list;
  }
  return lists;
}

export function minimumDegreeOrder(pattern: CscPattern): Int32Array {
  const n = pattern.n;
  const adjacency = symmetricNeighbours(pattern);

  // Degree buckets as doubly linked lists so picking the minimum is cheap.
  const [head, next, prev, degree, mark, order, live, eliminated] = int32Views([n + 1, n, n, n, n, n, n, n] as const);
  head.fill(-1);
  next.fill(-1);
  prev.fill(-1);
  const insert = (v: number, d: number): void => {
    degree[v] = d;
    prev[v] = -1;
    const h = head[d] as number;
    next[v] = h;
    if (h >= 0) prev[h] = v;
    head[d] = v;
  };
  const remove = (v: number): void => {
    const d = degree[v] as number;
    const p = prev[v] as number;
    const nx = next[v] as number;
    if (p >= 0) next[p] = nx;
    else head[d] = nx;
    if (nx >= 0) prev[nx] = p;
  };
  // Eliminated vertices stay in their neighbours' lists and are skipped (live[] counts the rest),
  // which keeps every list in first-insertion order without shifting it on each removal.
  const compact = (u: number): number[] => {
    const list = adjacency[u] as number[];
    if (list.length <= 2 * (live[u] as number)) return list;
    const kept = list.filter((w) => eliminated[w] === 0);
    adjacency[u] = kept;
    return kept;
  };
  for (let v = n - 1; v >= 0; v--) {
    const d = (adjacency[v] as number[]).length;
    live[v] = d;
    insert(v, Math.min(n, d));
  }

  let stamp = 0;
  let minDegree = 0;
  const neighbours = new Int32Array(n);
  for (let step = 0; step < n; step++) {
    while (minDegree <= n && (head[minDegree] as number) < 0) minDegree++;
    const v = minDegree <= n ? (head[minDegree] as number) : -1;
    if (v < 0) throw new Error("minimumDegreeOrder: bucket structure corrupted");
    remove(v);
    order[step] = v;
    eliminated[v] = 1;
    let count = 0;
    for (const u of adjacency[v] as number[]) if (eliminated[u] === 0) neighbours[count++] = u;
    adjacency[v] = [];
    for (let a = 0; a < count; a++) { const u = neighbours[a] as number; live[u] = (live[u] as number) - 1; }
    // Eliminating v joins its neighbours into a clique (the fill the LU will create).
    for (let a = 0; a + 1 < count; a++) {
      const u = neighbours[a] as number;
      const listU = compact(u);
      // Is w already adjacent to u? Mark u's list, or look for u in the (shorter) lists of the candidates.
      let candidatesLength = 0;
      for (let b = a + 1; b < count; b++) candidatesLength += (adjacency[neighbours[b] as number] as number[]).length;
      const markU = listU.length <= candidatesLength;
      if (markU) {
        stamp++;
        for (const x of listU) mark[x] = stamp;
      }
      for (let b = a + 1; b < count; b++) {
        const w = neighbours[b] as number;
        const listW = adjacency[w] as number[];
        if (markU ? mark[w] === stamp : listW.includes(u)) continue;
        listU.push(w);
        live[u] = (live[u] as number) + 1;
        listW.push(u);
        live[w] = (live[w] as number) + 1;
      }
    }
    for (let a = 0; a < count; a++) {
      const u = neighbours[a] as number;
      remove(u);
      const d = Math.min(n, live[u] as number);
      insert(u, d);
      if (d < minDegree) minDegree = d;
    }
  }
  return order;
}
