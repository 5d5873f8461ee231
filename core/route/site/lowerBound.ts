// A lower bound on the cheapest tree for the routing grid, from one multi-source Dijkstra
// (the Voronoi regions of the terminals, as in Mehlhorn 1988, "A faster approximation
// algorithm for the Steiner problem in graphs"), computed without bend costs — dropping a
// non-negative cost can only lower the optimum, so the bound holds for the priced problem.
// Two bounds, the larger is reported:
//  1. Σ over terminals of the distance to the nearest other terminal, halved: a doubled tree
//     is a closed walk visiting every terminal, at least that sum long.
//  2. The terminal-distance MST divided by 2(1 − 1/k): the MST heuristic is within that factor
//     of the optimum (Takahashi & Matsuyama 1980; Kou, Markowsky & Berman 1981). Mehlhorn shows
//     the MST over Voronoi boundary edges equals the distance-graph MST.

import { DX, DY, moveCost, styleMask, type RoutingGrid } from './routingGrid';
import { BucketQueue } from './bucketQueue';

export interface BoundResult {
  lowerBound: number;
  /** Mehlhorn's MST weight (a tree of that cost exists in the plain grid). */
  mstCost: number;
  /** The MST over terminal nodes as [nodeA, nodeB, cost] (Voronoi boundary distances). */
  mstEdges: [number, number, number][];
}

export function voronoiBound(g: RoutingGrid, terminalNodes: readonly number[]): BoundResult {
  const nodes = [...new Set(terminalNodes)].sort((a, b) => a - b);
  const k = nodes.length;
  if (k <= 1) return { lowerBound: 0, mstCost: 0, mstEdges: [] };
  const n = g.n;
  const dist = new Float64Array(n).fill(Infinity);
  const src = new Int32Array(n).fill(-1);
  const heap = new BucketQueue();
  heap.reset(0.999 * g.h * Math.min(1, g.params.pavementFactor));
  nodes.forEach((v, i) => { dist[v] = 0; src[v] = i; heap.push(0, v); });
  const mask = styleMask(g.params.style);
  const off = new Int32Array(8);
  for (let d = 0; d < 8; d++) off[d] = DX[d] + DY[d] * g.nx;
  for (;;) {
    const v = heap.pop();
    if (v < 0) break;
    const kv = heap.lastKey;
    if (kv > dist[v]) continue;
    const bits = g.moves[v] & mask;
    for (let d = 0; d < 8; d++) {
      if (!((bits >> d) & 1)) continue;
      const u = v + off[d];
      const nk = kv + moveCost(g, v, d);
      if (nk < dist[u] || (nk === dist[u] && src[v] < src[u])) {
        dist[u] = nk;
        src[u] = src[v];
        heap.push(nk, u);
      }
    }
  }
  const nearest = new Float64Array(k).fill(Infinity);
  const pair = new Map<number, number>();
  for (let v = 0; v < n; v++) {
    if (src[v] < 0) continue;
    const bits = g.moves[v] & mask;
    for (let d = 0; d < 4; d++) {
      if (!((bits >> d) & 1)) continue;
      const u = v + off[d];
      const a = src[v], b = src[u];
      if (b < 0 || a === b) continue;
      const c = dist[v] + moveCost(g, v, d) + dist[u];
      if (c < nearest[a]) nearest[a] = c;
      if (c < nearest[b]) nearest[b] = c;
      const key = a < b ? a * k + b : b * k + a;
      const old = pair.get(key);
      if (old === undefined || c < old) pair.set(key, c);
    }
  }
  let sumNearest = 0;
  for (let i = 0; i < k; i++) if (Number.isFinite(nearest[i])) sumNearest += nearest[i];
  // Kruskal over the Voronoi boundary pairs.
  const edges = [...pair.entries()].sort((x, y) => x[1] - y[1] || x[0] - y[0]);
  const parent = Int32Array.from({ length: k }, (_, i) => i);
  const find = (x: number): number => { while (parent[x] !== x) { parent[x] = parent[parent[x]]; x = parent[x]; } return x; };
  let mst = 0;
  const mstEdges: [number, number, number][] = [];
  for (const [key, c] of edges) {
    const i = Math.floor(key / k), j = key % k;
    const a = find(i), b = find(j);
    if (a === b) continue;
    parent[a] = b;
    mst += c;
    mstEdges.push([nodes[i], nodes[j], c]);
  }
  const lowerBound = Math.max(sumNearest / 2, mst / (2 * (1 - 1 / k)));
  return { lowerBound, mstCost: mst, mstEdges };
}
