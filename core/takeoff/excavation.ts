// Excavation cross-section: vertical sides (shored or in a trench box, or shallow), or sloped
// sides by soil type once a protective system is needed. OSHA 29 CFR 1926 Subpart P:
// protective system from 5 ft (1926.652(a)(1)); maximum allowable slopes H:V from App. B
// Table B-1 (stable rock vertical, Type A 3/4:1, B 1:1, C 1-1/2:1); no classification → 1-1/2:1
// (1926.652(b)(1)(i)); deeper than 20 ft → designed by a registered professional engineer.

import type { SoilType, TrenchSettings } from '../settings';
import { assertNever } from '../result';
import { M_PER_FT } from '../units';

export const PROTECTIVE_DEPTH_M = 5 * M_PER_FT;
export const EGRESS_DEPTH_M = 4 * M_PER_FT;
export const ENGINEERED_DEPTH_M = 20 * M_PER_FT;

/** Maximum allowable slope, horizontal per unit vertical (Table B-1). */
export function slopeHorizontalPerVertical(soil: SoilType): number {
  switch (soil) {
    case 'rock': return 0;
    case 'A': return 0.75;
    case 'B': return 1;
    case 'C': return 1.5;
    case 'unclassified': return 1.5;
    default: return assertNever(soil, 'soil type');
  }
}

export type Protection = 'none' | 'shoring' | 'sloping';

export interface ExcavationSection {
  /** Cross-section area, bank measure. */
  areaM2: number;
  topWidthM: number;
  protection: Protection;
}

/** Cross-section of the excavation for a trench of bottom width w and depth d (metres). */
export function excavationSection(widthM: number, depthM: number, trench: Pick<TrenchSettings, 'soil' | 'protective'>): ExcavationSection {
  const needs = depthM >= PROTECTIVE_DEPTH_M && trench.soil !== 'rock';
  if (!needs) return { areaM2: widthM * depthM, topWidthM: widthM, protection: 'none' };
  if (trench.protective === 'shoring') return { areaM2: widthM * depthM, topWidthM: widthM, protection: 'shoring' };
  const k = slopeHorizontalPerVertical(trench.soil);
  // Simple slope from the trench bottom: two triangles of k·d by d added to the rectangle.
  return { areaM2: widthM * depthM + k * depthM * depthM, topWidthM: widthM + 2 * k * depthM, protection: 'sloping' };
}

/** Typical swell, bank → loose, by material, for choosing the swell setting (DOMAIN.md; practice). */
export const TYPICAL_SWELL: Readonly<Record<'sand' | 'earth' | 'clay', number>> = { sand: 0.12, earth: 0.25, clay: 0.4 };
