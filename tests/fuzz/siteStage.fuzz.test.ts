// Fuzzing the site stage directly with generated drawings (no DXF text in between), so the
// geometry is harder than mutations of a seed make it: outlines on a coarse lattice (many
// coincident points, collinear and overlapping edges, self-crossings, zero areas), tiny
// perturbations of those, a far-away origin as in state-plane drawings, open pieces that almost
// close, and every layer role. 3 000 cases, fixed seed; buildSite and inspectDrawing must
// return a value with finite geometry within a time bound.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Drawing, DrawingEntity } from '../../core/dxf/drawing';
import { buildSite } from '../../core/site/buildSite';
import { inspectDrawing } from '../../core/site/inspect';
import type { LayerRole } from '../../core/site/site';

const LAYERS = ['BLDG', 'PAVE', 'CURB', 'LIMIT', 'KEEP', 'NOTE'];
const ROLES: Record<string, LayerRole> = { BLDG: 'building', PAVE: 'pavement', CURB: 'crossing', LIMIT: 'boundary', KEEP: 'keep-out', NOTE: 'ignore' };
const CASES = 3000;
const CASE_BOUND_MS = 1500;

const coord = fc.oneof(
  fc.integer({ min: 0, max: 12 }).map((v) => v * 5),
  fc.tuple(fc.integer({ min: 0, max: 12 }), fc.constantFrom(1e-12, -1e-9, 1e-6, 0.01, 0.021)).map(([v, e]) => v * 5 + e),
  fc.double({ min: -100, max: 160, noNaN: true }),
);
const entity = fc.record({
  layer: fc.constantFrom(...LAYERS),
  pts: fc.array(fc.tuple(coord, coord), { minLength: 2, maxLength: 24 }),
  closed: fc.boolean(),
});
const drawingArb = fc.record({
  entities: fc.array(entity, { minLength: 1, maxLength: 14 }),
  offset: fc.constantFrom(0, 0, 2_000_000, -5e8, 1e11),
  insUnits: fc.constantFrom(0, 6, 2, 4),
  givenRoles: fc.boolean(),
  units: fc.constantFrom(undefined, 'm' as const, 'ft' as const),
});

function toDrawing(d: { entities: { layer: string; pts: [number, number][]; closed: boolean }[]; offset: number; insUnits: number }): Drawing {
  const entities: DrawingEntity[] = d.entities.map((e) => ({
    kind: 'polyline', layer: e.layer, source: 'LWPOLYLINE', closed: e.closed,
    points: Float64Array.from(e.pts.flatMap(([x, y]) => [x + d.offset, y + d.offset])),
  }));
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const e of entities) {
    if (e.kind !== 'polyline') continue;
    for (let i = 0; i < e.points.length; i += 2) {
      minX = Math.min(minX, e.points[i]); maxX = Math.max(maxX, e.points[i]);
      minY = Math.min(minY, e.points[i + 1]); maxY = Math.max(maxY, e.points[i + 1]);
    }
  }
  const used = [...new Set(entities.map((e) => e.layer))];
  return {
    header: { version: 'AC1015', insUnits: d.insUnits, extents: { minX, minY, maxX, maxY } },
    layers: used.map((name) => ({ name, color: 7, on: true, frozen: false })),
    entities, warnings: [],
  };
}

describe('site stage under fuzzing', () => {
  it(`${CASES} generated drawings end in a site or a site error, with finite geometry, within ${CASE_BOUND_MS} ms`, () => {
    const outcomes = new Map<string, number>();
    let slowest = 0;
    let cases = 0;
    fc.assert(fc.property(drawingArb, (d) => {
      const drawing = toDrawing(d);
      const roles = d.givenRoles ? Object.fromEntries(drawing.layers.map((l) => [l.name, ROLES[l.name]])) : undefined;
      const t0 = performance.now();
      const s = buildSite(drawing, { roles, units: d.units });
      const rep = inspectDrawing(drawing, s.ok ? s.value : s.error, roles);
      const ms = performance.now() - t0;
      cases++;
      slowest = Math.max(slowest, ms);
      expect(ms).toBeLessThan(CASE_BOUND_MS);
      expect(rep.layers.length).toBe(drawing.layers.length);
      const label = s.ok ? 'site' : `site:${s.error.kind}`;
      outcomes.set(label, (outcomes.get(label) ?? 0) + 1);
      if (!s.ok) { expect(s.error.message.length).toBeGreaterThan(10); return; }
      const site = s.value;
      for (const v of site.boundary) expect(Number.isFinite(v)).toBe(true);
      for (const b of site.buildings) {
        expect(b.outer.length).toBeGreaterThanOrEqual(6);
        for (const v of b.outer) expect(Number.isFinite(v)).toBe(true);
        for (const h of b.holes) for (const v of h) expect(Number.isFinite(v)).toBe(true);
      }
      for (const c of site.crossings) for (const v of c.points) expect(Number.isFinite(v)).toBe(true);
      expect(Number.isFinite(rep.buildings.area)).toBe(true);
      expect(rep.buildings.area).toBeGreaterThanOrEqual(0);
    }), { numRuns: CASES, seed: 20261202, endOnFailure: true });
    console.log(JSON.stringify({ fuzz: 'site-stage', seed: 20261202, cases, slowestMs: Math.round(slowest), outcomes: Object.fromEntries([...outcomes].sort()) }));
    expect(cases).toBe(CASES);
    expect(outcomes.get('site') ?? 0).toBeGreaterThan(CASES * 0.3);
  });
});
