// Routing among buildings and keep-outs, checked by independent libraries: shapely 1.8 measures
// each trench segment's distance to the buildings/keep-outs and checks stubs are perpendicular
// to their wall; networkx 2.8 checks the segments form one tree holding every routed terminal.
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { routeSite } from '../../../../core/route/site/routeSite';
import { placeTerminals } from '../../../../core/site/placeTerminals';
import type { PointInput, Polygon, Site } from '../../../../core/site/site';
import type { TrenchNetwork } from '../../../../core/network/trenchNetwork';
import { building, makeSite, rect, line, settings } from './siteFixtures';

const here = (f: string): string => fileURLToPath(new URL(f, import.meta.url));
const tmp = fileURLToPath(new URL('../../../.tmp/', import.meta.url));

export function obstacleSite(): Site {
  const b2: Polygon = { outer: rect(15, 55, 50, 75), holes: [rect(25, 62, 40, 70)], layer: 'BLDG' };
  return makeSite({
    boundary: rect(0, 0, 120, 80),
    buildings: [building(10, 8, 40, 32), building(62, 8, 100, 28), b2],
    keepOuts: [{ outer: Float64Array.from([70, 50, 95, 50, 82, 72]), holes: [], layer: 'POND' }],
    pavements: [{ outer: rect(0, 40, 120, 46), holes: [], layer: 'ROAD' }],
    crossings: [line([52, 0, 52, 38], 'FENCE')],
  });
}

export const obstaclePoints: PointInput[] = [
  { id: 'C', x: 116, y: 4, role: 'connection', utilities: ['power'] },
  { id: 'X', x: 20, y: 20, role: 'connection', utilities: ['power'] },
  { id: 'S0', x: 25, y: 32.4, role: 'service', utilities: ['power'] },
  { id: 'S1', x: 61.7, y: 18, role: 'service', utilities: ['power'] },
  { id: 'S2', x: 35, y: 54.5, role: 'service', utilities: ['power'] },
  { id: 'S3', x: 100.3, y: 20, role: 'service', utilities: ['power'] },
  { id: 'S4', x: 30, y: 62.2, role: 'service', utilities: ['power'] },
];

function shapelyCheck(site: Site, net: TrenchNetwork, name: string): Record<string, unknown> {
  mkdirSync(tmp, { recursive: true });
  const file = `${tmp}net-${name}.json`;
  const poly = (p: Polygon): unknown => ({ outer: [...p.outer], holes: p.holes.map((h) => [...h]) });
  writeFileSync(file, JSON.stringify({
    obstacles: [...site.buildings, ...site.keepOuts].map(poly),
    buildings: site.buildings.map(poly),
    boundary: [...site.boundary],
    segments: net.segments.map((s) => ({ id: s.id, from: s.from, to: s.to, points: [...s.points], stub: s.stub })),
    nodes: net.nodes,
  }));
  return JSON.parse(execFileSync('/usr/bin/python3', [here('check_network.py'), file], { encoding: 'utf8' }));
}

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
