// Overlap detection against the brute-force all-pairs test (the closed definition of box overlap).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { overlappingPairs } from '../../../core/site/polygonSet';
import { boxesOverlap, type Box } from '../../../core/site/rings';

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
