// The DXF reader against an independent writer and geometry engine (ezdxf) and closed forms.
import { describe, expect, it } from 'vitest';
import { defaultChordTolerance, readDxf, readDxfBytes } from '../../../core/dxf/readDxf';
import { interpolateFitPoints } from '../../../core/dxf/tessellate';
import type { PolylineEntity } from '../../../core/dxf/drawing';
import { distanceToPolyline, expected, fixtureBytes, pairs, readFixture } from './fixtures';

const polys = (d: ReturnType<typeof readFixture>, layer?: string): PolylineEntity[] =>
  d.entities.filter((e): e is PolylineEntity => e.kind === 'polyline' && (layer === undefined || e.layer === layer));

/** Both polylines within `tol` of each other (symmetric point-to-polyline distance). */
function expectSameCurve(ours: number[][], theirs: number[][], tol: number): void {
  for (const [x, y] of ours) expect(distanceToPolyline(x, y, theirs)).toBeLessThanOrEqual(tol);
  for (const [x, y] of theirs) expect(distanceToPolyline(x, y, ours)).toBeLessThanOrEqual(tol);
}

describe('readDxf: entities', () => {
  it('reads closed LWPOLYLINE rectangles of an R2000 file exactly, with header and layers', () => {
    const d = readFixture('rect_l_m_r2000.dxf');
    expect(d.header.version).toBe('AC1015');
    expect(d.header.insUnits).toBe(6);
    expect(d.header.extents).toEqual({ minX: 990, minY: 1980, maxX: 1110, maxY: 2020 });
    const b = polys(d, 'BLDG');
    expect(b).toHaveLength(2);
    expect(b[0].closed).toBe(true);
    expect(Array.from(b[0].points)).toEqual([1000, 2000, 1020, 2000, 1020, 2010, 1000, 2010]);
    expect(d.layers.find((l) => l.name === 'BLDG')).toMatchObject({ color: 1, on: true, frozen: false });
  });

  it('reads R12 POLYLINE bulges as arcs within the chord tolerance, ignores paper space and expands R12 INSERTs like ezdxf', () => {
    const d = readFixture('polyline_r12.dxf');
    expect(d.header.version).toBe('AC1009');
    expect(d.header.insUnits).toBe(0);
    const b = polys(d, 'BLDG');
    // paper-space 500 x 500 frame is not read: 3 model-space outlines only
    expect(b).toHaveLength(3);
    expect(d.header.extents.maxX).toBeLessThan(500);
    // bulge 1 on (40,0)->(40,20): a semicircle of radius 10 about (40,10) (bulge = tan(angle/4), DXF reference)
    const tol = defaultChordTolerance(0);
    const arcPts = pairs(b[0].points).filter(([x]) => x > 40);
    expect(arcPts.length).toBeGreaterThan(5);
    for (const [x, y] of arcPts) expect(Math.hypot(x - 40, y - 10)).toBeCloseTo(10, 9);
    // sagitta of each chord <= tol (chord midpoint distance from the circle: circle geometry, closed form)
    const ring = pairs(b[0].points);
    for (let i = 0; i < ring.length; i++) {
      const [ax, ay] = ring[i];
      const [bx, by] = ring[(i + 1) % ring.length];
      if (ax >= 40 && bx >= 40 && Math.hypot(ax - 40, ay - 10) > 9.99 && Math.hypot(bx - 40, by - 10) > 9.99) {
        expect(10 - Math.hypot((ax + bx) / 2 - 40, (ay + by) / 2 - 10)).toBeLessThanOrEqual(tol + 1e-12);
      }
    }
    // the SHED block reference (rotation 90, entity on layer 0 takes the INSERT's layer): ezdxf's decomposition
    const shed = expected()['polyline_r12.dxf'].shed[0] as number[][];
    const ours = pairs(b[2].points);
    expect(b[2].layer).toBe('BLDG');
    for (const [x, y] of ours) expect(Math.min(...shed.map(([u, v]) => Math.hypot(u - x, v - y)))).toBeLessThan(1e-9);
    const texts = d.entities.filter((e) => e.kind === 'text');
    expect(texts).toHaveLength(1);
  });

  it('expands nested, rotated, scaled and mirrored block references exactly as ezdxf does', () => {
    const d = readFixture('blocks_m.dxf');
    const exp = expected()['blocks_m.dxf'];
    const closed = polys(d).filter((e) => e.closed);
    expect(closed).toHaveLength(exp.closed.length);
    // independent library: ezdxf recursive_decompose → make_path; same vertices within 1e-9
    for (let i = 0; i < closed.length; i++) {
      const theirs: number[][] = exp.closed[i];
      for (const [x, y] of pairs(closed[i].points)) {
        expect(Math.min(...theirs.map(([u, v]) => Math.hypot(u - x, v - y)))).toBeLessThan(1e-9);
      }
    }
    // the open arcs (mirrored one included) follow ezdxf's path flattening within the chord tolerance
    // plus 1 mm for ezdxf's cubic Bezier form of an arc (radial error 2.7e-4 r, r = 2 m here)
    const arcs = polys(d).filter((e) => !e.closed);
    expect(arcs).toHaveLength(exp.arcs.length);
    for (let i = 0; i < arcs.length; i++) expectSameCurve(pairs(arcs[i].points), exp.arcs[i], 0.01 + 0.001);
    expect(new Set(polys(d).map((e) => e.layer))).toEqual(new Set(['BLDG']));
  });

  it('tessellates ELLIPSE and SPLINE within the chord tolerance of ezdxf, and maps an OCS-mirrored circle', () => {
    const d = readFixture('curves_m.dxf');
    const exp = expected()['curves_m.dxf'];
    const tol = defaultChordTolerance(6);
    expect(tol).toBeCloseTo(0.01, 15); // 1 cm in metres
    const fence = polys(d, 'EX-FENCE');
    const ell = fence.find((e) => e.source === 'ELLIPSE' && e.points[0] > 50 && e.points[0] < 150)!;
    const mell = fence.find((e) => e.source === 'ELLIPSE' && e.points[0] > 150)!;
    // an ELLIPSE with extrusion (0,0,-1) runs the other way round its centre (minor axis = N × major)
    expectSameCurve(pairs(mell.points), exp.mirroredEllipse, tol + 0.0005);
    const sp = fence.find((e) => e.source === 'SPLINE' && e.points[0] === 0 && e.points[1] === 50)!;
    // ezdxf evaluates the exact curves (flattened at 0.5 mm): the two agree within our tolerance plus theirs
    expectSameCurve(pairs(ell.points), exp.halfEllipse, tol + 0.0005);
    expectSameCurve(pairs(sp.points), exp.spline, tol + 0.0005);
    // mirrored circle: extrusion (0,0,-1) → centre at ezdxf's OCS→WCS point
    const c = polys(d, 'BLDG').find((e) => e.source === 'CIRCLE')!;
    const pts = pairs(c.points);
    const cx = pts.reduce((s, p) => s + p[0], 0) / pts.length;
    const cy = pts.reduce((s, p) => s + p[1], 0) / pts.length;
    expect(cx).toBeCloseTo(exp.ocsCircleCenter[0], 9);
    expect(cy).toBeCloseTo(exp.ocsCircleCenter[1], 9);
  });

  it('interpolates a fit-point SPLINE by global interpolation (The NURBS Book, A9.1) as ezdxf computes it', () => {
    const fit = [[0, 100], [12, 118], [30, 104], [41, 131], [63, 110], [70, 95]];
    const exp = expected()['curves_m.dxf'].fitSplineA91;
    const ours = interpolateFitPoints(fit.flat())!;
    // independent implementation of the same method: same knots and control points
    expect(Array.from(ours.knots)).toHaveLength(exp.knots.length);
    ours.knots.forEach((k, i) => expect(k).toBeCloseTo(exp.knots[i], 12));
    pairs(ours.ctrl).forEach(([x, y], i) => {
      expect(x).toBeCloseTo(exp.ctrl[i][0], 9);
      expect(y).toBeCloseTo(exp.ctrl[i][1], 9);
    });
    // the drawn curve passes through every fit point (interpolation, by definition), up to the chord error
    const d = readFixture('curves_m.dxf');
    const sp = polys(d, 'EX-FENCE').find((e) => e.source === 'SPLINE' && e.points[0] === 0 && e.points[1] === 100)!;
    for (const [x, y] of fit) expect(distanceToPolyline(x, y, pairs(sp.points))).toBeLessThanOrEqual(defaultChordTolerance(6));
  });

  it('keeps TEXT and MTEXT as plain text', () => {
    const d = readFixture('curves_m.dxf');
    const texts = d.entities.filter((e) => e.kind === 'text').map((e) => (e.kind === 'text' ? e.text : ''));
    expect(texts).toContain('UNIT 4\nNORTH');
    expect(texts).toContain('⌀ 150 WATER');
  });

  it('uses 1 cm in metric drawings and 0.03 ft in imperial ones as the default chord tolerance', () => {
    expect(defaultChordTolerance(6)).toBeCloseTo(0.01, 15);
    expect(defaultChordTolerance(4)).toBeCloseTo(10, 12); // mm
    expect(defaultChordTolerance(2)).toBeCloseTo(0.03, 15); // ft
    expect(defaultChordTolerance(1)).toBeCloseTo(0.36, 12); // in
  });

  it('tessellates a circle so its area is within perimeter × tolerance of pi r^2', () => {
    const d = readFixture('circle_bulge_m.dxf');
    const c = polys(d).find((e) => e.source === 'CIRCLE')!;
    const p = c.points;
    let a = 0;
    for (let i = 0; i < p.length; i += 2) {
      const j = (i + 2) % p.length;
      a += p[i] * p[j + 1] - p[j] * p[i + 1];
    }
    // Archimedes: pi r^2; an inscribed polygon with sagitta <= s loses at most perimeter × s
    expect(Math.abs(a / 2 - Math.PI * 100)).toBeLessThanOrEqual(2 * Math.PI * 10 * 0.01);
    expect(Math.PI * 100 - a / 2).toBeGreaterThan(0);
  });
});

