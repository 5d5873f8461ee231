// Runs check_network.py (shapely 1.8 + networkx 2.8 under /usr/bin/python3) on a routed network.

import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Polygon, Site } from '../../../../core/site/site';
import type { TrenchNetwork } from '../../../../core/network/trenchNetwork';

const here = (f: string): string => fileURLToPath(new URL(f, import.meta.url));
const tmp = fileURLToPath(new URL('../../../.tmp/', import.meta.url));

export function shapelyCheck(site: Site, net: TrenchNetwork, name: string): Record<string, unknown> {
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

