// The routed network in screen space: the trench as a white band (APWA white = proposed
// excavation) with one thin line per utility it carries in its APWA colour, plus pull boxes,
// bends and crossings. Local routing coordinates go back to drawing units through the site frame.

import { Container, Graphics } from 'pixi.js';
import type { Frame } from '../../../core/site/site';
import { toDrawing } from '../../../core/site/siteFrame';
import { BEND_MARK, CROSSING_MARK, PULL_BOX, TRENCH_OUTLINE, hexToNumber } from '../theme';
import { drawingToScreen, type Viewport } from './viewport';

export interface NetworkSegmentView {
  id: number;
  /** Drawing units, x,y pairs. */
  points: Float64Array;
  /** Utility keys carried, in settings order. */
  utilities: string[];
  stub: boolean;
}

export interface NetworkView {
  segments: NetworkSegmentView[];
  pullBoxes: { x: number; y: number; label: string }[];
  bends: { x: number; y: number; deg: number }[];
  crossings: { x: number; y: number; layer: string }[];
  colors: Record<string, string>;
}

/** Local routing coordinates (flat pairs) back to drawing units through core's frame. */
export function localToDrawing(frame: Frame, local: ArrayLike<number>): Float64Array {
  const out = new Float64Array(local.length);
  for (let i = 0; i < local.length; i += 2) {
    const d = toDrawing(frame, local[i], local[i + 1]);
    out[i] = d.x;
    out[i + 1] = d.y;
  }
  return out;
}

export interface NetworkOverlay {
  set(view: NetworkView | null): void;
  draw(vp: Viewport): void;
}

const LINE_PX = 2;

export function createNetworkOverlay(parent: Container): NetworkOverlay {
  const g = new Graphics({ label: 'network' });
  const marks = new Graphics({ label: 'network-marks' });
  parent.addChildAt(marks, 0);
  parent.addChildAt(g, 0);
  let view: NetworkView | null = null;
  let dirty = true;
  let lastVp: Viewport | null = null;
  return {
    set(v) { view = v; dirty = true; },
    draw(vp) {
      if (!dirty && lastVp === vp) return;
      dirty = false;
      lastVp = vp;
      g.clear();
      marks.clear();
      if (!view) return;
      for (const s of view.segments) {
        const sp = toScreen(vp, s.points);
        const n = s.utilities.length;
        const band = Math.max(6, n * (LINE_PX + 1) + 4);
        strokePath(g, sp, 0).stroke({ width: band, color: TRENCH_OUTLINE, alpha: s.stub ? 0.35 : 0.22, join: 'round', cap: 'round' });
        s.utilities.forEach((u, k) => {
          const off = (k - (n - 1) / 2) * (LINE_PX + 1);
          strokePath(g, sp, off).stroke({ width: LINE_PX, color: hexToNumber(view!.colors[u] ?? '#ffffff'), join: 'round' });
        });
      }
      for (const b of view.bends) {
        const p = drawingToScreen(vp, b.x, b.y);
        marks.circle(p.x, p.y, 3).stroke({ width: 1.5, color: BEND_MARK });
      }
      for (const c of view.crossings) {
        const p = drawingToScreen(vp, c.x, c.y);
        marks.moveTo(p.x - 4, p.y - 4).lineTo(p.x + 4, p.y + 4).moveTo(p.x + 4, p.y - 4).lineTo(p.x - 4, p.y + 4).stroke({ width: 2, color: CROSSING_MARK });
      }
      for (const b of view.pullBoxes) {
        const p = drawingToScreen(vp, b.x, b.y);
        marks.rect(p.x - 5, p.y - 5, 10, 10).fill({ color: 0x1a1d17 }).stroke({ width: 2, color: PULL_BOX });
      }
    },
  };
}

function toScreen(vp: Viewport, pts: Float64Array): Float64Array {
  const out = new Float64Array(pts.length);
  for (let i = 0; i < pts.length; i += 2) {
    const p = drawingToScreen(vp, pts[i], pts[i + 1]);
    out[i] = p.x;
    out[i + 1] = p.y;
  }
  return out;
}

/** Add a polyline offset sideways by `off` pixels (mitred at vertices) to the graphics path. */
function strokePath(g: Graphics, p: Float64Array, off: number): Graphics {
  const n = p.length >> 1;
  if (n < 2) return g;
  for (let i = 0; i < n; i++) {
    let nx = 0, ny = 0;
    if (off !== 0) {
      // average of the normals of the adjacent edges, scaled for the mitre
      const e0 = i > 0 ? unitNormal(p, i - 1, i) : unitNormal(p, 0, 1);
      const e1 = i < n - 1 ? unitNormal(p, i, i + 1) : e0;
      nx = e0.x + e1.x; ny = e0.y + e1.y;
      const len = Math.hypot(nx, ny);
      if (len < 1e-9) { nx = e0.x; ny = e0.y; } else {
        nx /= len; ny /= len;
        const cos = nx * e0.x + ny * e0.y;
        const k = 1 / Math.max(cos, 0.3);
        nx *= k; ny *= k;
      }
    }
    const x = p[2 * i] + nx * off, y = p[2 * i + 1] + ny * off;
    if (i === 0) g.moveTo(x, y); else g.lineTo(x, y);
  }
  return g;
}

function unitNormal(p: Float64Array, i: number, j: number): { x: number; y: number } {
  const dx = p[2 * j] - p[2 * i], dy = p[2 * j + 1] - p[2 * i + 1];
  const l = Math.hypot(dx, dy) || 1;
  return { x: -dy / l, y: dx / l };
}
