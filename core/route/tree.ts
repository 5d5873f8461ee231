// Tree clean-up shared by the Steiner heuristics: minimum spanning tree (Kruskal) over the
// subgraph induced by a vertex set, then repeated removal of non-terminal leaves.

import type { Graph } from './graph';

/** Scratch buffers reused across calls on one graph. */
export class TreeScratch {
  readonly mark: Uint8Array;
  readonly parent: Int32Array;
  readonly deg: Int32Array;
  readonly stamp: Int32Array;
  constructor(readonly g: Graph) {
    this.mark = new Uint8Array(g.n);
    this.parent = new Int32Array(g.n);
    this.deg = new Int32Array(g.n);
    this.stamp = new Int32Array(g.n);
  }
}

function find(parent: Int32Array, x: number): number {
  while (parent[x] !== x) {
    parent[x] = parent[parent[x]];
    x = parent[x];
  }
  return x;
}

/**
 * MST over the subgraph induced by `nodes` (ties by edge id), then prunes non-terminal leaves.
 * Returns the edge ids of the resulting tree (a forest if the induced subgraph is disconnected).
 */
export function mstPrune(g: Graph, nodes: ArrayLike<number>, isTerminal: Uint8Array, s: TreeScratch): Int32Array {
  const { mark, parent } = s;
  const k = nodes.length;
  for (let i = 0; i < k; i++) {
    mark[nodes[i]] = 1;
    parent[nodes[i]] = nodes[i];
  }
  const cand: number[] = [];
  for (let i = 0; i < k; i++) {
    const u = nodes[i];
    for (let j = g.offsets[u]; j < g.offsets[u + 1]; j++) {
      const v = g.adj[j];
      // each edge once: from its lower endpoint (self-loops skipped)
      if (mark[v] && u < v) cand.push(g.adjEdge[j]);
    }
  }
  const w = g.weight;
  cand.sort((a, b) => w[a] - w[b] || a - b);
  const chosen: number[] = [];
  for (const e of cand) {
    const ru = find(parent, g.edgeU[e]);
    const rv = find(parent, g.edgeV[e]);
    if (ru === rv) continue;
    parent[ru] = rv;
    chosen.push(e);
    if (chosen.length === k - 1) break;
  }
  for (let i = 0; i < k; i++) mark[nodes[i]] = 0;
  return pruneLeaves(g, Int32Array.from(chosen), isTerminal, s);
}

/** Removes non-terminal leaves until none is left; returns the remaining edge ids (input order kept). */
export function pruneLeaves(g: Graph, edges: Int32Array, isTerminal: Uint8Array, s: TreeScratch): Int32Array {
  const { deg } = s;
  const eu = g.edgeU;
  const ev = g.edgeV;
  for (let i = 0; i < edges.length; i++) {
    deg[eu[edges[i]]]++;
    deg[ev[edges[i]]]++;
  }
  // incidence lists of the tree, local to this call
  const nodeList: number[] = [];
  for (let i = 0; i < edges.length; i++) {
    for (const x of [eu[edges[i]], ev[edges[i]]]) {
      if (s.stamp[x] === 0) {
        s.stamp[x] = 1;
        nodeList.push(x);
      }
    }
  }
  const incident = new Map<number, number[]>();
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i];
    for (const x of [eu[e], ev[e]]) {
      let l = incident.get(x);
      if (!l) incident.set(x, (l = []));
      l.push(i);
    }
  }
  const removed = new Uint8Array(edges.length);
  const stack: number[] = [];
  for (const x of nodeList) if (deg[x] === 1 && !isTerminal[x]) stack.push(x);
  while (stack.length > 0) {
    const x = stack.pop()!;
    if (deg[x] !== 1 || isTerminal[x]) continue;
    for (const i of incident.get(x)!) {
      if (removed[i]) continue;
      removed[i] = 1;
      const e = edges[i];
      const y = eu[e] === x ? ev[e] : eu[e];
      deg[x]--;
      deg[y]--;
      if (deg[y] === 1 && !isTerminal[y]) stack.push(y);
      break;
    }
  }
  for (const x of nodeList) {
    deg[x] = 0;
    s.stamp[x] = 0;
  }
  let kept = 0;
  for (let i = 0; i < edges.length; i++) if (!removed[i]) kept++;
  const out = new Int32Array(kept);
  kept = 0;
  for (let i = 0; i < edges.length; i++) if (!removed[i]) out[kept++] = edges[i];
  return out;
}

/** Distinct vertices touched by the edges (order of first appearance), or [single] for an empty tree. */
export function treeVertices(g: Graph, edges: ArrayLike<number>, s: TreeScratch): number[] {
  const out: number[] = [];
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i];
    for (const x of [g.edgeU[e], g.edgeV[e]]) {
      if (!s.mark[x]) {
        s.mark[x] = 1;
        out.push(x);
      }
    }
  }
  for (const x of out) s.mark[x] = 0;
  return out;
}
