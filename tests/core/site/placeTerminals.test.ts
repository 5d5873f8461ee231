// Service points snapped onto building walls; points of connection left where given.
// Independent check: shapely's exterior.project/interpolate gives the nearest wall point.
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { placeTerminals } from '../../../core/site/placeTerminals';
import type { PointInput, Site } from '../../../core/site/site';

function site(buildings: Float64Array[], frame = { originX: 0, originY: 0, scale: 1 }): Site {
  return {
    units: 'm', frame, buildings: buildings.map((outer) => ({ outer, holes: [], layer: 'BLDG' })),
    keepOuts: [], pavements: [], crossings: [], boundary: Float64Array.from([-100, -100, 200, -100, 200, 200, -100, 200]),
    roles: {}, warnings: [],
  };
}
const svc = (id: string, x: number, y: number): PointInput => ({ id, x, y, role: 'service', utilities: ['power'] });

describe('placeTerminals', () => {
  const square = Float64Array.from([0, 0, 20, 0, 20, 10, 0, 10]);

  it('snaps a service within the tolerance onto the nearest wall with the outward normal', () => {
    const r = placeTerminals(site([square]), [svc('S', 7, 11.2)], { snapTolerance: 2 });
    expect(r.problems).toEqual([]);
    const t = r.terminals[0];
    expect([t.x, t.y, t.nx, t.ny, t.building]).toEqual([7, 10, 0, 1, 0]);
    expect(t.snapDistance).toBeCloseTo(1.2, 12);
    expect(t.given).toEqual({ x: 7, y: 11.2 });
  });

  it('the outward normal does not depend on the ring orientation (clockwise ring)', () => {
    const cw = Float64Array.from([0, 0, 0, 10, 20, 10, 20, 0]);
    const t = placeTerminals(site([cw]), [svc('S', 20.5, 4)], { snapTolerance: 2 }).terminals[0];
    expect([t.x, t.y, t.nx, t.ny]).toEqual([20, 4, 1, 0]);
  });

  it('a service inside the footprint near a wall is moved out onto that wall', () => {
    const t = placeTerminals(site([square]), [svc('S', 0.5, 5)], { snapTolerance: 2 }).terminals[0];
    expect([t.x, t.y, t.nx, t.ny]).toEqual([0, 5, -1, 0]);
  });

  it('beyond the tolerance: reported, not moved', () => {
    const r = placeTerminals(site([square]), [svc('FAR', 7, 15)], { snapTolerance: 2 });
    expect(r.terminals[0].x).toBe(7);
    expect(r.terminals[0].y).toBe(15);
    expect(r.terminals[0].building).toBe(-1);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].id).toBe('FAR');
    expect(r.problems[0].message).toMatch(/5\.00 m .*tolerance 2 m/);
  });

  it('converts drawing units through the site frame and leaves connections where given', () => {
    const s = site([square], { originX: 1000, originY: 2000, scale: 0.3048 });
    const p: PointInput = { id: 'C', x: 1000 + 100, y: 2000 + 50, role: 'connection', utilities: ['gas'] };
    const t = placeTerminals(s, [p], { snapTolerance: 2 }).terminals[0];
    expect(t.x).toBeCloseTo(30.48, 12);
    expect(t.y).toBeCloseTo(15.24, 12);
    expect([t.nx, t.ny, t.building, t.snapDistance]).toEqual([0, 0, -1, 0]);
  });

  it('on a rotated wall the snapped point is the one shapely projects to', () => {
    const c = Math.cos(0.5), sn = Math.sin(0.5);
    const pts = [[0, 0], [30, 0], [30, 12], [0, 12]].map(([x, y]) => [50 + x * c - y * sn, 20 + x * sn + y * c]);
    const ring = Float64Array.from(pts.flat());
    const q = { x: 50 + 11 * c - 13.1 * sn, y: 20 + 11 * sn + 13.1 * c };
    const t = placeTerminals(site([ring]), [svc('R', q.x, q.y)], { snapTolerance: 2 }).terminals[0];
    const py = `from shapely.geometry import Polygon, Point\nb = Polygon(${JSON.stringify(pts)})\np = Point(${q.x}, ${q.y})\nr = b.exterior.interpolate(b.exterior.project(p))\nprint(r.x, r.y)`;
    const [sx, sy] = execFileSync('/usr/bin/python3', ['-c', py], { encoding: 'utf8' }).trim().split(' ').map(Number);
    expect(Math.hypot(t.x - sx, t.y - sy)).toBeLessThan(1e-9);
    // Outward normal of the rotated top wall: (−sin 0.5, cos 0.5).
    expect(t.nx).toBeCloseTo(-sn, 12);
    expect(t.ny).toBeCloseTo(c, 12);
  });
});
