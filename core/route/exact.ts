// Exact Steiner tree for few terminals by the Dreyfus–Wagner dynamic program (S. E. Dreyfus and
// R. A. Wagner, "The Steiner problem in graphs", Networks 1, 1971), in the form that runs one
// Dijkstra per terminal subset (Erickson, Monma & Veinott, 1987):
//   cost[S][v] = min( min over splits S = A + B of cost[A][v] + cost[B][v],
//                     min over neighbours u of cost[S][u] + w(u, v) ).
// One terminal is the root and subsets range over the others: O(3^k n + 2^k (m + n log n)).

import type { Graph } from './graph';
import { IndexedHeap } from './heap';
import { mstPrune, TreeScratch, treeVertices } from './tree';

/** Default cap on 2^(k-1) * n table entries (12 bytes each). */
export const EXACT_DEFAULT_MAX_STATES = 1 << 22;

export interface ExactResult {
  edges: Int32Array;
  cost: number;
}

/** Rough operation count of steinerExact (split merges plus one Dijkstra per subset). */
export function exactWork(n: number, m: number, k: number): number {
  if (k <= 1) return 0;
  return (3 ** (k - 1) / 2) * n + 2 ** (k - 1) * (2 * m + n * Math.log2(n + 2));
}

/** True when the table for `k` distinct terminals on `n` nodes stays within `maxStates` entries. */
export function exactFits(n: number, k: number, maxStates = EXACT_DEFAULT_MAX_STATES): boolean {
  if (k <= 1) return true;
  return k - 1 <= 30 && 2 ** (k - 1) * n <= maxStates;
}

/**
 * Optimal Steiner tree. Terminals must be distinct and connected. Returns null when the table
 * would exceed `maxStates`, or when `signal` is aborted or `stop()` turns true during the run.
 */
export function steinerExact(
  g: Graph,
  terminals: ArrayLike<number>,
  opts: { maxStates?: number; signal?: { readonly aborted: boolean }; stop?: () => boolean } = {},
): ExactResult | null {
  const k = terminals.length;
  const n = g.n;
  if (k <= 1) return { edges: new Int32Array(0), cost: 0 };
  if (!exactFits(n, k, opts.maxStates)) return null;
  const q = k - 1;
  const root = terminals[q];
  const full = (1 << q) - 1;
  const cost = new Float64Array((full + 1) * n).fill(Infinity);
  const trace = new Int32Array((full + 1) * n); // >0: edge id + 1 from the other end; <0: -split; 0: source
  const heap = new IndexedHeap(n);
  const { offsets, adj, adjEdge, weight } = g;

  const dijkstra = (base: number) => {
    heap.clear();
    for (let v = 0; v < n; v++) if (cost[base + v] < Infinity) heap.push(v, cost[base + v]);
    while (heap.size > 0) {
      const u = heap.pop();
      const du = cost[base + u];
      for (let j = offsets[u]; j < offsets[u + 1]; j++) {
        const v = adj[j];
        const nd = du + weight[adjEdge[j]];
        if (nd < cost[base + v]) {
          cost[base + v] = nd;
          trace[base + v] = adjEdge[j] + 1;
          heap.push(v, nd);
        }
      }
    }
  };

  for (let i = 0; i < q; i++) {
    const base = (1 << i) * n;
    cost[base + terminals[i]] = 0;
    trace[base + terminals[i]] = 0;
    dijkstra(base);
  }
  for (let S = 1; S <= full; S++) {
    if ((S & (S - 1)) === 0) continue; // singletons done
    if (opts.signal?.aborted || opts.stop?.()) return null;
    const base = S * n;
    const low = S & -S;
    for (let A = (S - 1) & S; A > 0; A = (A - 1) & S) {
      if ((A & low) === 0) continue; // each unordered split once
      const a = A * n;
      const b = (S ^ A) * n;
      for (let v = 0; v < n; v++) {
        const c = cost[a + v] + cost[b + v];
        if (c < cost[base + v]) {
          cost[base + v] = c;
          trace[base + v] = -A;
        }
      }
    }
    dijkstra(base);
  }

  // rebuild the tree from the traces
  const picked = new Uint8Array(g.m);
  const chosen: number[] = [];
  const stackS: number[] = [full];
  const stackV: number[] = [root];
  while (stackS.length > 0) {
    let S = stackS.pop()!;
    let v = stackV.pop()!;
    for (;;) {
      const t = trace[S * n + v];
      if (t > 0) {
        const e = t - 1;
        if (!picked[e]) {
          picked[e] = 1;
          chosen.push(e);
        }
        v = g.edgeU[e] === v ? g.edgeV[e] : g.edgeU[e];
      } else if (t < 0) {
        const A = -t;
        stackS.push(S ^ A);
        stackV.push(v);
        S = A;
      } else break;
    }
  }
  const isTerminal = new Uint8Array(n);
  for (let i = 0; i < k; i++) isTerminal[terminals[i]] = 1;
  const scratch = new TreeScratch(g);
  const edges = chosen.length > 0 ? mstPrune(g, treeVertices(g, chosen, scratch), isTerminal, scratch) : new Int32Array(0);
  let c = 0;
  for (const e of edges) c += weight[e];
  return { edges, cost: c };
}
