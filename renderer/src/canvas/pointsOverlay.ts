// Service and connection points, the selection and the wall-snap cue, drawn in screen space so
// they keep their size at any zoom.

import { Container, Graphics, Text } from 'pixi.js';
import type { PointInput } from '../../../core/site/site';
import { CROSSING_MARK, POINT_CONNECTION, POINT_SELECTED, POINT_SERVICE, SNAP_CUE } from '../theme';
import { drawingToScreen, type Viewport } from './viewport';

export interface SnapCue {
  /** Where the pointer is and where the point would go (drawing units). */
  pointer: { x: number; y: number };
  target: { x: number; y: number } | null;
  /** Outward wall normal at the target (for the stub direction tick). */
  normal: { x: number; y: number } | null;
}

export interface PointsOverlay {
  setPoints(points: readonly PointInput[], selected: string | null): void;
  setCue(cue: SnapCue | null): void;
  draw(vp: Viewport): void;
}

const LABEL_LIMIT = 400;

export function createPointsOverlay(parent: Container): PointsOverlay {
  const g = new Graphics({ label: 'points' });
  const cueG = new Graphics({ label: 'snap-cue' });
  const labels = new Container({ label: 'point-labels' });
  parent.addChild(g, labels, cueG);
  let points: readonly PointInput[] = [];
  let selected: string | null = null;
  let cue: SnapCue | null = null;
  let dirty = true;
  let lastVp: Viewport | null = null;
  const labelPool: Text[] = [];

  const labelAt = (i: number): Text => {
    let t = labelPool[i];
    if (!t) {
      t = new Text({ text: '', style: { fontFamily: 'sans-serif', fontSize: 11, fill: 0xebe6da } });
      labelPool[i] = t;
      labels.addChild(t);
    }
    t.visible = true;
    return t;
  };

  return {
    setPoints(p, sel) { points = p; selected = sel; dirty = true; },
    setCue(c) { cue = c; dirty = true; },
    draw(vp) {
      if (!dirty && lastVp === vp) return;
      dirty = false;
      lastVp = vp;
      g.clear();
      points.forEach((p, i) => {
        const s = drawingToScreen(vp, p.x, p.y);
        const isSel = p.id === selected;
        if (p.role === 'service') {
          g.circle(s.x, s.y, isSel ? 7 : 5).fill({ color: isSel ? POINT_SELECTED : POINT_SERVICE }).stroke({ width: 1.5, color: 0x1a1d17 });
        } else {
          const r = isSel ? 9 : 7;
          g.poly([s.x, s.y - r, s.x + r, s.y, s.x, s.y + r, s.x - r, s.y]).fill({ color: isSel ? POINT_SELECTED : POINT_CONNECTION }).stroke({ width: 1.5, color: 0x1a1d17 });
        }
        if (i < LABEL_LIMIT) {
          const t = labelAt(i);
          t.text = p.id; // drawn as glyphs; ids are never interpreted as markup
          t.position.set(s.x + 8, s.y - 16);
        }
      });
      for (let i = Math.min(points.length, LABEL_LIMIT); i < labelPool.length; i++) labelPool[i].visible = false;

      cueG.clear();
      if (cue) {
        const p = drawingToScreen(vp, cue.pointer.x, cue.pointer.y);
        if (cue.target) {
          const t = drawingToScreen(vp, cue.target.x, cue.target.y);
          cueG.moveTo(p.x, p.y).lineTo(t.x, t.y).stroke({ width: 1, color: SNAP_CUE, alpha: 0.7 });
          cueG.circle(t.x, t.y, 8).stroke({ width: 2, color: SNAP_CUE });
          if (cue.normal) {
            // the stub leaves the wall along the outward normal (screen y is flipped)
            cueG.moveTo(t.x, t.y).lineTo(t.x + cue.normal.x * 18, t.y - cue.normal.y * 18).stroke({ width: 2, color: SNAP_CUE });
          }
        } else {
          cueG.moveTo(p.x - 6, p.y - 6).lineTo(p.x + 6, p.y + 6).moveTo(p.x + 6, p.y - 6).lineTo(p.x - 6, p.y + 6)
            .stroke({ width: 2, color: CROSSING_MARK });
        }
      }
    },
  };
}
