// Routing among buildings and keep-outs, checked by independent libraries: shapely 1.8 measures
// each trench segment's distance to the buildings/keep-outs and checks stubs are perpendicular
// to their wall; networkx 2.8 checks the segments form one tree holding every routed terminal.
import { describe, expect, it } from 'vitest';
import { routeSite } from '../../../../core/route/site/routeSite';
import { placeTerminals } from '../../../../core/site/placeTerminals';
import { obstaclePoints, obstacleSite, settings } from './siteFixtures';
import { shapelyCheck } from './shapelyCheck';

describe('routing around buildings and keep-outs', () => {
  const site = obstacleSite();
  const placed = placeTerminals(site, obstaclePoints, { snapTolerance: 2 });

  for (const style of ['orthogonal', 'octilinear', 'any-angle'] as const) {
    it(`${style}: no trench segment enters a building, keep-out or its 1 m clearance (shapely), one tree (networkx)`, () => {
      const net = routeSite(site, placed.terminals, settings({ style }));
      expect(net.unreachable.map((u) => u.id).sort()).toEqual(['S4', 'X']);
      const r = shapelyCheck(site, net, style);
      // Clipper approximates the clearance arcs within 0.005 m (arc tolerance): 0.01 m slack.
      expect(r.minClearance as number).toBeGreaterThanOrEqual(1.0 - 0.01);
      expect(r.segmentsOutsideBoundary).toBe(0);
      expect(r.stubProblems).toEqual([]);
      expect(r.isTree).toBe(true);
      expect(r.terminalsInTree).toBe(5);
      expect(r.terminals).toBe(5);
    });
  }

  it('reports each unreachable point with its reason and still routes the rest', () => {
    const net = routeSite(site, placed.terminals, settings());
    const why = Object.fromEntries(net.unreachable.map((u) => [u.id, u.reason]));
    expect(why.X).toMatch(/inside building/);
    expect(why.S4).toMatch(/enclosed/);
    const routed = net.nodes.filter((n) => n.terminalId).map((n) => n.terminalId).sort();
    expect(routed).toEqual(['C', 'S0', 'S1', 'S2', 'S3']);
  });
});
