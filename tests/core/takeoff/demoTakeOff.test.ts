// The demo site routed end to end, then its take-off checked against independent computations:
// conduit totals against path lengths from networkx on the same tree, volumes summed per segment,
// and every service in services.csv (read here with a plain split) fed with each of its utilities.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readDxfBytes } from '../../../core/dxf/readDxf';
import { buildSite } from '../../../core/site/buildSite';
import { parsePointsCsv } from '../../../core/site/pointsCsv';
import { parseRolesFile } from '../../../core/site/rolesFile';
import { placeTerminals } from '../../../core/site/placeTerminals';
import { routeSite } from '../../../core/route/site/routeSite';
import { computeTakeOff } from '../../../core/takeoff/takeoff';
import type { TakeOff } from '../../../core/takeoff/takeoff';
import { traceRuns } from '../../../core/network/contents';
import { defaultSettings } from '../../../core/settings';
import type { TrenchNetwork } from '../../../core/network/trenchNetwork';
import type { Terminal } from '../../../core/site/site';

const DEMO = path.resolve(__dirname, '../../../assets/demo');

function must<T>(r: { ok: true; value: T } | { ok: false; error: { message: string } }): T {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

let net: TrenchNetwork;
let terminals: Terminal[];
let t: TakeOff;
const settings = defaultSettings();

beforeAll(() => {
  const drawing = must(readDxfBytes(new Uint8Array(fs.readFileSync(path.join(DEMO, 'site.dxf')))));
  const roles = must(parseRolesFile(fs.readFileSync(path.join(DEMO, 'roles.json'), 'utf8'), 'roles.json', drawing.layers.map((l) => l.name))).roles;
  const points = must(parsePointsCsv(fs.readFileSync(path.join(DEMO, 'services.csv'), 'utf8'), settings.utilities.map((u) => u.key)));
  const site = must(buildSite(drawing, { roles }));
  terminals = placeTerminals(site, points, { snapTolerance: settings.route.snapToleranceM }).terminals;
  net = routeSite(site, terminals, settings.route);
  t = computeTakeOff(net, terminals, settings);
});

describe('take-off of the demo site', () => {
  it('feeds every service in services.csv with each of its utilities', () => {
    const rows = fs.readFileSync(path.join(DEMO, 'services.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
    const wanted = rows.filter((r) => r[3] === 'service').flatMap((r) => r[4].split(';').map((u) => `${r[0]}:${u}`)).sort();
    const { runs } = traceRuns(net, terminals, settings.utilities);
    expect(runs.map((r) => `${r.serviceId}:${r.utility}`).sort()).toEqual(wanted);
    expect(net.unreachable).toEqual([]);
  });

  it('radial conduit totals equal the sum of tree path lengths from networkx, plus stub-ups', () => {
    const edges = net.segments.map((s) => [s.from, s.to, s.length]);
    const poc = net.nodes.find((n) => n.terminalId === 'POC1')?.id;
    const script = [
      'import json, sys, networkx as nx',
      'd = json.load(sys.stdin)',
      'g = nx.Graph()',
      'g.add_weighted_edges_from(d["edges"])',
      'assert nx.is_tree(g)',
      'dist = nx.single_source_dijkstra_path_length(g, d["poc"])',
      'print(json.dumps({k: sum(dist[n] for n in v) for k, v in d["targets"].items()}))',
    ].join('\n');
    const targets: Record<string, number[]> = {};
    for (const u of ['power', 'telecom']) {
      targets[u] = terminals.filter((x) => x.role === 'service' && x.utilities.includes(u)).map((x) => net.nodes.find((n) => n.terminalId === x.id)?.id as number);
    }
    const r = spawnSync('/usr/bin/python3', ['-c', script], { input: JSON.stringify({ edges, poc, targets }), encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const sums = JSON.parse(r.stdout) as Record<string, number>;
    for (const u of ['power', 'telecom']) {
      const line = t.lines.find((l) => l.key === `conduit.${u}.2.375in`);
      const stubs = 2 * targets[u].length * settings.trench.stubUpM; // one stub-up at each end of each conduit
      expect(line?.quantity).toBeCloseTo(sums[u] + stubs, 2);
    }
  });

  it('totals are the sums of the per-segment rows (to rounding) and the trench length is the network length', () => {
    const sum = (k: 'excavation' | 'bedding' | 'backfill' | 'haul' | 'length') => t.segments.reduce((a, s) => a + s[k], 0);
    const tol = t.segments.length * 0.0005 + 1e-9;
    expect(Math.abs(sum('excavation') - t.totals.excavation)).toBeLessThanOrEqual(tol);
    expect(Math.abs(sum('backfill') - t.totals.backfill)).toBeLessThanOrEqual(tol);
    expect(Math.abs(sum('haul') - t.totals.haul)).toBeLessThanOrEqual(tol);
    expect(t.totals.trenchLength).toBeCloseTo(net.segments.reduce((a, s) => a + s.length, 0), 2);
    expect(t.totals.cost).toBeCloseTo(t.lines.reduce((a, l) => a + l.cost, 0), 1);
  });

  it('no trench on the demo reaches 5 ft, so no protective system is priced (OSHA 1926.652(a)(1))', () => {
    expect(Math.max(...t.segments.map((s) => s.depth))).toBeLessThan(1.524);
    expect(t.lines.some((l) => l.key === 'protective')).toBe(false);
  });
});
