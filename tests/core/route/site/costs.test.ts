// Surface, crossing and bend pricing.
import { describe, expect, it } from 'vitest';
import { Cancelled } from '../../../../core/result';
import { routeSite } from '../../../../core/route/site/routeSite';
import { bendTable } from '../../../../core/route/site/routingGrid';
import type { TrenchNetwork } from '../../../../core/network/trenchNetwork';
import { building, connection, line, makeSite, obstaclePoints, obstacleSite, rect, settings } from './siteFixtures';
import { placeTerminals } from '../../../../core/site/placeTerminals';

const paved = (n: TrenchNetwork): number => n.segments.reduce((a, s) => a + s.lengthUnderPavement, 0);
const crossings = (n: TrenchNetwork): number => n.segments.reduce((a, s) => a + s.crossings.length, 0);
const bends = (n: TrenchNetwork): number => n.segments.reduce((a, s) => a + s.bendsDeg.filter((b) => b > 1e-6).length, 0)
  + n.nodes.filter((x) => x.kind === 'bend').length;

describe('surface and crossing costs', () => {
  // A 10 m road strip between two points offset along it.
  const road = makeSite({ boundary: rect(0, 0, 100, 60), pavements: [{ outer: rect(0, 25, 100, 35), holes: [], layer: 'ROAD' }] });
  const pts = [connection('A', 10, 5), connection('B', 70, 55)];

  for (const style of ['octilinear', 'orthogonal'] as const) {
    it(`${style}: a road strip priced above soft ground is crossed at right angles, not along or aslant`, () => {
      const net = routeSite(road, pts, settings({ style, pavementFactor: 3 }));
      // The shortest way across a strip of width w is the perpendicular, length w (elementary geometry).
      expect(paved(net)).toBeGreaterThanOrEqual(10 - 1e-6);
      expect(paved(net)).toBeLessThan(10 + 1e-6);
      expect(crossings(net)).toBe(2); // the two pavement edges
      for (const s of net.segments) for (const c of s.crossings) expect(c.kind).toBe('pavement-edge');
    });
  }

  it('any-angle: the strip is crossed as a least-cost path refracts (Snell\'s law), far steeper than the straight line', () => {
    // Fermat's principle: the cheapest path through media of cost 1 | 3 | 1 obeys sin θ1 = 3 sin θ2.
    // Here both soft legs rise 20 m and the strip is 10 m wide, so the optimum is symmetric; its
    // cost is found by golden-section search over the soft legs' run u (2u + w = 60).
    const f = (u: number): number => 2 * Math.hypot(u, 20) + 3 * Math.hypot(60 - 2 * u, 10);
    let lo = 0, hi = 30;
    for (let k = 0; k < 200; k++) {
      const a = lo + (hi - lo) * 0.382, b = lo + (hi - lo) * 0.618;
      if (f(a) < f(b)) hi = b; else lo = a;
    }
    const u = (lo + hi) / 2;
    const bestPaved = Math.hypot(60 - 2 * u, 10);
    const net = routeSite(road, pts, settings({ style: 'any-angle', pavementFactor: 3, bendPenaltyM: 0 }));
    const len = net.segments.reduce((a, x) => a + x.length, 0);
    const cost = len + 2 * paved(net);
    expect(Math.abs(cost - f(u)) / f(u)).toBeLessThan(0.005);
    expect(Math.abs(paved(net) - bestPaved)).toBeLessThan(0.02 * bestPaved);
    expect(paved(net)).toBeLessThan(Math.hypot(60, 50) / 5 - 1); // the straight line spends 15.6 m on the strip
    expect(crossings(net)).toBe(2);
  });

  it('with the factor at 1 the strip costs like soft ground and is crossed on the straight diagonal (any-angle)', () => {
    const net = routeSite(road, pts, settings({ style: 'any-angle', pavementFactor: 1, crossingPenaltyM: 0 }));
    const len = net.segments.reduce((a, s) => a + s.length, 0);
    expect(len).toBeCloseTo(Math.hypot(60, 50), 6); // the straight line
  });

  it('a crossing line is crossed once, at the place reported with its layer', () => {
    const site = makeSite({ boundary: rect(0, 0, 60, 40), crossings: [line([30, 0, 30, 40], 'FENCE')] });
    const net = routeSite(site, [connection('A', 10, 20), connection('B', 50, 20)], settings());
    expect(crossings(net)).toBe(1);
    const c = net.segments.flatMap((s) => s.crossings)[0];
    expect(c.layer).toBe('FENCE');
    expect(c.x).toBeCloseTo(30, 9);
    expect(c.y).toBeCloseTo(20, 9);
  });
});

