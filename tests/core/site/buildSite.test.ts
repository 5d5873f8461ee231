// The site model: footprint areas against closed forms and an independent library (shapely, via
// tests/fixtures/dxf/make_fixtures.py), units and local frame, and bad-geometry handling.
import { describe, expect, it } from 'vitest';
import { buildSite, type BuildSiteOptions } from '../../../core/site/buildSite';
import { polygonArea } from '../../../core/site/polygonSet';
import { signedArea } from '../../../core/site/rings';
import type { Site } from '../../../core/site/site';
import { expected, readFixture } from '../dxf/fixtures';

function site(name: string, opts?: BuildSiteOptions): Site {
  const r = buildSite(readFixture(name), opts);
  if (!r.ok) throw new Error(`${name}: ${r.error.kind}: ${r.error.message}`);
  return r.value;
}
const totalArea = (s: Site): number => s.buildings.reduce((a, b) => a + polygonArea(b), 0);

describe('buildSite: footprint areas', () => {
  it('measures rectangles and an L-shape exactly (shoelace formula)', () => {
    const s = site('rect_l_m_r2000.dxf');
    expect(s.units).toBe('m');
    expect(s.buildings).toHaveLength(2);
    // 20 x 10 = 200; L: 30 x 20 - 15 x 10 = 450
    expect(s.buildings.map(polygonArea).sort((a, b) => a - b)).toEqual([200, 450]);
    for (const b of s.buildings) expect(signedArea(b.outer)).toBeGreaterThan(0); // outers counter-clockwise
  });

  it('measures a circle against pi r^2 and bulged edges against the circular-segment area, within the chord tolerance', () => {
    const s = site('circle_bulge_m.dxf');
    expect(s.buildings).toHaveLength(3);
    const areas = s.buildings.map(polygonArea).sort((a, b) => a - b);
    const tol = 0.01; // default sagitta, metres
    // an inscribed polygon with sagitta <= tol loses at most arc length × tol
    const circle = Math.PI * 10 * 10; // pi r^2
    const semicircle = (Math.PI * 10 * 10) / 2;
    // circular segment r^2/2 (theta - sin theta), theta = 90°, chord 20 → r = 20 / (2 sin 45°) (mensuration, closed form)
    const theta = Math.PI / 2;
    const r = 20 / (2 * Math.sin(theta / 2));
    const bulged = 200 + (r * r / 2) * (theta - Math.sin(theta));
    const want = [semicircle, bulged, circle].sort((a, b) => a - b);
    const arcLen = [Math.PI * 10, r * theta, 2 * Math.PI * 10];
    const byArea = [semicircle, bulged, circle].map((a, i) => ({ a, l: arcLen[i] })).sort((x, y) => x.a - y.a);
    for (let i = 0; i < 3; i++) {
      expect(want[i] - areas[i]).toBeGreaterThanOrEqual(0);
      expect(want[i] - areas[i]).toBeLessThanOrEqual(byArea[i].l * tol);
    }
  });

  it('stitches LINE and ARC pieces with small gaps into a ring and reports an outline left open, with its gap', () => {
    const s = site('pieces_m.dxf');
    expect(s.buildings).toHaveLength(1);
    // 20 x 10 plus a half disc of radius 5 (pi r^2 / 2); gaps of 5 mm shift edges by at most 5 mm × 10 m
    const want = 200 + (Math.PI * 25) / 2;
    expect(Math.abs(polygonArea(s.buildings[0]) - want)).toBeLessThanOrEqual(Math.PI * 5 * 0.01 + 0.005 * 10 * 2);
    expect(s.warnings.some((w) => /gap of 0\.500/.test(w) && /\(100, 0\)/.test(w) && /\(100, 0\.500\)/.test(w))).toBe(true);
  });

  it('takes a ring inside a ring as a courtyard and unions overlapping footprints', () => {
    const s = site('courtyard_overlap_m.dxf');
    expect(s.buildings).toHaveLength(2);
    const court = s.buildings.find((b) => b.holes.length === 1)!;
    expect(polygonArea(court)).toBeCloseTo(40 * 40 - 10 * 10, 6);
    expect(signedArea(court.holes[0])).toBeLessThan(0); // holes clockwise
    const merged = s.buildings.find((b) => b.holes.length === 0)!;
    // two 10 x 10 squares overlapping 5 x 10: 100 + 100 - 50
    expect(polygonArea(merged)).toBeCloseTo(150, 6);
    expect(merged.layer).toBe('A-BLDG, A-BLDG-ANNEX');
  });

  it('unions 60 overlapping rotated rectangles to the same pieces and area as shapely', () => {
    const s = site('overlaps_m.dxf');
    const exp = expected()['overlaps_m.dxf'];
    expect(s.buildings).toHaveLength(exp.count);
    expect(s.buildings.reduce((n, b) => n + b.holes.length, 0)).toBe(exp.holes);
    // clipper works on a 0.1 mm grid (each vertex moves <= 0.07 mm): 0.05 m² over ~2.8 km of outline
    expect(Math.abs(totalArea(s) - exp.area)).toBeLessThan(0.05);
  });

  it('sums block-reference footprints with their scale factors (area × sx × sy)', () => {
    const s = site('blocks_m.dxf');
    expect(s.buildings).toHaveLength(5);
    // HOUSE is 10 x 8 = 80: plain, scale 2 (×4), mirrored, and in PAIR: plain + scale 1.5 (×2.25)
    expect(totalArea(s)).toBeCloseTo(80 + 320 + 80 + 80 + 180, 6);
  });

  it('reads an R12 drawing once the unit is given', () => {
    expect(buildSite(readFixture('polyline_r12.dxf')).ok).toBe(false);
    const s = site('polyline_r12.dxf', { units: 'ft' });
    expect(s.units).toBe('ft');
    expect(s.buildings).toHaveLength(3);
    // 40 x 20 + half disc r = 10, 30 x 30, shed 6 x 4
    const want = 800 + (Math.PI * 100) / 2 + 900 + 24;
    const a = totalArea(s);
    expect(want - a).toBeGreaterThanOrEqual(0);
    expect(want - a).toBeLessThanOrEqual(Math.PI * 10 * 0.01);
  });
});

