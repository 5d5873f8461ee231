// A 100 m straight trench, computed by hand here and compared with the take-off.
import { describe, expect, it } from 'vitest';
import { computeTakeOff } from '../../../core/takeoff/takeoff';
import { slopeHorizontalPerVertical } from '../../../core/takeoff/excavation';
import { trenchSection } from '../../../core/takeoff/section';
import { defaultSettings, DEFAULT_UTILITIES } from '../../../core/settings';
import type { Settings, SoilType, UtilitySetting } from '../../../core/settings';
import { singleRun } from './handNetwork';

const IN = 0.0254; // 1 in = 0.0254 m exactly (NIST)
const M3_PER_YD3 = 0.764554857984; // 1 yd³ = 0.764554857984 m³ exactly (NIST)

/** One deep water main: 4.5 in OD at 60 in cover (a frost-depth setting), so the trench passes 5 ft. */
function deepSettings(soil: SoilType, protective: 'shoring' | 'sloping'): Settings {
  const s = defaultSettings();
  const water = { ...(DEFAULT_UTILITIES.find((u) => u.key === 'water') as UtilitySetting), diameterIn: 4.5, coverIn: { soft: 60, pavement: 60 } };
  s.utilities = [water];
  s.trench = { ...s.trench, soil, protective };
  return s;
}

// Hand section: width = max(12 in, 4.5 + 2 × 6) = 16.5 in; depth = 60 + 4.5 + 6 (bedding) = 70.5 in (> 60 in = 5 ft).
const W = 16.5 * IN;
const D = 70.5 * IN;
const L = 100;

describe('100 m straight trench', () => {
  const { net, terminals } = singleRun([0, 0, 100, 0], ['water']);

  it('vertical sides with shoring: V = W·D·L and 100 m of protective system (OSHA 1926.652(a)(1): from 5 ft)', () => {
    const t = computeTakeOff(net, terminals, deepSettings('B', 'shoring'));
    expect(t.segments[0].width).toBeCloseTo(W, 3);
    expect(t.segments[0].depth).toBeCloseTo(D, 3);
    expect(t.totals.excavation).toBeCloseTo(W * D * L, 2);
    expect(t.lines.find((l) => l.key === 'protective')?.quantity).toBeCloseTo(100, 3);
    expect(t.warnings.some((w) => w.includes('1926.652'))).toBe(true);
  });

  // OSHA 29 CFR 1926 Subpart P App. B Table B-1, maximum allowable slopes (H:V): A 3/4:1, B 1:1, C 1-1/2:1.
  const tableB1: [SoilType, number][] = [['A', 0.75], ['B', 1], ['C', 1.5]];
  for (const [soil, k] of tableB1) {
    it(`sloped sides in Type ${soil} soil (${k}:1, Table B-1): V = (W·D + ${k}·D²)·L`, () => {
      expect(slopeHorizontalPerVertical(soil)).toBe(k);
      const t = computeTakeOff(net, terminals, deepSettings(soil, 'sloping'));
      const exc = (W * D + k * D * D) * L;
      expect(t.totals.excavation).toBeCloseTo(exc, 2);
      const bed = W * 6 * IN * L;
      const duct = (Math.PI * (4.5 * IN) ** 2 / 4) * L;
      expect(t.totals.bedding).toBeCloseTo(bed, 2);
      expect(t.totals.backfill).toBeCloseTo(exc - bed - duct, 2);
      // Spoil reused; the displaced bank volume is hauled loose with 25 % swell (common earth, practice).
      expect(t.totals.haul).toBeCloseTo((bed + duct) * 1.25, 2);
      expect(t.lines.some((l) => l.key === 'protective')).toBe(false);
    });
  }

  it('no slope below 5 ft even when sloping is chosen (OSHA 1926.652(a)(1))', () => {
    const s = deepSettings('C', 'sloping');
    s.utilities[0].coverIn = { soft: 36, pavement: 36 }; // depth 46.5 in < 60 in
    const t = computeTakeOff(net, terminals, s);
    expect(t.totals.excavation).toBeCloseTo(W * 46.5 * IN * L, 2);
  });

  it('reports in US customary units with exact factors (1 ft = 0.3048 m, 1 yd³ = 0.764554857984 m³; NIST)', () => {
    const s = deepSettings('B', 'sloping');
    const m = computeTakeOff(net, terminals, s);
    s.units = 'ft';
    const us = computeTakeOff(net, terminals, s);
    expect(us.labels).toEqual({ length: 'ft', area: 'yd²', volume: 'yd³' });
    expect(us.totals.trenchLength).toBeCloseTo(100 / 0.3048, 3);
    expect(us.totals.excavation).toBeCloseTo(((W * D + D * D) * L) / M3_PER_YD3, 2);
    expect(us.totals.excavation * M3_PER_YD3).toBeCloseTo(m.totals.excavation, 2);
  });
});

describe('cover depths (NFPA 70 NEC 2023 Table 300.5, column 3, nonmetallic raceway)', () => {
  const power = DEFAULT_UTILITIES.find((u) => u.key === 'power') as UtilitySetting;
  it('defaults are 18 in in all other locations and 24 in under roads and parking lots', () => {
    expect(power.coverIn).toEqual({ soft: 18, pavement: 24 });
  });
  it('one conduit: depth = cover + OD + bedding, for each surface', () => {
    const tr = defaultSettings().trench;
    expect(trenchSection([{ utility: 'power', conduits: 1 }], [power], tr, 'soft').depthM).toBeCloseTo((18 + 2.375 + 6) * IN, 9);
    expect(trenchSection([{ utility: 'power', conduits: 1 }], [power], tr, 'pavement').depthM).toBeCloseTo((24 + 2.375 + 6) * IN, 9);
  });
  it('gas main default cover is 24 in (49 CFR 192.327(b))', () => {
    expect(DEFAULT_UTILITIES.find((u) => u.key === 'gas')?.coverIn.soft).toBe(24);
  });
});