describe('penalties are monotone', () => {
  const site = obstacleSite();
  const placed = placeTerminals(site, obstaclePoints, { snapTolerance: 2 });

  it('raising the bend penalty never adds bends', () => {
    let last = Infinity;
    for (const bendPenaltyM of [0, 2, 8, 32]) {
      const b = bends(routeSite(site, placed.terminals, settings({ bendPenaltyM })));
      expect(b).toBeLessThanOrEqual(last);
      last = b;
    }
  });

  it('raising the crossing penalty never adds crossings', () => {
    let last = Infinity;
    for (const crossingPenaltyM of [0, 5, 20, 80]) {
      const c = crossings(routeSite(site, placed.terminals, settings({ crossingPenaltyM })));
      expect(c).toBeLessThanOrEqual(last);
      last = c;
    }
  });

  it('bends are priced by the true turning angle: 45° → P/2, 90° → P, 135° → 3P/2 (settings: P per 90°)', () => {
    const t = bendTable(4);
    expect(t[0 * 8 + 1]).toBe(2); // E → NE, 45°
    expect(t[0 * 8 + 2]).toBe(4); // E → N, 90°
    expect(t[0 * 8 + 3]).toBe(6); // E → NW, 135°
    expect(t[0 * 8 + 7]).toBe(2); // E → SE, 45° the other way
    expect(t[5 * 8 + 5]).toBe(0); // straight on
  });

  it('a 135° turn costs more than a 45° turn: the router prefers two gentle bends to one sharp one', () => {
    // A wall forces a detour; the bend penalty is priced by the true angle (θ/90° per bend).
    const s = makeSite({ boundary: rect(0, 0, 60, 40), buildings: [building(25, 0, 35, 30)] });
    const net = routeSite(s, [connection('A', 10, 5), connection('B', 50, 5)], settings({ bendPenaltyM: 5 }));
    const all = net.segments.flatMap((x) => x.bendsDeg).filter((b) => b > 1e-6);
    for (const b of all) expect(b).toBeLessThanOrEqual(90 + 1e-9);
  });
});

describe('determinism, progress and cancellation', () => {
  const site = obstacleSite();
  const placed = placeTerminals(site, obstaclePoints, { snapTolerance: 2 });

  it('the same input gives the same network', () => {
    const a = routeSite(site, placed.terminals, settings());
    const b = routeSite(site, placed.terminals, settings());
    const strip = (n: TrenchNetwork): string => JSON.stringify({ ...n, timingsMs: undefined, segments: n.segments.map((s) => ({ ...s, points: [...s.points] })) });
    expect(strip(a)).toBe(strip(b));
  });

  it('reports progress by stage and stops when the signal is aborted', () => {
    const seen: [string, number][] = [];
    routeSite(site, placed.terminals, settings(), { onProgress: (stage, f) => seen.push([stage, f]) });
    expect(seen.some(([s]) => s === 'route')).toBe(true);
    expect(seen.some(([s]) => s === 'shape')).toBe(true);
    for (const [, f] of seen) expect(f >= 0 && f <= 1).toBe(true);
    const signal = { aborted: false };
    expect(() => routeSite(site, placed.terminals, settings(), {
      signal, onProgress: (stage) => { if (stage === 'route') signal.aborted = true; },
    })).toThrow(Cancelled);
  });
});
