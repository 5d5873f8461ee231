// Shaping grid paths: collinear runs merge, staircases become at most two legs in the style,
// never through a clearance zone and never with more corners. Lengths against elementary
// closed forms: octilinear distance max(dx,dy) + (√2 − 1)·min(dx,dy); rectilinear dx + dy.
import { describe, expect, it } from 'vitest';
import { removeCollinear } from '../../../core/network/shapeGraph';
import { straightenRun } from '../../../core/network/shape';
import { buildRoutingGrid, segmentClear } from '../../../core/route/site/routingGrid';
import { gridParams } from '../../../core/route/site/routeSite';
import { building, makeSite, rect, settings } from '../route/site/siteFixtures';

const len = (p: number[]): number => { let s = 0; for (let i = 0; i + 3 < p.length; i += 2) s += Math.hypot(p[i + 2] - p[i], p[i + 3] - p[i + 1]); return s; };
const headings = (p: number[]): number[] => { const out: number[] = []; for (let i = 0; i + 3 < p.length; i += 2) out.push((Math.atan2(p[i + 3] - p[i + 1], p[i + 2] - p[i]) * 180) / Math.PI); return out; };

/** A staircase from (0,0): `n` steps of (1 east, 1 north) then `k` cells east, on a 0.5 m grid. */
function staircase(n: number, k: number, h = 0.5): number[] {
  const p = [0, 0];
  let x = 0, y = 0;
  for (let i = 0; i < n; i++) { x += h; p.push(x, y); y += h; p.push(x, y); }
  for (let i = 0; i < k; i++) { x += h; p.push(x, y); }
  return p;
}

describe('shaping grid paths', () => {
  const open = makeSite({ boundary: rect(-5, -5, 40, 40) });

  it('merges collinear points', () => {
    expect(removeCollinear([0, 0, 1, 0, 2, 0, 3, 0, 3, 1, 3, 2], 1e-9)).toEqual([0, 0, 3, 0, 3, 2]);
  });

  it('octilinear: a staircase becomes one diagonal and one straight leg of the octilinear length', () => {
    const g = buildRoutingGrid(open, gridParams(open, settings({ style: 'octilinear' })));
    const p = straightenRun(g, staircase(20, 10), 'octilinear');
    expect(p.length / 2).toBeLessThanOrEqual(3);
    for (const a of headings(p)) expect(Math.abs(a / 45 - Math.round(a / 45))).toBeLessThan(1e-9);
    expect(len(p)).toBeCloseTo(15 + (Math.SQRT2 - 1) * 10, 9); // dx = 15, dy = 10
  });

  it('orthogonal: a staircase becomes an L of the rectilinear length', () => {
    const g = buildRoutingGrid(open, gridParams(open, settings({ style: 'orthogonal' })));
    const p = straightenRun(g, staircase(20, 10), 'orthogonal');
    expect(p.length / 2).toBe(3);
    for (const a of headings(p)) expect(Math.abs(a / 90 - Math.round(a / 90))).toBeLessThan(1e-9);
    expect(len(p)).toBeCloseTo(25, 9);
  });

  it('any-angle: a staircase becomes its straight line of sight', () => {
    const g = buildRoutingGrid(open, gridParams(open, settings({ style: 'any-angle' })));
    const p = straightenRun(g, staircase(20, 10), 'any-angle');
    expect(p).toEqual([0, 0, 15, 10]);
  });

  it('keeps the clearance: a shortcut through a building zone is refused, corners never increase', () => {
    // A building sits right where the straight shortcut would pass.
    const site = makeSite({ boundary: rect(-5, -5, 40, 40), buildings: [building(6, 0.5, 9, 3.5)] });
    const g = buildRoutingGrid(site, gridParams(site, settings({ style: 'octilinear' })));
    // A clear path around the building's grown zone: up the west side, over, down the east.
    const path = [0, 0, 4.5, 0, 4.5, 5, 10.5, 5, 10.5, 0, 15, 0];
    for (let i = 0; i + 3 < path.length; i += 2) expect(segmentClear(g, path[i], path[i + 1], path[i + 2], path[i + 3])).toBe(true);
    const p = straightenRun(g, path, 'octilinear');
    for (let i = 0; i + 3 < p.length; i += 2) expect(segmentClear(g, p[i], p[i + 1], p[i + 2], p[i + 3])).toBe(true);
    expect(p.length / 2 - 2).toBeLessThanOrEqual(4);
    expect(len(p)).toBeLessThanOrEqual(len(path) + 1e-9);
  });
});
