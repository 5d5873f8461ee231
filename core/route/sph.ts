// Shortest-path heuristic for the Steiner tree problem in graphs (Takahashi & Matsuyama,
// "An approximate solution for the Steiner problem in graphs", Math. Japonica 24, 1980):
// grow a tree from a root, each step joining the nearest terminal by a shortest path.
// The distances to the tree are kept across steps: joining a path re-seeds Dijkstra from the
// new tree vertices at distance 0, and only the vertices that get closer are revisited.

import type { Graph } from './graph';
import { Cancelled } from '../result';
import { IndexedHeap } from './heap';

/** Buffers for repeated SPH runs on one graph. */
export class SphWorkspace {
  readonly dist: Float64Array;
  readonly predEdge: Int32Array;
  readonly inTree: Uint8Array;
  readonly heap: IndexedHeap;
  constructor(readonly n: number) {
    this.dist = new Float64Array(n);
    this.predEdge = new Int32Array(n);
    this.inTree = new Uint8Array(n);
    this.heap = new IndexedHeap(n);
  }
}

/**
 * Runs SPH from `root` (any vertex; usually a terminal). `isTerminal` marks terminals.
 * Returns the tree's edge ids, or null when some terminal is unreachable from the root.
 * `aborted`, when given, is polled every 1024 steps; the run then throws Cancelled.
 */
export function shortestPathHeuristic(
  g: Graph,
  terminals: ArrayLike<number>,
  isTerminal: Uint8Array,
  root: number,
  ws: SphWorkspace,
  aborted?: () => boolean,
): Int32Array | null {
  const { dist, predEdge, inTree, heap } = ws;
  const { offsets, adj, adjEdge, weight, edgeU, edgeV } = g;
  dist.fill(Infinity);
  predEdge.fill(-1);
  inTree.fill(0);
  heap.clear();
  // terminals may repeat; count the distinct ones still to join
  let remaining = 0;
  for (let i = 0; i < terminals.length; i++) {
    const t = terminals[i];
    if (t !== root && inTree[t] === 0) {
      inTree[t] = 2; // temporary "counted" mark
      remaining++;
    }
  }
  for (let i = 0; i < terminals.length; i++) inTree[terminals[i]] = 0;
  const treeEdges: number[] = [];
  inTree[root] = 1;
  dist[root] = 0;
  heap.push(root, 0);
  let steps = 0;
  while (remaining > 0) {
    if (heap.size === 0) return null;
    if (aborted && (++steps & 1023) === 0 && aborted()) throw new Cancelled();
    const u = heap.pop();
    const du = dist[u];
    if (isTerminal[u] && !inTree[u]) {
      // join the path u -> tree; its vertices become sources at distance 0
      let x = u;
      let guard = 0;
      while (!inTree[x]) {
        if (++guard > g.n) throw new Error('shortestPathHeuristic: predecessor cycle');
        inTree[x] = 1;
        dist[x] = 0;
        heap.push(x, 0);
        const e = predEdge[x];
        treeEdges.push(e);
        x = edgeU[e] === x ? edgeV[e] : edgeU[e];
      }
      remaining--;
      continue;
    }
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = adj[i];
      const nd = du + weight[adjEdge[i]];
      if (nd < dist[v]) {
        dist[v] = nd;
        predEdge[v] = adjEdge[i];
        heap.push(v, nd);
      }
    }
  }
  return Int32Array.from(treeEdges);
}