describe('buildSite: units and frame', () => {
  it('keeps state-plane feet coordinates exact in a rounded local frame', () => {
    const d = readFixture('stateplane_ft.dxf');
    const s = site('stateplane_ft.dxf');
    const { x, y } = expected()['stateplane_ft.dxf'];
    expect(s.units).toBe('ft');
    expect(s.frame).toEqual({ originX: 6123450, originY: 2345670, scale: 1 });
    expect(totalArea(s)).toBeCloseTo(60 * 40 + 30 * 50, 6);
    const o = s.buildings.find((b) => Math.abs(polygonArea(b) - 2400) < 1e-6)!.outer;
    let minX = Infinity, minY = Infinity;
    for (let i = 0; i < o.length; i += 2) { minX = Math.min(minX, o[i]); minY = Math.min(minY, o[i + 1]); }
    // back to drawing coordinates through the frame: the original corner within 1e-9 ft
    expect(minX / s.frame.scale + s.frame.originX).toBeCloseTo(x, 9);
    expect(minY / s.frame.scale + s.frame.originY).toBeCloseTo(y, 9);
    expect(d.entities).toHaveLength(2);
  });

  it('converts millimetres to metres (1 mm = 0.001 m, DXF $INSUNITS 4)', () => {
    const s = site('mm.dxf');
    expect(s.units).toBe('m');
    expect(s.frame.scale).toBeCloseTo(0.001, 15);
    expect(totalArea(s)).toBeCloseTo(200 + 0.12, 6);
  });

  it('converts metres to feet when feet are asked for (1 ft = 0.3048 m, NIST)', () => {
    const s = site('rect_l_m_r2000.dxf', { units: 'ft' });
    expect(s.units).toBe('ft');
    expect(totalArea(s)).toBeCloseTo(650 / (0.3048 * 0.3048), 6);
  });

  it('asks for the unit of a unitless drawing, and uses the one given', () => {
    const r = buildSite(readFixture('unitless.dxf'));
    expect(!r.ok && r.error.kind).toBe('units-needed');
    expect(!r.ok && r.error.message).toMatch(/--units m or --units ft/);
    expect(totalArea(site('unitless.dxf', { units: 'ft' }))).toBe(200);
  });

  it('warns when building sizes are implausible for the unit', () => {
    expect(site('tiny_m.dxf').warnings.some((w) => /implausible/.test(w))).toBe(true);
    expect(site('rect_l_m_r2000.dxf').warnings.some((w) => /implausible/.test(w))).toBe(false);
  });

  it('uses the extents plus the margin as the default boundary', () => {
    const s = site('rect_l_m_r2000.dxf', { marginM: 5 });
    const b = s.boundary;
    // used extents 990..1110 x 1980..2020, origin (990, 1980)
    expect(Array.from(b)).toEqual([-5, -5, 125, -5, 125, 45, -5, 45]);
  });
});

