// Unit-price lookup: the most specific key first, prices converted to the schedule's unit with
// exact factors (core/units.ts).

import type { PriceItem } from '../settings';
import { M_PER_FT, M3_PER_YD3, FT2_PER_YD2 } from '../units';

type Dim = 'length' | 'area' | 'volume' | 'count';

/** Size of a unit in metres, m², m³ (or 1 for counts), with its dimension. */
export function unitSize(unit: string): { dim: Dim; size: number } | null {
  switch (unit.trim().toLowerCase()) {
    case 'm': return { dim: 'length', size: 1 };
    case 'ft': return { dim: 'length', size: M_PER_FT };
    case 'm2': case 'm²': return { dim: 'area', size: 1 };
    case 'yd2': case 'yd²': return { dim: 'area', size: M_PER_FT * M_PER_FT * FT2_PER_YD2 };
    case 'ft2': case 'ft²': return { dim: 'area', size: M_PER_FT * M_PER_FT };
    case 'm3': case 'm³': return { dim: 'volume', size: 1 };
    case 'yd3': case 'yd³': return { dim: 'volume', size: M3_PER_YD3 };
    case 'ea': case 'each': return { dim: 'count', size: 1 };
    default: return null;
  }
}

export interface PriceMatch { item: PriceItem; unitPrice: number }

/** First price among candidate keys (most specific first) whose unit converts to `unit`. */
export function findPrice(prices: readonly PriceItem[], candidates: readonly string[], unit: string): PriceMatch | null {
  const want = unitSize(unit);
  for (const key of candidates) {
    for (const p of prices) {
      if (p.key !== key) continue;
      const have = unitSize(p.unit);
      if (!want || !have) {
        if (p.unit === unit) return { item: p, unitPrice: p.price };
        continue;
      }
      if (have.dim !== want.dim) continue;
      return { item: p, unitPrice: (p.price * want.size) / have.size };
    }
  }
  return null;
}
