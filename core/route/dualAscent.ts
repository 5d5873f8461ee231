// Lower bound for the Steiner tree problem in graphs by dual ascent (R. T. Wong, "A dual ascent
// approach for Steiner tree problems on a directed graph", Math. Programming 28, 1984), applied
// to the bidirected graph (each edge as two arcs of the same cost) rooted at one terminal.
// For an active terminal t, W(t) is the set of vertices that reach t over arcs of zero reduced
// cost; every Steiner arborescence enters W(t), so the least reduced cost on its in-cut can be
// added to the bound and subtracted from those arcs. A terminal stops when W(t) holds the root.
// The component with the smallest in-cut is grown first (lazy priority queue).

import type { Graph } from './graph';
import { IndexedHeap } from './heap';

export interface DualAscentResult {
  lowerBound: number;
  /** Reduced cost of arc 2e (edgeU->edgeV) and 2e+1 (edgeV->edgeU) at the end. */
  reducedCost: Float64Array;
  /** False when stopped early (the bound is still valid, only weaker). */
  complete: boolean;
}

/** Dual ascent from `root` (a terminal). `stop()` may end it early; the bound stays valid. */
export function dualAscent(g: Graph, terminals: ArrayLike<number>, root: number, stop: () => boolean = () => false): DualAscentResult {
  const { n, m, offsets, adj, adjEdge, edgeV, weight } = g;
  const rc = new Float64Array(2 * m);
  let maxW = 0;
  for (let e = 0; e < m; e++) {
    rc[2 * e] = weight[e];
    rc[2 * e + 1] = weight[e];
    if (weight[e] > maxW) maxW = weight[e];
  }
  const eps = maxW * 1e-12;
  const inW = new Int32Array(n); // stamp of the last W that holds the vertex
  let stamp = 0;
  const stack = new Int32Array(n);
  const members = new Int32Array(n);
  const cutArcs: number[] = [];
  const queue = new IndexedHeap(n);
  for (let i = 0; i < terminals.length; i++) if (terminals[i] !== root) queue.push(terminals[i], 0);
  let lb = 0;
  let complete = true;
  while (queue.size > 0) {
    if (stop()) {
      complete = false;
      break;
    }
    const t = queue.pop();
    // W(t): reverse search over saturated arcs y->x
    stamp++;
    let top = 0;
    let size = 0;
    stack[top++] = t;
    inW[t] = stamp;
    let hasRoot = false;
    while (top > 0) {
      const x = stack[--top];
      members[size++] = x;
      if (x === root) {
        hasRoot = true;
        break;
      }
      for (let j = offsets[x]; j < offsets[x + 1]; j++) {
        const y = adj[j];
        if (inW[y] === stamp || y === x) continue;
        const e = adjEdge[j];
        const a = edgeV[e] === x ? 2 * e : 2 * e + 1; // arc y -> x
        if (rc[a] <= eps) {
          inW[y] = stamp;
          stack[top++] = y;
        }
      }
    }
    if (hasRoot) continue; // inactive for good: W only grows
    // in-cut of W and its least reduced cost
    cutArcs.length = 0;
    let delta = Infinity;
    for (let i = 0; i < size; i++) {
      const x = members[i];
      for (let j = offsets[x]; j < offsets[x + 1]; j++) {
        const y = adj[j];
        if (inW[y] === stamp) continue;
        const e = adjEdge[j];
        const a = edgeV[e] === x ? 2 * e : 2 * e + 1;
        cutArcs.push(a);
        if (rc[a] < delta) delta = rc[a];
      }
    }
    if (cutArcs.length === 0) throw new Error(`dualAscent: terminal ${t} cannot be reached from root ${root}`);
    // grow the component with the smallest cut first: requeue if another one is now smaller
    if (queue.size > 0 && cutArcs.length > queue.peekKey() && queue.key[t] !== cutArcs.length) {
      queue.push(t, cutArcs.length);
      continue;
    }
    lb += delta;
    for (const a of cutArcs) {
      const r = rc[a] - delta;
      rc[a] = r <= eps ? 0 : r;
    }
    queue.push(t, cutArcs.length);
  }
  return { lowerBound: lb, reducedCost: rc, complete };
}
