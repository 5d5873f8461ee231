// Compact undirected weighted graph in CSR form (compressed sparse rows on typed arrays).
// Parallel edges are kept as given (each keeps its own edge id, so callers can map ids back);
// the algorithms here naturally prefer the lightest one. Self-loops are kept in the edge list
// but never help a tree, so the solvers ignore them.

export interface Graph {
  n: number;
  m: number;
  /** n+1 offsets into adj/adjEdge. */
  offsets: Int32Array;
  /** 2m neighbour ids. */
  adj: Int32Array;
  /** 2m edge ids, parallel to adj. */
  adjEdge: Int32Array;
  edgeU: Int32Array;
  edgeV: Int32Array;
  /** m non-negative edge weights. */
  weight: Float64Array;
}

/** Builds a CSR graph; nodes are 0..n-1, weights must be finite and >= 0. Neighbour order is by edge id. */
export function buildGraph(n: number, edgeU: ArrayLike<number>, edgeV: ArrayLike<number>, weight: ArrayLike<number>): Graph {
  const m = edgeU.length;
  if (edgeV.length !== m || weight.length !== m) {
    throw new Error(`buildGraph: edgeU (${m}), edgeV (${edgeV.length}) and weight (${weight.length}) lengths differ`);
  }
  if (!Number.isInteger(n) || n < 0) throw new Error(`buildGraph: bad node count ${n}`);
  const eu = new Int32Array(m);
  const ev = new Int32Array(m);
  const w = new Float64Array(m);
  const deg = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    const u = edgeU[e];
    const v = edgeV[e];
    const c = weight[e];
    if (!(u >= 0 && u < n && v >= 0 && v < n) || !Number.isInteger(u) || !Number.isInteger(v)) {
      throw new Error(`buildGraph: edge ${e} has endpoint out of range (${u}, ${v}) for n=${n}`);
    }
    if (!(c >= 0) || !Number.isFinite(c)) throw new Error(`buildGraph: edge ${e} has bad weight ${c}`);
    eu[e] = u;
    ev[e] = v;
    w[e] = c;
    deg[u]++;
    deg[v]++;
  }
  const offsets = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) offsets[i + 1] = offsets[i] + deg[i];
  const fill = offsets.slice(0, n);
  const adj = new Int32Array(2 * m);
  const adjEdge = new Int32Array(2 * m);
  for (let e = 0; e < m; e++) {
    const u = eu[e];
    const v = ev[e];
    adj[fill[u]] = v;
    adjEdge[fill[u]++] = e;
    adj[fill[v]] = u;
    adjEdge[fill[v]++] = e;
  }
  return { n, m, offsets, adj, adjEdge, edgeU: eu, edgeV: ev, weight: w };
}

/** Same topology with other weights (used for perturbation); shares the structure arrays. */
export function withWeights(g: Graph, weight: Float64Array): Graph {
  if (weight.length !== g.m) throw new Error(`withWeights: ${weight.length} weights for ${g.m} edges`);
  return { ...g, weight };
}

/** Connected component label of every node (labels 0..k-1 in order of the lowest node id). */
export function componentOf(g: Graph): Int32Array {
  const comp = new Int32Array(g.n).fill(-1);
  const stack = new Int32Array(g.n);
  let label = 0;
  for (let s = 0; s < g.n; s++) {
    if (comp[s] !== -1) continue;
    let top = 0;
    stack[top++] = s;
    comp[s] = label;
    while (top > 0) {
      const u = stack[--top];
      for (let i = g.offsets[u]; i < g.offsets[u + 1]; i++) {
        const v = g.adj[i];
        if (comp[v] === -1) {
          comp[v] = label;
          stack[top++] = v;
        }
      }
    }
    label++;
  }
  return comp;
}

/**
 * Splits terminals by reachability: `reachable` are those in the component holding the most
 * terminals (ties: the component of the earliest such terminal); `unreachable` the rest.
 * Duplicates are dropped, first occurrence kept.
 */
export function splitReachableTerminals(g: Graph, terminals: ArrayLike<number>): { reachable: number[]; unreachable: number[] } {
  const comp = componentOf(g);
  const count = new Map<number, number>();
  const seen = new Set<number>();
  const uniq: number[] = [];
  for (let i = 0; i < terminals.length; i++) {
    const t = terminals[i];
    if (seen.has(t)) continue;
    seen.add(t);
    uniq.push(t);
    count.set(comp[t], (count.get(comp[t]) ?? 0) + 1);
  }
  let best = -1;
  let bestCount = 0;
  for (const t of uniq) {
    const c = count.get(comp[t]) ?? 0;
    if (c > bestCount) {
      bestCount = c;
      best = comp[t];
    }
  }
  const reachable: number[] = [];
  const unreachable: number[] = [];
  for (const t of uniq) (comp[t] === best ? reachable : unreachable).push(t);
  return { reachable, unreachable };
}

/** Sum of weights of the given edge ids. */
export function edgeCost(g: Graph, edges: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < edges.length; i++) s += g.weight[edges[i]];
  return s;
}
