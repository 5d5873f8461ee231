// solveSteiner against the exact Dreyfus–Wagner optimum (itself checked against brute force in
// exact.test.ts) on random graphs and grids with holes: heuristic >= optimum >= lower bound,
// the grid target (mean gap <= 0.5 % up to 12 terminals), determinism and cancellation.
import { describe, expect, it } from 'vitest';
import { steinerExact } from '../../../core/route/exact';
import { buildGraph } from '../../../core/route/graph';
import { Cancelled } from '../../../core/result';
import { solveSteiner } from '../../../core/route/steiner';
import { gridWithHoles, isSteinerTree, pickTerminals, randomGraph } from './fixtures';

const TOL = 1e-9;

describe('solveSteiner', () => {
  it('brackets the exact optimum on 40 random sparse graphs: heuristic >= optimum >= lower bound', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const g = randomGraph(seed, 40 + seed, 60 + 2 * seed, 20);
      const terms = pickTerminals(seed, Array.from({ length: g.n }, (_, i) => i), 3 + (seed % 8));
      const ex = steinerExact(g, terms)!;
      const r = solveSteiner(g, terms, { exactMaxTerminals: 0, maxIterations: 40, timeBudgetMs: 10_000 });
      expect(isSteinerTree(g, r.edges, terms, r.cost)).toBe(true);
      expect(r.cost).toBeGreaterThanOrEqual(ex.cost - TOL);
      expect(r.lowerBound).toBeLessThanOrEqual(ex.cost + TOL);
      expect(r.gap).toBeCloseTo((r.cost - r.lowerBound) / r.cost, 12);
    }
  });

  it('is within 0.5 % of the exact optimum on average on grids with holes, 4 to 12 terminals', () => {
    let gapSum = 0;
    let cases = 0;
    for (let seed = 1; seed <= 18; seed++) {
      const { g, free } = gridWithHoles(seed, 22, 20, 5, 9);
      const k = 4 + (seed % 9);
      const terms = pickTerminals(seed + 100, free, k);
      const ex = steinerExact(g, terms, { maxStates: 1 << 22 })!;
      const r = solveSteiner(g, terms, { exactMaxTerminals: 0 });
      expect(isSteinerTree(g, r.edges, terms, r.cost)).toBe(true);
      expect(r.cost).toBeGreaterThanOrEqual(ex.cost - TOL);
      expect(r.lowerBound).toBeLessThanOrEqual(ex.cost + TOL);
      gapSum += (r.cost - ex.cost) / ex.cost;
      cases++;
    }
    expect(gapSum / cases).toBeLessThanOrEqual(0.005);
  });

  it('uses the exact solver for few terminals and reports the tree as optimal', () => {
    const { g, free } = gridWithHoles(9, 20, 20, 4, 9);
    const terms = pickTerminals(2, free, 6);
    const ex = steinerExact(g, terms)!;
    const r = solveSteiner(g, terms, { exactMaxTerminals: 8 });
    expect(r.optimal).toBe(true);
    expect(r.cost).toBe(ex.cost);
    expect(r.lowerBound).toBe(ex.cost);
    expect(r.gap).toBe(0);
  });

  it('gives the same tree for the same seed (iteration-bounded run)', () => {
    const { g, free } = gridWithHoles(11, 40, 40, 8, 9);
    const terms = pickTerminals(4, free, 25);
    const a = solveSteiner(g, terms, { seed: 7, maxIterations: 8, timeBudgetMs: 60_000, exactMaxTerminals: 0 });
    const b = solveSteiner(g, terms, { seed: 7, maxIterations: 8, timeBudgetMs: 60_000, exactMaxTerminals: 0 });
    expect(Array.from(b.edges)).toEqual(Array.from(a.edges));
    expect(b.cost).toBe(a.cost);
    expect(b.lowerBound).toBe(a.lowerBound);
  });

  it('stops within 50 ms of cancellation: the best tree so far, or Cancelled when none exists yet', () => {
    // Lateness is measured in CPU time of this process after the abort: the 2 cores are shared,
    // so wall time would also count the time the scheduler gives to other processes.
    const { g, free } = gridWithHoles(5, 200, 200, 30, 9);
    const terms = pickTerminals(8, free, 60);
    let trees = 0;
    for (const afterMs of [0, 15, 120, 1000]) {
      const abortAt = performance.now() + afterMs;
      let cpuAtAbort: NodeJS.CpuUsage | null = null;
      const signal = {
        get aborted() {
          const due = performance.now() > abortAt;
          if (due && !cpuAtAbort) cpuAtAbort = process.cpuUsage();
          return due;
        },
      };
      try {
        const r = solveSteiner(g, terms, { signal, timeBudgetMs: 60_000, maxIterations: 10_000 });
        expect(isSteinerTree(g, r.edges, terms, r.cost)).toBe(true);
        trees++;
      } catch (e) {
        expect(e).toBeInstanceOf(Cancelled);
      }
      const wallLate = performance.now() - abortAt;
      const cpu = process.cpuUsage(cpuAtAbort ?? undefined);
      const cpuLateMs = (cpu.user + cpu.system) / 1000;
      console.log(`abort after ${afterMs} ms: ${cpuLateMs.toFixed(1)} ms CPU, ${wallLate.toFixed(1)} ms wall to return`);
      expect(cpuLateMs, `abort after ${afterMs} ms`).toBeLessThan(50);
    }
    expect(trees).toBeGreaterThanOrEqual(1); // the 1 s abort comes after the first tree
  });

  it('throws Cancelled when aborted before any tree exists, on the exact and the heuristic path', () => {
    const { g, free } = gridWithHoles(6, 30, 30, 3, 9);
    const terms = pickTerminals(1, free, 8);
    expect(() => solveSteiner(g, terms, { signal: { aborted: true }, exactMaxTerminals: 8 })).toThrow(Cancelled);
    expect(() => solveSteiner(g, terms, { signal: { aborted: true }, exactMaxTerminals: 0 })).toThrow(Cancelled);
  });

  it('reports progress fractions in [0, 1] with non-increasing best cost', () => {
    const { g, free } = gridWithHoles(12, 30, 30, 4, 9);
    const terms = pickTerminals(3, free, 15);
    const seen: [number, number][] = [];
    solveSteiner(g, terms, { onProgress: (f, c) => seen.push([f, c]), maxIterations: 20, exactMaxTerminals: 0 });
    expect(seen.length).toBeGreaterThan(0);
    for (let i = 0; i < seen.length; i++) {
      expect(seen[i][0]).toBeGreaterThanOrEqual(0);
      expect(seen[i][0]).toBeLessThanOrEqual(1);
      if (i > 0) expect(seen[i][1]).toBeLessThanOrEqual(seen[i - 1][1]);
    }
  });

  it('skips the lower bound when asked', () => {
    const { g, free } = gridWithHoles(13, 20, 20, 3, 9);
    const r = solveSteiner(g, pickTerminals(9, free, 12), { lowerBound: false, exactMaxTerminals: 0 });
    expect(r.lowerBound).toBe(0);
  });

  it('handles one terminal, duplicate terminals and parallel edges', () => {
    const g = buildGraph(3, [0, 0, 1], [1, 1, 2], [5, 2, 3]);
    expect(solveSteiner(g, [1]).cost).toBe(0);
    const r = solveSteiner(g, [0, 2, 2, 0], { exactMaxTerminals: 0 });
    expect(r.cost).toBe(5); // lighter parallel edge (2) + 3
    expect(Array.from(r.edges).sort()).toEqual([1, 2]);
  });
});

describe('solveSteiner gapTolerance', () => {
  it('stops as soon as the proven gap is within the tolerance', () => {
    const { g, free } = gridWithHoles(21, 40, 40, 6, 9);
    const terms = pickTerminals(6, free, 30);
    const loose = solveSteiner(g, terms, { gapTolerance: 0.5, maxIterations: 50, timeBudgetMs: 60_000 });
    expect(loose.gap).toBeLessThanOrEqual(0.5);
    expect(loose.iterations).toBe(0); // the first shortest-path tree is already within 50 % of the dual-ascent bound
    const tight = solveSteiner(g, terms, { gapTolerance: 0, maxIterations: 50, timeBudgetMs: 60_000 });
    expect(tight.cost).toBeLessThanOrEqual(loose.cost);
  });
});
