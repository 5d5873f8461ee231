// Wong's dual ascent: valid lower bounds (never above the exact optimum from Dreyfus–Wagner)
// and the closed form for two terminals, where the cut relaxation is tight and the bound
// equals the shortest-path distance (here the Manhattan distance on a unit grid).
import { describe, expect, it } from 'vitest';
import { dualAscent } from '../../../core/route/dualAscent';
import { steinerExact } from '../../../core/route/exact';
import { buildGraph } from '../../../core/route/graph';
import { gridWithHoles, pickTerminals, randomGraph } from './fixtures';

describe('dualAscent', () => {
  it('equals the Manhattan distance for two terminals on a unit grid (closed form)', () => {
    const W = 12;
    const H = 9;
    const u: number[] = [];
    const v: number[] = [];
    for (let y = 0; y < H; y++)
      for (let x = 0; x < W; x++) {
        const i = y * W + x;
        if (x + 1 < W) { u.push(i); v.push(i + 1); }
        if (y + 1 < H) { u.push(i); v.push(i + W); }
      }
    const g = buildGraph(W * H, u, v, u.map(() => 1));
    expect(dualAscent(g, [2 * W + 1, 7 * W + 10], 2 * W + 1).lowerBound).toBe(5 + 9);
    expect(dualAscent(g, [2 * W + 1, 7 * W + 10], 7 * W + 10).lowerBound).toBe(5 + 9);
  });

  it('never exceeds the exact optimum (random graphs and grids with holes)', () => {
    for (let seed = 1; seed <= 30; seed++) {
      const g = seed % 2 ? randomGraph(seed, 60, 120, 15) : gridWithHoles(seed, 15, 15, 3, 9).g;
      const nodes = seed % 2 ? Array.from({ length: g.n }, (_, i) => i) : gridWithHoles(seed, 15, 15, 3, 9).free;
      const terms = pickTerminals(seed, nodes, 3 + (seed % 7));
      const ex = steinerExact(g, terms)!;
      for (const root of [terms[0], terms[terms.length - 1]]) {
        const da = dualAscent(g, terms, root);
        expect(da.complete).toBe(true);
        expect(da.lowerBound).toBeLessThanOrEqual(ex.cost + 1e-9);
        expect(da.lowerBound).toBeGreaterThan(0);
        for (const r of da.reducedCost) expect(r).toBeGreaterThanOrEqual(0);
      }
    }
  });

  it('stopped early by the work budget, the bound stays valid (below the full bound and the exact optimum)', () => {
    const { g, free } = gridWithHoles(7, 30, 30, 4, 9);
    const terms = pickTerminals(7, free, 8);
    const ex = steinerExact(g, terms)!;
    const full = dualAscent(g, terms, terms[0]);
    expect(full.complete).toBe(true);
    for (const budget of [5, 100, 1000, full.work / 2]) {
      const da = dualAscent(g, terms, terms[0], () => false, budget);
      expect(da.complete).toBe(false);
      expect(da.lowerBound).toBeLessThanOrEqual(full.lowerBound + 1e-9);
      expect(da.lowerBound).toBeLessThanOrEqual(ex.cost + 1e-9);
      for (const r of da.reducedCost) expect(r).toBeGreaterThanOrEqual(0);
    }
  });
});
