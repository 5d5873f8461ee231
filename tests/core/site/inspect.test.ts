// The pure inspect report the app and the CLI share.
import { describe, expect, it } from 'vitest';
import { buildSite } from '../../../core/site/buildSite';
import { inspectDrawing, inspectText } from '../../../core/site/inspect';
import { readFixture } from '../dxf/fixtures';

describe('inspectDrawing', () => {
  it('reports counts per layer, roles with reasons and the net footprint area (40² − 10² + 150, closed form)', () => {
    const d = readFixture('courtyard_overlap_m.dxf');
    const s = buildSite(d);
    expect(s.ok).toBe(true);
    if (!s.ok) return;
    const r = inspectDrawing(d, s.value);
    expect(r.units).toBe('m');
    expect(r.buildings.count).toBe(2);
    expect(r.buildings.area).toBeCloseTo(1650, 6);
    expect(r.layers.find((l) => l.name === 'A-BLDG')).toEqual({ name: 'A-BLDG', entities: 3, role: 'building', reason: "suggested: layer name contains 'BLDG'" });
    expect(r.extents).toEqual(d.header.extents);
    expect(inspectText(r)).toMatch(/buildings 2, footprint area 1650\.00 m²/);
  });

  it('carries the site error and no units when the site cannot be built', () => {
    const d = readFixture('unitless.dxf');
    const s = buildSite(d);
    expect(s.ok).toBe(false);
    if (s.ok) return;
    const r = inspectDrawing(d, s.error);
    expect(r.units).toBeNull();
    expect(r.error?.kind).toBe('units-needed');
    expect(r.buildings).toEqual({ count: 0, area: 0 });
  });
});
