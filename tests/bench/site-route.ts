// Benchmark: routing the shared trench (Site → TrenchNetwork) on the demo site and on synthetic
// sites of four sizes, one JSON line per case. Peer in the same run: Mehlhorn's construction on
// networkx's own Dijkstra and MST (tests/bench/site-route-peer.py) on the same grid graph
// (plain move costs), where the graph is small enough for networkx in a short run.
// Run: npx tsx tests/bench/site-route.ts [--no-peer] [--sizes 250,500,750,1000]

import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { DEFAULT_ROUTE } from '../../core/settings';
import { placeTerminals } from '../../core/site/placeTerminals';
import { routeSiteDetailed, type RouteDetail } from '../../core/route/site/routeSite';
import { DX, DY, STEP } from '../../core/route/site/routingGrid';
import type { Site, Terminal } from '../../core/site/site';
import { loadDemo } from '../core/route/site/demoSite';
import { syntheticSite } from './syntheticSite';

const args = process.argv.slice(2);
const withPeer = !args.includes('--no-peer');
const sizeArg = args.indexOf('--sizes');
const sizes = sizeArg >= 0 ? args[sizeArg + 1].split(',').map(Number) : [250, 500, 750, 1000];
const PEER_MAX_NODES = 1_200_000; // networkx holds ~1 kB per node: larger grids are not run
const tmp = fileURLToPath(new URL('../.tmp/', import.meta.url));
mkdirSync(tmp, { recursive: true });

/** Plain cost and length of the grid tree (bends left out, as the peer does not price them). */
function gridTreeMeasures(d: RouteDetail): { cost: number; length: number } {
  const g = d.grid, adj = d.tree.adj;
  let cost = 0, length = 0;
  for (const v of d.tree.nodes) for (let e = 0; e < 4; e++) if ((adj[v] >> e) & 1) { cost += g.cost[v * 8 + e]; length += STEP[e] * g.h; }
  return { cost, length };
}

function peer(d: RouteDetail, name: string): Record<string, unknown> | null {
  const g = d.grid;
  const lines: string[] = [];
  let m = 0;
  for (let v = 0; v < g.n; v++) {
    const bits = g.moves[v];
    for (let e = 0; e < 4; e++) {
      if (!((bits >> e) & 1)) continue;
      lines.push(`${v} ${v + DX[e] + DY[e] * g.nx} ${g.cost[v * 8 + e]} ${STEP[e] * g.h}`);
      m++;
    }
  }
  const terms = [...new Set(d.anchors.map((a) => a.node))];
  const file = `${tmp}site-route-${name}.graph`;
  writeFileSync(file, `${g.n} ${m} ${terms.length}\n${terms.join(' ')}\n${lines.join('\n')}\n`);
  const out = execFileSync('/usr/bin/python3', [fileURLToPath(new URL('./site-route-peer.py', import.meta.url)), file], { encoding: 'utf8', maxBuffer: 1 << 24 });
  return JSON.parse(out);
}

function runCase(name: string, site: Site, terminals: Terminal[], target: { ms: number; mb?: number } | null): void {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const d = routeSiteDetailed(site, terminals, { ...DEFAULT_ROUTE });
  const ms = performance.now() - t0;
  // CPU time of this process during the case: on a shared machine it tracks the work better than the clock.
  const cpu = process.cpuUsage(c0);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  const peakMb = process.resourceUsage().maxRSS / 1024;
  const net = d.network;
  const length = net.segments.reduce((a, s) => a + s.length, 0);
  const bends = net.segments.reduce((a, s) => a + s.bendsDeg.filter((b) => b > 1e-6).length, 0);
  const crossings = net.segments.reduce((a, s) => a + s.crossings.length, 0);
  const grid = gridTreeMeasures(d);
  const row: Record<string, unknown> = {
    case: name, nodes: d.grid.n, terminals: terminals.length, routed: d.anchors.length, unreachable: net.unreachable.length,
    ms: Math.round(ms), cpuMs: Math.round(cpuMs), timingsMs: Object.fromEntries(Object.entries(net.timingsMs ?? {}).map(([k, v]) => [k, Math.round(v)])),
    peakRssMb: Math.round(peakMb), length: +length.toFixed(2), bends, crossings,
    cost: +net.quality.cost.toFixed(2), lowerBound: +net.quality.lowerBound.toFixed(2), gap: +net.quality.gap.toFixed(4),
    gridTreeCost: +grid.cost.toFixed(2), gridTreeLength: +grid.length.toFixed(2), rounds: d.tree.rounds,
  };
  if (target) {
    row.targetMs = target.ms;
    row.timeReached = ms <= target.ms;
    row.cpuTimeReached = cpuMs <= target.ms;
    if (target.mb) { row.targetMb = target.mb; row.memoryReached = peakMb <= target.mb; }
  }
  if (withPeer && d.grid.n <= PEER_MAX_NODES) {
    const p = peer(d, name);
    if (p) {
      row.peer = { method: 'Mehlhorn 1988 on networkx', ...p };
      row.peerCostRatio = +(grid.cost / (p.cost as number)).toFixed(4);
      row.notLongerThanPeer = grid.cost <= (p.cost as number) + 1e-6;
    }
  } else if (withPeer) {
    row.peer = `not run: ${d.grid.n} grid nodes exceed the ${PEER_MAX_NODES} a short networkx run can hold`;
  }
  console.log(JSON.stringify(row));
}

const demo = loadDemo();
runCase('demo', demo.site, demo.terminals, { ms: 1000 });
for (const size of sizes) {
  const { site, points } = syntheticSite(size, 200);
  const placed = placeTerminals(site, points, { snapTolerance: 2 });
  runCase(`synthetic-${size}m`, site, placed.terminals, size === 1000 ? { ms: 10_000, mb: 2048 } : null);
}
