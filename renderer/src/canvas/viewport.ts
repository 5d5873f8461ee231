// The view transform between drawing units and screen pixels, as plain numbers (no pixi here).
// screenX = (x - ox) * scale + tx ;  screenY = -(y - oy) * scale + ty   (drawing y points up).
// ox, oy is a local origin near the drawing so large survey coordinates keep float32 precision on the GPU.

import type { Extents } from '../../../core/dxf/drawing';

export interface Viewport {
  readonly scale: number;
  readonly tx: number;
  readonly ty: number;
  readonly ox: number;
  readonly oy: number;
}

export const MIN_SCALE = 1e-6;
export const MAX_SCALE = 1e6;

export function originFor(ext: Extents): { ox: number; oy: number } {
  return { ox: ext.minX, oy: ext.minY };
}

/** A viewport that shows the extents centred with a margin in pixels. */
export function fitViewport(ext: Extents, widthPx: number, heightPx: number, marginPx = 24): Viewport {
  const { ox, oy } = originFor(ext);
  const dx = Math.max(ext.maxX - ext.minX, 1e-9);
  const dy = Math.max(ext.maxY - ext.minY, 1e-9);
  const usableW = Math.max(widthPx - 2 * marginPx, 1);
  const usableH = Math.max(heightPx - 2 * marginPx, 1);
  const scale = clampScale(Math.min(usableW / dx, usableH / dy));
  const cx = (ext.minX + ext.maxX) / 2 - ox;
  const cy = (ext.minY + ext.maxY) / 2 - oy;
  return { scale, tx: widthPx / 2 - cx * scale, ty: heightPx / 2 + cy * scale, ox, oy };
}

/** Zoom by `factor` keeping the drawing point under the screen point (sx, sy) fixed. */
export function zoomAt(vp: Viewport, sx: number, sy: number, factor: number): Viewport {
  const scale = clampScale(vp.scale * factor);
  const f = scale / vp.scale;
  return { ...vp, scale, tx: sx - (sx - vp.tx) * f, ty: sy - (sy - vp.ty) * f };
}

export function panBy(vp: Viewport, dxPx: number, dyPx: number): Viewport {
  return { ...vp, tx: vp.tx + dxPx, ty: vp.ty + dyPx };
}

export function screenToDrawing(vp: Viewport, sx: number, sy: number): { x: number; y: number } {
  return { x: (sx - vp.tx) / vp.scale + vp.ox, y: -(sy - vp.ty) / vp.scale + vp.oy };
}

export function drawingToScreen(vp: Viewport, x: number, y: number): { x: number; y: number } {
  return { x: (x - vp.ox) * vp.scale + vp.tx, y: -(y - vp.oy) * vp.scale + vp.ty };
}

/** Wheel delta (pixels) → zoom factor; one notch of 100 px ≈ 1.2×. */
export function wheelFactor(deltaY: number): number {
  return Math.pow(1.2, -deltaY / 100);
}

/** A round scale-bar length (1, 2 or 5 × 10^k drawing units) whose bar is at most maxPx long. */
export function scaleBarLength(scalePxPerUnit: number, maxPx = 160): { length: number; px: number } {
  const maxUnits = maxPx / scalePxPerUnit;
  const pow = Math.pow(10, Math.floor(Math.log10(maxUnits)));
  let length = pow;
  for (const m of [5, 2, 1]) {
    if (m * pow <= maxUnits) { length = m * pow; break; }
  }
  return { length, px: length * scalePxPerUnit };
}

function clampScale(s: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, s));
}
