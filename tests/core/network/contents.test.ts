import { describe, expect, it } from 'vitest';
import { computeContents, traceRuns } from '../../../core/network/contents';
import { DEFAULT_UTILITIES } from '../../../core/settings';
import { handNetwork, terminal } from '../takeoff/handNetwork';

// A line P1 — A — B — C — P2 along x (metres): P1 at 0, A at 30, B at 60, C at 90, P2 at 100.
const net = handNetwork(
  [
    { id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'P1' },
    { id: 1, kind: 'service', x: 30, y: 0, terminalId: 'A' },
    { id: 2, kind: 'service', x: 60, y: 0, terminalId: 'B' },
    { id: 3, kind: 'service', x: 90, y: 0, terminalId: 'C' },
    { id: 4, kind: 'connection', x: 100, y: 0, terminalId: 'P2' },
  ],
  [
    { from: 0, to: 1, pts: [0, 0, 30, 0] },
    { from: 1, to: 2, pts: [30, 0, 60, 0] },
    { from: 2, to: 3, pts: [60, 0, 90, 0] },
    { from: 3, to: 4, pts: [90, 0, 100, 0] },
  ],
);
const utils = DEFAULT_UTILITIES;

describe('segment contents', () => {
  it('radial utilities add one conduit per downstream service; mains carry one pipe', () => {
    const terms = [
      terminal('P1', 'connection', ['power', 'water'], 0, 0),
      terminal('A', 'service', ['power', 'water'], 30, 0),
      terminal('B', 'service', ['power', 'water'], 60, 0),
      terminal('C', 'service', ['power'], 90, 0),
      terminal('P2', 'connection', [], 100, 0),
    ];
    const c = computeContents(net, terms, utils);
    // Hand count: segment 0 feeds A, B, C (power) and A, B (water).
    expect(c.map((s) => s.loads.map((l) => `${l.utility}:${l.conduits}`).join(' '))).toEqual([
      'power:3 water:1', 'power:2 water:1', 'power:1', '',
    ]);
    expect(c[1].loads[0].services).toEqual(['B', 'C']);
    expect(c.map((s) => s.byUtility)).toEqual([{ power: 3, water: 1 }, { power: 2, water: 1 }, { power: 1 }, {}]);
  });

  it('feeds each service from the nearest connection along the tree carrying its utility', () => {
    const terms = [
      terminal('P1', 'connection', ['power', 'telecom'], 0, 0),
      terminal('A', 'service', ['power', 'telecom'], 30, 0),
      terminal('B', 'service', ['power', 'telecom'], 60, 0),
      terminal('C', 'service', ['power', 'telecom'], 90, 0),
      terminal('P2', 'connection', ['power'], 100, 0),
    ];
    const { runs } = traceRuns(net, terms, utils);
    const from = (u: string, s: string) => runs.find((r) => r.utility === u && r.serviceId === s)?.connectionId;
    // Distances along the line: A 30 vs 70, B 60 vs 40, C 90 vs 10.
    expect([from('power', 'A'), from('power', 'B'), from('power', 'C')]).toEqual(['P1', 'P2', 'P2']);
    // Telecom has only P1.
    expect([from('telecom', 'A'), from('telecom', 'B'), from('telecom', 'C')]).toEqual(['P1', 'P1', 'P1']);
    const c = computeContents(net, terms, utils);
    expect(c.map((s) => s.loads.map((l) => `${l.utility}:${l.conduits}`).join(' '))).toEqual([
      'power:1 telecom:3', 'telecom:2', 'power:1 telecom:1', 'power:2',
    ]);
    const run = runs.find((r) => r.utility === 'power' && r.serviceId === 'B');
    expect(run?.length).toBe(40);
    expect(run?.steps).toEqual([{ segment: 3, forward: false }, { segment: 2, forward: false }]);
  });

  it('warns about a service whose utility has no connection on its tree, and unknown utility keys', () => {
    const terms = [
      terminal('P1', 'connection', ['power'], 0, 0),
      terminal('A', 'service', ['power', 'gas', 'steam'], 30, 0),
    ];
    const { runs, warnings } = traceRuns(net, terms, utils);
    expect(runs.map((r) => r.utility)).toEqual(['power']);
    expect(warnings.some((w) => w.includes('steam'))).toBe(true);
    expect(warnings.some((w) => w.includes('gas'))).toBe(true);
  });

  it('does not change its inputs', () => {
    const terms = [terminal('P1', 'connection', ['power'], 0, 0), terminal('C', 'service', ['power'], 90, 0)];
    const before = JSON.stringify({ n: net.nodes, s: net.segments.map((s) => [...s.points]), terms });
    computeContents(net, terms, utils);
    expect(JSON.stringify({ n: net.nodes, s: net.segments.map((s) => [...s.points]), terms })).toBe(before);
  });
});
