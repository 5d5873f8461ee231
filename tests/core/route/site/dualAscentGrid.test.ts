// Dual ascent on the routing grid (Wong 1984) against independent references:
//  - the exact optimum of the same grid graph from the Dreyfus–Wagner solver (core/route/exact.ts,
//    itself checked against brute force): the bound may never exceed it;
//  - closed forms: for two terminals the cut relaxation is tight, so the bound equals the
//    shortest-path distance (rectilinear distance on a unit orthogonal grid, octile distance
//    dx + dy + (√2 − 2)·min(dx, dy) on an 8-neighbour grid: elementary geometry);
//  - a real site grid (buildings, pavement, crossing lines) with its exact optimum, and the
//    routed tree's plain cost (any tree costs at least the optimum).
import { describe, expect, it } from 'vitest';
import { steinerExact } from '../../../../core/route/exact';
import { buildGraph, componentOf, type Graph } from '../../../../core/route/graph';
import { makeRng } from '../../../../core/route/rng';
import { gridDualAscent } from '../../../../core/route/site/dualAscentGrid';
import { buildRoutingGrid, DX, DY, styleMask, type RoutingGrid } from '../../../../core/route/site/routingGrid';
import { voronoiBound } from '../../../../core/route/site/lowerBound';
import { gridParams, routeSiteDetailed } from '../../../../core/route/site/routeSite';
import { building, connection, line, makeSite, rect, settings } from './siteFixtures';

/** A W×H lattice with random free nodes and random symmetric move costs, in the router's layout. */
function randomLattice(seed: number, W: number, H: number, octilinear: boolean): RoutingGrid {
  const rnd = makeRng(seed);
  const n = W * H;
  const free = new Uint8Array(n);
  for (let v = 0; v < n; v++) free[v] = rnd() < 0.85 ? 1 : 0;
  const moves = new Uint8Array(n), cost = new Float32Array(n * 8);
  for (let v = 0; v < n; v++) {
    if (!free[v]) continue;
    const x = v % W, y = Math.floor(v / W);
    for (let d = 0; d < 4; d++) {
      if (!octilinear && d % 2) continue;
      const xx = x + DX[d], yy = y + DY[d];
      if (xx < 0 || xx >= W || yy >= H) continue;
      const u = yy * W + xx;
      if (!free[u]) continue;
      // length × a surface factor 1..3, sometimes a crossing penalty on top
      const c = Math.fround((d % 2 ? Math.SQRT2 : 1) * (1 + Math.floor(rnd() * 3)) + (rnd() < 0.1 ? 2.5 : 0));
      moves[v] |= 1 << d;
      moves[u] |= 1 << (d + 4);
      cost[v * 8 + d] = c;
      cost[u * 8 + d + 4] = c;
    }
  }
  const params = { cell: 1, clearance: 0, pavementFactor: 1, crossingPenalty: 0, bendPenalty: 0, style: octilinear ? 'octilinear' : 'orthogonal' } as const;
  return { params, x0: 0, y0: 0, h: 1, nx: W, ny: H, n, free, moves, cost } as unknown as RoutingGrid;
}

/** The grid's moves as an undirected graph with each grid edge's cost (as the tree's cost counts it). */
function asGraph(g: RoutingGrid): Graph {
  const mask = styleMask(g.params.style);
  const u: number[] = [], v: number[] = [], w: number[] = [];
  for (let a = 0; a < g.n; a++) {
    for (let d = 0; d < 4; d++) {
      if (!(((g.moves[a] & mask) >> d) & 1)) continue;
      u.push(a);
      v.push(a + DX[d] + DY[d] * g.nx);
      w.push(g.cost[a * 8 + d]);
    }
  }
  return buildGraph(g.n, u, v, w);
}

function pickInBiggest(g: Graph, seed: number, k: number): number[] {
  const comp = componentOf(g);
  const count = new Map<number, number>();
  for (let v = 0; v < g.n; v++) if (g.offsets[v + 1] > g.offsets[v]) count.set(comp[v], (count.get(comp[v]) ?? 0) + 1);
  let big = -1, size = 0;
  for (const [c, s] of count) if (s > size) { size = s; big = c; }
  const cand: number[] = [];
  for (let v = 0; v < g.n; v++) if (comp[v] === big && g.offsets[v + 1] > g.offsets[v]) cand.push(v);
  const rnd = makeRng(seed * 31 + 7);
  const out: number[] = [];
  while (out.length < Math.min(k, cand.length)) {
    const t = cand[Math.floor(rnd() * cand.length)];
    if (!out.includes(t)) out.push(t);
  }
  return out;
}