describe('buildSite: roles and other layers', () => {
  it('builds pavement areas with pavement-edge crossings, crossing lines, keep-outs and the boundary ring', () => {
    const s = site('roles_m.dxf');
    expect(s.roles).toMatchObject({ BLDG: 'building', 'PAVE-ASPHALT': 'pavement', 'EX-WATER': 'crossing', FENCE: 'crossing', 'PROP-LINE': 'boundary', 'TREE-PROTECT': 'keep-out', 'ANNO-TEXT': 'ignore' });
    expect(s.pavements).toHaveLength(1);
    expect(polygonArea(s.pavements[0])).toBeCloseTo(1000, 6);
    expect(s.crossings.filter((c) => c.kind === 'pavement-edge')).toHaveLength(1);
    expect(s.crossings.filter((c) => c.kind === 'line').map((c) => c.layer).sort()).toEqual(['EX-WATER', 'FENCE']);
    expect(s.keepOuts).toHaveLength(1);
    expect(Math.abs(polygonArea(s.keepOuts[0]) - Math.PI * 16)).toBeLessThanOrEqual(2 * Math.PI * 4 * 0.01);
    expect(Math.abs(signedArea(s.boundary))).toBeCloseTo(110 * 70, 6);
    // MISC holds a 12 x 12 closed shape: a building by geometry
    expect(s.roles.MISC).toBe('building');
    expect(s.buildings).toHaveLength(2);
  });

  it('uses given roles only, warns about unknown layers and refuses unknown roles', () => {
    const d = readFixture('roles_m.dxf');
    const r = buildSite(d, { roles: { BLDG: 'building', NOPE: 'crossing' } });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.buildings).toHaveLength(1);
      expect(r.value.pavements).toHaveLength(0);
      expect(r.value.warnings.some((w) => /NOPE/.test(w))).toBe(true);
    }
    const bad = buildSite(d, { roles: { BLDG: 'house' as never } });
    expect(!bad.ok && bad.error.kind).toBe('bad-role');
  });
});

describe('buildSite: bad geometry', () => {
  it('names the layers tried and the open rings gap locations when no building outline is closed', () => {
    const r = buildSite(readFixture('open_only.dxf'));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.kind).toBe('no-buildings');
      expect(r.error.message).toMatch(/BLDG, BLDG-2/);
      expect(r.error.message).toMatch(/\(0, 0\) and \(0, 1\)/);
    }
  });

  it('repairs a self-intersecting footprint with a warning and skips a zero-area ring', () => {
    const s = site('selfcross_zero_m.dxf');
    expect(s.warnings.some((w) => /self-intersecting/.test(w) && /\(5, 5\)/.test(w))).toBe(true);
    expect(s.warnings.some((w) => /zero-area/.test(w) && /\(50, 0\)/.test(w))).toBe(true);
    // bow-tie (0,0)-(10,10)-(10,0)-(0,10): two triangles of 10 × 5 / 2 = 25 each; plus 20 x 10
    expect(totalArea(s)).toBeCloseTo(25 + 25 + 200, 6);
  });

  it('does not change the drawing and gives the same site twice', () => {
    const d = readFixture('courtyard_overlap_m.dxf');
    const before = d.entities.map((e) => (e.kind === 'polyline' ? Array.from(e.points) : []));
    const a = buildSite(d);
    const b = buildSite(d);
    expect(d.entities.map((e) => (e.kind === 'polyline' ? Array.from(e.points) : []))).toEqual(before);
    expect(JSON.stringify(a, (_k, v) => (v instanceof Float64Array ? Array.from(v) : v))).toBe(
      JSON.stringify(b, (_k, v) => (v instanceof Float64Array ? Array.from(v) : v)),
    );
  });
});

describe('buildSite: layer names', () => {
  it('matches roles to layers regardless of letter case, as DXF layer names are case-insensitive', () => {
    const r = buildSite(readFixture('roles_m.dxf'), { roles: { bldg: 'building', 'pave-asphalt': 'pavement' } });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.buildings).toHaveLength(1);
      expect(r.value.pavements).toHaveLength(1);
      expect(r.value.roles.BLDG).toBe('building');
      expect(r.value.warnings.some((w) => /does not have/.test(w))).toBe(false);
    }
  });
});

describe('buildSite: many findings', () => {
  it('lists ten open outlines one by one and sums up the rest', () => {
    const d = readFixture('rect_l_m_r2000.dxf');
    const extra = Array.from({ length: 25 }, (_, i) => ({
      kind: 'polyline' as const, layer: 'BLDG', source: 'LINE' as const, closed: false,
      points: Float64Array.from([2000 + 10 * i, 2000, 2005 + 10 * i, 2000]),
    }));
    const r = buildSite({ ...d, entities: [...d.entities, ...extra] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.warnings.filter((w) => w.startsWith('open outline'))).toHaveLength(10);
    expect(r.value.warnings).toContain('… and 15 more open outlines on building layers');
  });
});
