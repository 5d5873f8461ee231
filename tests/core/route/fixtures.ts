// Shared test fixtures for the Steiner engine: seeded random graphs, grids with holes, a brute
// force oracle over edge subsets, and a tree-validity check.
import { buildGraph, componentOf, type Graph } from '../../../core/route/graph';
import { makeRng } from '../../../core/route/rng';

export function randomGraph(seed: number, n: number, extraEdges: number, maxW: number): Graph {
  const rnd = makeRng(seed);
  const u: number[] = [];
  const v: number[] = [];
  const w: number[] = [];
  for (let i = 1; i < n; i++) {
    u.push(Math.floor(rnd() * i));
    v.push(i);
    w.push(1 + Math.floor(rnd() * maxW));
  }
  for (let k = 0; k < extraEdges; k++) {
    const a = Math.floor(rnd() * n);
    const b = Math.floor(rnd() * n);
    if (a === b) continue;
    u.push(a);
    v.push(b);
    w.push(1 + Math.floor(rnd() * maxW));
  }
  return buildGraph(n, u, v, w);
}

/** W x H grid, weights 1..maxW, with `holes` random rectangles whose nodes lose all edges. */
export function gridWithHoles(seed: number, W: number, H: number, holes: number, maxW: number): { g: Graph; free: number[] } {
  const rnd = makeRng(seed);
  const blocked = new Uint8Array(W * H);
  for (let h = 0; h < holes; h++) {
    const x0 = Math.floor(rnd() * W);
    const y0 = Math.floor(rnd() * H);
    const hw = 1 + Math.floor(rnd() * Math.max(1, W / 4));
    const hh = 1 + Math.floor(rnd() * Math.max(1, H / 4));
    for (let y = y0; y < Math.min(H, y0 + hh); y++) for (let x = x0; x < Math.min(W, x0 + hw); x++) blocked[y * W + x] = 1;
  }
  const u: number[] = [];
  const v: number[] = [];
  const w: number[] = [];
  for (let y = 0; y < H; y++)
    for (let x = 0; x < W; x++) {
      const i = y * W + x;
      if (blocked[i]) continue;
      if (x + 1 < W && !blocked[i + 1]) { u.push(i); v.push(i + 1); w.push(1 + Math.floor(rnd() * maxW)); }
      if (y + 1 < H && !blocked[i + W]) { u.push(i); v.push(i + W); w.push(1 + Math.floor(rnd() * maxW)); }
    }
  const g = buildGraph(W * H, u, v, w);
  // free nodes of the largest component
  const comp = componentOf(g);
  const size = new Map<number, number>();
  for (let i = 0; i < g.n; i++) if (!blocked[i]) size.set(comp[i], (size.get(comp[i]) ?? 0) + 1);
  let big = -1;
  let bigSize = 0;
  for (const [c, s] of size) if (s > bigSize) { big = c; bigSize = s; }
  const free: number[] = [];
  for (let i = 0; i < g.n; i++) if (!blocked[i] && comp[i] === big) free.push(i);
  return { g, free };
}

export function pickTerminals(seed: number, from: number[], k: number): number[] {
  const rnd = makeRng(seed);
  const pool = [...from];
  const out: number[] = [];
  for (let i = 0; i < k && pool.length > 0; i++) out.push(pool.splice(Math.floor(rnd() * pool.length), 1)[0]);
  return out;
}

/** Brute force: least total weight of an edge subset connecting all terminals (m <= ~18). */
export function bruteForceSteiner(g: Graph, terminals: number[]): number {
  if (g.m > 20) throw new Error('bruteForceSteiner: too many edges');
  let best = Infinity;
  const parent = new Int32Array(g.n);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x])));
  for (let mask = 0; mask < 1 << g.m; mask++) {
    let c = 0;
    for (let e = 0; e < g.m; e++) if (mask & (1 << e)) c += g.weight[e];
    if (c >= best) continue;
    for (let i = 0; i < g.n; i++) parent[i] = i;
    for (let e = 0; e < g.m; e++) if (mask & (1 << e)) parent[find(g.edgeU[e])] = find(g.edgeV[e]);
    const r = find(terminals[0]);
    if (terminals.every((t) => find(t) === r)) best = c;
  }
  return best;
}

/** True when `edges` form a tree (no cycle) that connects every terminal, and sum to `cost`. */
export function isSteinerTree(g: Graph, edges: ArrayLike<number>, terminals: number[], cost: number): boolean {
  const parent = Array.from({ length: g.n }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x])));
  let sum = 0;
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i];
    sum += g.weight[e];
    const a = find(g.edgeU[e]);
    const b = find(g.edgeV[e]);
    if (a === b) return false;
    parent[a] = b;
  }
  if (Math.abs(sum - cost) > 1e-9 * Math.max(1, cost)) return false;
  return terminals.every((t) => find(t) === find(terminals[0]));
}
