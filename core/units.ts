// Length units and exact conversion factors — the one place where units change.
// 1 ft = 0.3048 m exactly; 1 yd3 = 0.764554857984 m3 exactly (NIST, 1959 international foot).

export type LengthUnit = 'm' | 'ft';

export const M_PER_FT = 0.3048;
export const M_PER_IN = 0.0254;
export const M3_PER_YD3 = 0.764554857984;
export const FT2_PER_YD2 = 9;
export const US_SURVEY_FT_M = 1200 / 3937;

/** DXF $INSUNITS code → metres per drawing unit (null: unitless or unsupported). DXF reference. */
export function metresPerInsUnit(code: number): number | null {
  switch (code) {
    case 1: return M_PER_IN;
    case 2: return M_PER_FT;
    case 3: return 1609.344;
    case 4: return 0.001;
    case 5: return 0.01;
    case 6: return 1;
    case 7: return 1000;
    case 10: return 0.9144;
    case 21: return US_SURVEY_FT_M;
    default: return null;
  }
}

export function metresPerUnit(u: LengthUnit): number {
  return u === 'm' ? 1 : M_PER_FT;
}

/** Convert a length between routing units. */
export function convertLength(value: number, from: LengthUnit, to: LengthUnit): number {
  if (from === to) return value;
  return (value * metresPerUnit(from)) / metresPerUnit(to);
}

/** A length given in metres, expressed in `to` units. */
export function fromMetres(valueM: number, to: LengthUnit): number {
  return valueM / metresPerUnit(to);
}

/** A length in `from` units, expressed in metres. */
export function toMetres(value: number, from: LengthUnit): number {
  return value * metresPerUnit(from);
}

export const inchesToMetres = (inches: number): number => inches * M_PER_IN;
export const metresToInches = (m: number): number => m / M_PER_IN;

/** Unit labels for schedules: linear, area, volume. */
export function unitLabels(u: LengthUnit): { length: string; area: string; volume: string } {
  return u === 'm' ? { length: 'm', area: 'm²', volume: 'm³' } : { length: 'ft', area: 'yd²', volume: 'yd³' };
}

/** Area in routing units² → schedule area unit (m² or yd²). */
export function areaForSchedule(area: number, u: LengthUnit): number {
  return u === 'm' ? area : area / FT2_PER_YD2;
}

/** Volume in routing units³ → schedule volume unit (m³ or yd³). */
export function volumeForSchedule(volume: number, u: LengthUnit): number {
  return u === 'm' ? volume : (volume * M_PER_FT ** 3) / M3_PER_YD3;
}