describe('gridDualAscent', () => {
  it('never exceeds the exact optimum on 200 random lattices with holes (Dreyfus–Wagner oracle), from every root', () => {
    let sumRatio = 0, cases = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const W = 6 + (seed % 6), H = 5 + ((seed * 7) % 6);
      const g = randomLattice(seed, W, H, seed % 2 === 0);
      const graph = asGraph(g);
      const terms = pickInBiggest(graph, seed, 2 + (seed % 6));
      if (terms.length < 2) continue;
      const ex = steinerExact(graph, terms)!;
      for (const root of terms) {
        const r = gridDualAscent(g, terms, root);
        expect(r.complete).toBe(true);
        expect(r.lowerBound, `seed ${seed} root ${root}`).toBeLessThanOrEqual(ex.cost * (1 + 1e-12));
        expect(r.lowerBound).toBeGreaterThan(0);
        sumRatio += r.lowerBound / ex.cost;
        cases++;
      }
    }
    // Usefulness: the bound is close to the optimum on average (measured 0.98 at writing).
    expect(sumRatio / cases).toBeGreaterThan(0.95);
  });

  it('stopped early by the work budget, the bound is still valid and not above the full one', () => {
    const g = randomLattice(99, 40, 30, true);
    const graph = asGraph(g);
    const terms = pickInBiggest(graph, 99, 7);
    const ex = steinerExact(graph, terms)!;
    const full = gridDualAscent(g, terms, terms[0]);
    expect(full.complete).toBe(true);
    for (const budget of [10, 200, 2000, full.work / 2]) {
      const r = gridDualAscent(g, terms, terms[0], budget);
      expect(r.complete).toBe(false);
      expect(r.lowerBound).toBeLessThanOrEqual(full.lowerBound + 1e-9);
      expect(r.lowerBound).toBeLessThanOrEqual(ex.cost);
    }
    // A stop request (the router passes its cancel signal) ends it the same way.
    const stopped = gridDualAscent(g, terms, terms[0], Infinity, undefined, () => true);
    expect(stopped.complete).toBe(false);
    expect(stopped.lowerBound).toBeLessThanOrEqual(full.lowerBound + 1e-9);
  });

  it('equals the shortest-path distance for two terminals (rectilinear and octile closed forms)', () => {
    const W = 30, H = 20;
    for (const oct of [false, true]) {
      const n = W * H;
      const moves = new Uint8Array(n), cost = new Float32Array(n * 8);
      for (let v = 0; v < n; v++) {
        const x = v % W, y = Math.floor(v / W);
        for (let d = 0; d < 4; d++) {
          if (!oct && d % 2) continue;
          const xx = x + DX[d], yy = y + DY[d];
          if (xx < 0 || xx >= W || yy >= H) continue;
          const u = yy * W + xx;
          moves[v] |= 1 << d;
          moves[u] |= 1 << (d + 4);
          cost[v * 8 + d] = cost[u * 8 + d + 4] = Math.fround(d % 2 ? Math.SQRT2 : 1);
        }
      }
      const g = { params: { style: oct ? 'octilinear' : 'orthogonal' }, nx: W, ny: H, n, moves, cost } as unknown as RoutingGrid;
      const a = 3 + 2 * W, b = 25 + 14 * W; // dx 22, dy 12
      const want = oct ? 22 - 12 + 12 * Math.fround(Math.SQRT2) : 22 + 12;
      expect(gridDualAscent(g, [a, b], a).lowerBound).toBeCloseTo(want, 5);
      expect(gridDualAscent(g, [a, b], b).lowerBound).toBeCloseTo(want, 5);
    }
  });

  it('on a site grid (buildings, pavement, crossings): at most the exact optimum and the routed tree, at least the Voronoi bound', () => {
    const site = makeSite({
      boundary: rect(0, 0, 30, 24),
      buildings: [building(6, 6, 12, 14), building(17, 4, 24, 10)],
      pavements: [{ outer: rect(0, 16, 30, 19), holes: [], layer: 'ROAD' }],
      crossings: [line([14, 0, 15, 24])],
    });
    const pts = [connection('A', 2, 2), connection('B', 27, 3), connection('C', 15, 22), connection('D', 4, 21), connection('E', 27, 14)];
    const route = settings({ style: 'octilinear', cellM: 1 });
    const g = buildRoutingGrid(site, gridParams(site, route));
    const d = routeSiteDetailed(site, pts, route);
    expect(d.network.unreachable).toEqual([]);
    const nodes = d.anchors.map((a) => a.node);
    const ex = steinerExact(asGraph(g), nodes)!;
    const r = gridDualAscent(g, nodes, nodes[0]);
    expect(r.lowerBound).toBeLessThanOrEqual(ex.cost * (1 + 1e-12));
    expect(r.lowerBound).toBeGreaterThan(0.9 * ex.cost);
    expect(r.lowerBound).toBeGreaterThanOrEqual(voronoiBound(g, nodes).lowerBound);
    // The router reports the larger of its bounds; it stays below the routed cost.
    expect(d.network.quality.lowerBound).toBeGreaterThanOrEqual(r.lowerBound - 1e-9);
    expect(d.network.quality.lowerBound).toBeLessThanOrEqual(d.network.quality.cost);
  });
});
