// Role suggestions from usual survey layer names (common practice: names such as C-BLDG, V-ROAD-PAVE,
// EX-WATER are widespread; there is no single standard list) and from geometry.
import { describe, expect, it } from 'vitest';
import { layerWords, suggestRoles } from '../../../core/site/suggestRoles';
import type { Drawing, DrawingEntity } from '../../../core/dxf/drawing';
import { readFixture } from '../dxf/fixtures';

function drawingWithLayers(names: string[], closedArea?: Record<string, number>): Drawing {
  return {
    header: { version: 'AC1015', insUnits: 6, extents: { minX: 0, minY: 0, maxX: 100, maxY: 100 } },
    layers: names.map((name) => ({ name, color: 7, on: true, frozen: false })),
    entities: names.flatMap((layer): DrawingEntity[] => {
      const s = Math.sqrt(closedArea?.[layer] ?? 0);
      if (!s) return [{ kind: 'polyline' as const, layer, source: 'LINE' as const, points: Float64Array.from([0, 0, 1, 1]), closed: false }];
      return [{ kind: 'polyline' as const, layer, source: 'LWPOLYLINE' as const, points: Float64Array.from([0, 0, s, 0, s, s, 0, s]), closed: true }];
    }),
    warnings: [],
  };
}

describe('suggestRoles', () => {
  it('splits layer names into words, dropping an xref prefix', () => {
    expect(layerWords('SITEPLAN|C-BLDG-OTLN')).toEqual(['C', 'BLDG', 'OTLN']);
    expect(layerWords('ex_water 150mm')).toEqual(['EX', 'WATER', '150', 'MM']);
  });

  it('suggests roles for usual survey layer names (common practice)', () => {
    const names = ['C-BLDG', 'BUILDINGS', 'V-BLDG-FTPRNT', 'EX-BLDG', 'C-ROAD-PAVE', 'ASPHALT', 'PARKING-LOT', 'CURB', 'STREET-CURB',
      'FENCE', 'EX-WATER', 'EX-GAS', 'SAN-SEWER', 'PROP-LINE', 'BOUNDARY', 'TREE-PROTECT', 'POND-EDGE', 'ANNO-TEXT', 'C-BLDG-TEXT', 'DIMS', 'TOPO-CONTOUR', 'LOT-LINES'];
    const got = Object.fromEntries(suggestRoles(drawingWithLayers(names)).map((s) => [s.layer, s.role]));
    expect(got).toEqual({
      'C-BLDG': 'building', BUILDINGS: 'building', 'V-BLDG-FTPRNT': 'building', 'EX-BLDG': 'building',
      'C-ROAD-PAVE': 'pavement', ASPHALT: 'pavement', 'PARKING-LOT': 'pavement',
      CURB: 'crossing', 'STREET-CURB': 'crossing', FENCE: 'crossing', 'EX-WATER': 'crossing', 'EX-GAS': 'crossing', 'SAN-SEWER': 'crossing',
      'PROP-LINE': 'boundary', BOUNDARY: 'boundary', 'TREE-PROTECT': 'keep-out', 'POND-EDGE': 'keep-out',
      'ANNO-TEXT': 'ignore', 'C-BLDG-TEXT': 'ignore', DIMS: 'ignore', 'TOPO-CONTOUR': 'ignore', 'LOT-LINES': 'ignore',
    });
  });

  it('suggests building for an unnamed layer of building-size closed shapes, with the reason', () => {
    const s = suggestRoles(drawingWithLayers(['L1', 'L2', 'L3'], { L1: 400, L2: 1 }));
    expect(s.find((x) => x.layer === 'L1')).toMatchObject({ role: 'building' });
    expect(s.find((x) => x.layer === 'L1')!.reason).toMatch(/building size \(median 400 m²\)/);
    expect(s.find((x) => x.layer === 'L2')!.role).toBe('ignore');
    expect(s.find((x) => x.layer === 'L3')!.role).toBe('ignore');
  });

  it('does not take shapes that share corners like parcels, or circles, for buildings', () => {
    const sq = (x: number, y: number): DrawingEntity => ({ kind: 'polyline', layer: 'P1', source: 'LWPOLYLINE', closed: true, points: Float64Array.from([x, y, x + 30, y, x + 30, y + 40, x, y + 40]) });
    const circle = (x: number): DrawingEntity => {
      const pts: number[] = [];
      for (let i = 0; i < 32; i++) pts.push(x + 3 * Math.cos((i * Math.PI) / 16), 3 * Math.sin((i * Math.PI) / 16));
      return { kind: 'polyline', layer: 'P2', source: 'CIRCLE', closed: true, points: Float64Array.from(pts) };
    };
    const d: Drawing = {
      header: { version: 'AC1015', insUnits: 6, extents: { minX: 0, minY: 0, maxX: 200, maxY: 80 } },
      layers: [{ name: 'P1', color: 7, on: true, frozen: false }, { name: 'P2', color: 7, on: true, frozen: false }],
      entities: [sq(0, 0), sq(30, 0), sq(60, 0), sq(90, 0), sq(0, 40), sq(30, 40), circle(10), circle(30), circle(50)],
      warnings: [],
    };
    const s = Object.fromEntries(suggestRoles(d).map((x) => [x.layer, x]));
    expect(s.P1.role).toBe('ignore');
    expect(s.P1.reason).toMatch(/share corners/);
    expect(s.P2.role).toBe('ignore');
  });

  it('gives every layer of a drawing a reason', () => {
    const d = readFixture('roles_m.dxf');
    const s = suggestRoles(d);
    expect(new Set(s.map((x) => x.layer))).toEqual(new Set(d.layers.map((l) => l.name)));
    for (const x of s) expect(x.reason.length).toBeGreaterThan(5);
  });
});
