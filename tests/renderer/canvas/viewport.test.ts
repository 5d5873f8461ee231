// View transform: zoom keeps the point under the cursor, fit frames the extents, scale bar lengths.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { drawingToScreen, fitViewport, panBy, scaleBarLength, screenToDrawing, zoomAt } from '../../../renderer/src/canvas/viewport';

const ext = { minX: 512000, minY: 4180000, maxX: 512250, maxY: 4180160 };

describe('viewport', () => {
  it('fits the extents inside the margin, centred', () => {
    const vp = fitViewport(ext, 1000, 800, 20);
    const a = drawingToScreen(vp, ext.minX, ext.minY);
    const b = drawingToScreen(vp, ext.maxX, ext.maxY);
    expect(a.x).toBeCloseTo(20, 6); // width-limited: 960 px for 250 units
    expect(b.x).toBeCloseTo(980, 6);
    expect((a.y + b.y) / 2).toBeCloseTo(400, 6);
    expect(b.y).toBeLessThan(a.y); // y up in the drawing, down on screen
  });

  it('keeps the drawing point under the cursor fixed while zooming (property)', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0, max: 800, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (sx, sy, f) => {
      const vp = fitViewport(ext, 1000, 800);
      const before = screenToDrawing(vp, sx, sy);
      const after = screenToDrawing(zoomAt(vp, sx, sy, f), sx, sy);
      expect(Math.abs(after.x - before.x)).toBeLessThan(1e-6);
      expect(Math.abs(after.y - before.y)).toBeLessThan(1e-6);
    }));
  });

  it('pans by screen pixels and maps back and forth exactly', () => {
    const vp = panBy(fitViewport(ext, 1000, 800), 30, -12);
    const p = drawingToScreen(vp, 512100, 4180050);
    const q = screenToDrawing(vp, p.x, p.y);
    expect(q.x).toBeCloseTo(512100, 6);
    expect(q.y).toBeCloseTo(4180050, 6);
  });

  it('picks a 1-2-5 scale bar no longer than the limit', () => {
    expect(scaleBarLength(2.265, 160)).toEqual({ length: 50, px: 113.25 });
    expect(scaleBarLength(10, 160).length).toBe(10);
    expect(scaleBarLength(0.5, 160).length).toBe(200);
    for (const s of [0.001, 0.37, 3, 77, 1234]) {
      const { length, px } = scaleBarLength(s, 160);
      expect(px).toBeLessThanOrEqual(160);
      expect(px).toBeGreaterThan(160 / 5 - 1e-9);
      expect(String(length / 10 ** Math.floor(Math.log10(length)))).toMatch(/^(1|2|5)$/);
    }
  });
});