describe('readDxf: bad input gives an error value', () => {
  it('says how to fix a binary DXF', () => {
    const r = readDxfBytes(fixtureBytes('binary.dxf'));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.kind).toBe('binary');
      expect(r.error.message).toMatch(/ASCII/);
    }
  });

  const kindOf = (name: string, opts = {}): string => {
    const r = readDxfBytes(fixtureBytes(name), opts);
    return r.ok ? 'ok' : r.error.kind;
  };

  it('reports truncated, garbage, empty and paper-only files', () => {
    expect(kindOf('truncated.dxf')).toBe('truncated');
    expect(kindOf('garbage.dxf')).toBe('garbage');
    expect(kindOf('empty.dxf')).toBe('empty');
    expect(kindOf('paper_only.dxf')).toBe('empty');
  });

  it('refuses a file over the size limit, with the figure', () => {
    const r = readDxfBytes(fixtureBytes('good_small.dxf'), { maxBytes: 1000 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.kind).toBe('too-large');
      expect(r.error.message).toMatch(/the file is 1\d\.\d kB, over the 1000 bytes limit/);
    }
  });

  it('guards the entity count, block depth and recursive blocks', () => {
    expect(kindOf('many_blocks_m.dxf')).toBe('ok');
    expect(kindOf('many_blocks_m.dxf', { maxEntities: 1000 })).toBe('limit');
    const deep = readDxfBytes(fixtureBytes('deep_blocks.dxf'));
    expect(!deep.ok && deep.error.kind === 'limit' && /nest deeper than 16/.test(deep.error.message)).toBe(true);
    expect(kindOf('deep_blocks.dxf', { maxBlockDepth: 25 })).toBe('ok');
    const cyc = readDxfBytes(fixtureBytes('cyclic_blocks.dxf'));
    expect(!cyc.ok && cyc.error.kind === 'limit' && /LOOP-A → LOOP-B → LOOP-A/.test(cyc.error.message)).toBe(true);
  });

  const minimal = (entities: string, header = ''): string =>
    ['0', 'SECTION', '2', 'HEADER', header, '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES', entities, '0', 'ENDSEC', '0', 'EOF', '']
      .filter((s) => s !== '').join('\n');

  it('reads a POLYLINE whose SEQEND is missing without hanging', () => {
    const ents = ['0', 'POLYLINE', '8', 'BLDG', '66', '1', '70', '1',
      '0', 'VERTEX', '8', 'BLDG', '10', '0', '20', '0', '0', 'VERTEX', '8', 'BLDG', '10', '5', '20', '0',
      '0', 'VERTEX', '8', 'BLDG', '10', '5', '20', '5',
      '0', 'LINE', '8', 'BLDG', '10', '0', '20', '0', '11', '1', '21', '1'].join('\n');
    const r = readDxf(minimal(ents, '9\n$ACADVER\n1\nAC1009'));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.entities).toHaveLength(2);
      expect(r.value.warnings.join(' ')).toMatch(/SEQEND/);
    }
  });

  it('skips a SPLINE of impossible degree', () => {
    const ents = ['0', 'SPLINE', '8', 'A', '71', '-2147483648', '11', '0', '21', '0', '11', '5', '21', '5', '11', '9', '21', '1',
      '0', 'LINE', '8', 'A', '10', '0', '20', '0', '11', '1', '21', '1'].join('\n');
    const r = readDxf(minimal(ents));
    expect(r.ok && r.value.entities.length).toBe(1);
    expect(r.ok && r.value.warnings.join(' ')).toMatch(/SPLINE \(degree not a whole number from 1 to \d+\)/);
  });

  it('skips an LWPOLYLINE without vertices instead of failing the file', () => {
    const ents = ['0', 'LWPOLYLINE', '8', 'BLDG', '90', '0', '70', '1', '0', 'LINE', '8', 'BLDG', '10', '0', '20', '0', '11', '1', '21', '1'].join('\n');
    const r = readDxf(minimal(ents));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.entities).toHaveLength(1);
  });

  it('skips entities whose coordinates are not finite numbers, with a warning', () => {
    const ents = ['0', 'LINE', '8', 'A', '10', 'nan', '20', '0', '11', '1', '21', '1',
      '0', 'LINE', '8', 'A', '10', '1e999', '20', '0', '11', '1', '21', '1',
      '0', 'LINE', '8', 'A', '10', '2', '20', '2', '11', '3', '21', '3'].join('\n');
    const r = readDxf(minimal(ents));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.entities).toHaveLength(1);
      expect(r.value.header.extents).toEqual({ minX: 2, minY: 2, maxX: 3, maxY: 3 });
      expect(r.value.warnings.join(' ')).toMatch(/skipped 2 LINE \(coordinates not finite numbers\) entities/);
    }
  });

  it('reports a file without an ENTITIES section', () => {
    const text = ['0', 'SECTION', '2', 'HEADER', '0', 'ENDSEC', '0', 'EOF'].join('\n');
    const r = readDxf(text);
    expect(!r.ok && r.error.kind).toBe('no-model-space');
  });

  it('drops paper-space entities flagged with group 67 in the ENTITIES section', () => {
    const ents = ['0', 'LINE', '8', 'A', '67', '1', '10', '0', '20', '0', '11', '1', '21', '1',
      '0', 'LINE', '8', 'A', '10', '2', '20', '2', '11', '3', '21', '3'].join('\n');
    const r = readDxf(minimal(ents));
    expect(r.ok && r.value.entities.length).toBe(1);
  });

  it('decodes Windows-1252 bytes of older files', () => {
    const text = minimal(['0', 'LINE', '8', 'BÂT', '10', '0', '20', '0', '11', '1', '21', '1'].join('\n'));
    const bytes = Uint8Array.from(text, (ch) => ch.charCodeAt(0)); // Latin-1 code points = 1252 here
    const r = readDxfBytes(bytes);
    expect(r.ok && r.value.entities[0].layer).toBe('BÂT');
  });
});

describe('readDxf: layers', () => {
  it('gives entities the layer table spelling of their layer (names are case-insensitive) and lists used layers missing from the table', () => {
    const text = ['0', 'SECTION', '2', 'TABLES', '0', 'TABLE', '2', 'LAYER', '70', '1',
      '0', 'LAYER', '2', 'Bldg', '70', '1', '62', '-3', '6', 'CONTINUOUS', '0', 'ENDTAB', '0', 'ENDSEC',
      '0', 'SECTION', '2', 'ENTITIES',
      '0', 'LINE', '8', 'BLDG', '10', '0', '20', '0', '11', '1', '21', '1',
      '0', 'LINE', '8', 'fence', '10', '0', '20', '0', '11', '1', '21', '1',
      '0', 'ENDSEC', '0', 'EOF'].join('\n');
    const r = readDxf(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.entities.map((e) => e.layer)).toEqual(['Bldg', 'fence']);
    // group 62 negative = layer off; group 70 bit 1 = frozen (DXF reference, LAYER table)
    expect(r.value.layers).toEqual([
      { name: 'Bldg', color: 3, on: false, frozen: true },
      { name: 'fence', color: 7, on: true, frozen: false },
    ]);
  });
});
