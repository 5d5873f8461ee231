// Overlap detection against the brute-force all-pairs test (the closed definition of box overlap);
// polygon assembly against closed-form areas.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assemblePolygons, overlappingPairs, polygonArea } from '../../../core/site/polygonSet';
import { boxesOverlap, signedArea, type Box } from '../../../core/site/rings';

describe('overlappingPairs', () => {
  it('reports exactly the overlapping pairs, each once, for random boxes of mixed sizes', () => {
    const box = fc.tuple(fc.double({ min: 0, max: 500, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }),
      fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }), fc.integer({ min: 0, max: 9 }).map((k) => k === 0))
      .map(([x, y, w, h, huge]): Box => ({ minX: x, minY: y, maxX: x + (huge ? 3000 : w), maxY: y + (huge ? 3000 : h) }));
    fc.assert(fc.property(fc.array(box, { minLength: 0, maxLength: 120 }), (boxes) => {
      const got: string[] = [];
      overlappingPairs(boxes, (a, b) => got.push(`${Math.min(a, b)}-${Math.max(a, b)}`));
      const want: string[] = [];
      for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) if (boxesOverlap(boxes[i], boxes[j])) want.push(`${i}-${j}`);
      expect(got.sort()).toEqual(want.sort());
    }), { numRuns: 200, seed: 11 });
  });
});

describe('assemblePolygons', () => {
  const rect = (x: number, y: number, w: number, h: number): Float64Array => Float64Array.from([x, y, x + w, y, x + w, y + h, x, y + h]);
  it('nests a courtyard and an island in it by containment parity, and unions overlaps (areas: closed form)', () => {
    const polys = assemblePolygons([
      { ring: rect(0, 0, 40, 40), layer: 'B' },
      { ring: rect(10, 10, 20, 20), layer: 'B' }, // courtyard
      { ring: rect(15, 15, 6, 6), layer: 'B' }, // a building inside the courtyard
      { ring: rect(35, 35, 10, 10), layer: 'B2' }, // overlaps the outer corner by 5 x 5
    ]);
    expect(polys).toHaveLength(2);
    const big = polys.find((p) => p.holes.length === 1)!;
    // 40² + 10² − 5² (overlap) − 20² (courtyard)
    expect(polygonArea(big)).toBeCloseTo(1600 + 100 - 25 - 400, 6);
    expect(signedArea(big.outer)).toBeGreaterThan(0);
    expect(signedArea(big.holes[0])).toBeLessThan(0);
    const island = polys.find((p) => p.holes.length === 0)!;
    expect(polygonArea(island)).toBeCloseTo(36, 6);
    expect(big.layer).toBe('B, B2');
  });
});
