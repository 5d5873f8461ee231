import { describe, expect, it } from 'vitest';
import { M3_PER_YD3, M_PER_FT, convertLength, metresPerInsUnit, volumeForSchedule, areaForSchedule } from '../../core/units';
import { NOTICE_LINES, noticeText } from '../../core/notice';

describe('units', () => {
  it('uses the exact international foot and cubic yard', () => {
    // NIST / 1959 notice: 1 ft = 0.3048 m exactly; 1 yd³ = 0.764554857984 m³ exactly.
    expect(M_PER_FT).toBe(0.3048);
    expect(M3_PER_YD3).toBe(0.764554857984);
    expect(0.9144 ** 3).toBeCloseTo(M3_PER_YD3, 15);
  });

  it('maps DXF $INSUNITS codes to metres per unit', () => {
    // DXF reference, $INSUNITS: 1 in, 2 ft, 4 mm, 5 cm, 6 m, 21 US survey ft; 0 = unitless.
    expect(metresPerInsUnit(1)).toBe(0.0254);
    expect(metresPerInsUnit(2)).toBe(0.3048);
    expect(metresPerInsUnit(4)).toBe(0.001);
    expect(metresPerInsUnit(5)).toBe(0.01);
    expect(metresPerInsUnit(6)).toBe(1);
    expect(metresPerInsUnit(21)).toBeCloseTo(1200 / 3937, 15);
    expect(metresPerInsUnit(0)).toBeNull();
  });

  it('converts lengths and schedule quantities both ways', () => {
    expect(convertLength(100, 'ft', 'm')).toBeCloseTo(30.48, 12);
    expect(convertLength(30.48, 'm', 'ft')).toBeCloseTo(100, 12);
    // 27 ft³ = 1 yd³ exactly; 9 ft² = 1 yd².
    expect(volumeForSchedule(27, 'ft')).toBeCloseTo(1, 12);
    expect(areaForSchedule(9, 'ft')).toBeCloseTo(1, 12);
    expect(volumeForSchedule(5, 'm')).toBe(5);
  });
});

describe('verification notice', () => {
  it('names the one-call service, the OSHA protective-system rule and licensed review', () => {
    const text = noticeText();
    expect(text).toMatch(/811/);
    expect(text).toMatch(/1926\.652/); // OSHA 29 CFR 1926.652(a)(1): protective system at 5 ft
    expect(text).toMatch(/1\.5 m \(5 ft\)/);
    expect(text).toMatch(/licensed professional/);
    expect(NOTICE_LINES.length).toBeGreaterThanOrEqual(5);
  });
});
