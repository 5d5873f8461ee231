// The demo site end to end (assets/demo: DXF → site → placed terminals → routed network), pinned
// as a regression. If a change moves these numbers, explain it in the commit: a shorter network
// at the same bends/crossings is an improvement; a longer one must come with a reason (a new
// cost, a clearance fix, a different tie-break) and the new values. Run the benchmark
// (tests/bench/site-route.ts) to see cost, lower bound and gap beside them.
import { describe, expect, it } from 'vitest';
import { routeSite } from '../../../../core/route/site/routeSite';
import { loadDemo } from './demoSite';
import { settings } from './siteFixtures';
import { shapelyCheck } from './shapelyCheck';

describe('demo site end to end', () => {
  const { site, terminals, problems } = loadDemo();

  it('places every service on its wall and routes all thirteen points in one network', () => {
    expect(problems).toEqual([]);
    expect(terminals).toHaveLength(13);
    // A generous budget: the result must not depend on the machine's speed (the work budget decides).
    const net = routeSite(site, terminals, settings({ timeBudgetMs: 20_000 }));
    expect(net.unreachable).toEqual([]);
    const length = net.segments.reduce((a, s) => a + s.length, 0);
    const bends = net.segments.reduce((a, s) => a + s.bendsDeg.filter((b) => b > 1e-6).length, 0);
    const crossings = net.segments.reduce((a, s) => a + s.crossings.length, 0);
    const pinned = { length: +length.toFixed(2), bends, crossings, cost: +net.quality.cost.toFixed(2) };
    expect(pinned).toEqual(PINNED);
    // Quality is reported honestly: the cost is never below the bound.
    expect(net.quality.lowerBound).toBeLessThanOrEqual(net.quality.cost);
    // ...and useful: dual ascent on the plain grid costs (bends left out) bounds this route within
    // 5 % (742.6 against 768.7 on 2026-12-02; the Voronoi bound alone was 437.0, a 43 % gap).
    expect(net.quality.gap).toBeLessThan(0.05);
    expect(net.nodes.filter((n) => n.kind === 'service')).toHaveLength(12);
    expect(net.nodes.filter((n) => n.kind === 'connection')).toHaveLength(1);
  });
});

// Pinned 2026-12-02 (octilinear, 0.5 m cells, 1 m clearance, defaults of core/settings.ts).
const PINNED = { length: 696.74, bends: 8, crossings: 5, cost: 768.74 };

describe('demo site clearances', () => {
  const { site, terminals } = loadDemo();
  for (const style of ['orthogonal', 'any-angle'] as const) {
    it(`${style}: every trench segment keeps 1 m from buildings and keep-outs (shapely), one tree (networkx)`, () => {
      const net = routeSite(site, terminals, settings({ style }));
      const r = shapelyCheck(site, net, `demo-${style}`);
      // Clipper approximates the clearance arcs within 0.005 m (arc tolerance): 0.01 m slack.
      expect(r.minClearance as number).toBeGreaterThanOrEqual(1.0 - 0.01);
      expect(r.segmentsOutsideBoundary).toBe(0);
      expect(r.stubProblems).toEqual([]);
      expect(r.isTree).toBe(true);
      expect(r.terminalsInTree).toBe(13);
    });
  }
});
