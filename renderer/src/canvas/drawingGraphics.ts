// Turns a Drawing into one pixi Graphics per layer: white 1-pixel strokes tinted by the layer's role,
// so changing a role only changes a tint. Coordinates are shifted to the viewport origin (float32 safety).

import { Container, Graphics, Text } from 'pixi.js';
import type { Drawing } from '../../../core/dxf/drawing';
import type { LayerRole } from '../../../core/site/site';
import { ROLE_COLOR } from '../theme';

/** Drawing text beyond this many labels is skipped (counted and reported, never silently). */
export const MAX_DRAWN_TEXTS = 1500;

export interface DrawingGraphics {
  root: Container;
  byLayer: Map<string, Graphics>;
  textsByLayer: Map<string, Container>;
  skippedTexts: number;
  segmentCount: number;
}

export function buildDrawingGraphics(drawing: Drawing, ox: number, oy: number): DrawingGraphics {
  const root = new Container({ label: 'drawing' });
  const byLayer = new Map<string, Graphics>();
  const textsByLayer = new Map<string, Container>();
  const layerOrder = new Map<string, number>();
  drawing.layers.forEach((l, i) => layerOrder.set(l.name, i));
  let skippedTexts = 0;
  let drawnTexts = 0;
  let segmentCount = 0;

  const graphicsFor = (layer: string): Graphics => {
    let g = byLayer.get(layer);
    if (!g) {
      g = new Graphics({ label: `layer:${layer}` });
      byLayer.set(layer, g);
    }
    return g;
  };

  for (const e of drawing.entities) {
    if (e.kind === 'polyline') {
      const p = e.points;
      const n = p.length >> 1;
      if (n < 2) continue;
      const g = graphicsFor(e.layer);
      g.moveTo(p[0] - ox, p[1] - oy);
      for (let i = 1; i < n; i++) g.lineTo(p[2 * i] - ox, p[2 * i + 1] - oy);
      if (e.closed && n > 2) g.closePath();
      segmentCount += e.closed ? n : n - 1;
    } else {
      if (drawnTexts >= MAX_DRAWN_TEXTS || !(e.height > 0)) { skippedTexts++; continue; }
      drawnTexts++;
      let holder = textsByLayer.get(e.layer);
      if (!holder) {
        holder = new Container({ label: `text:${e.layer}` });
        textsByLayer.set(e.layer, holder);
      }
      const fontPx = 32;
      // Text from a drawing is drawn as glyphs only; pixi Text never interprets markup.
      const t = new Text({ text: e.text, style: { fontFamily: 'sans-serif', fontSize: fontPx, fill: 0xffffff } });
      t.anchor.set(0, 1);
      const k = e.height / fontPx;
      t.scale.set(k, -k);
      t.position.set(e.x - ox, e.y - oy);
      t.rotation = (e.rotationDeg * Math.PI) / 180;
      holder.addChild(t);
    }
  }
  for (const g of byLayer.values()) g.stroke({ width: 1, color: 0xffffff, pixelLine: true });

  const names = new Set<string>([...byLayer.keys(), ...textsByLayer.keys()]);
  const ordered = [...names].sort((a, b) => (layerOrder.get(a) ?? 1e9) - (layerOrder.get(b) ?? 1e9) || (a < b ? -1 : a > b ? 1 : 0));
  for (const name of ordered) {
    const g = byLayer.get(name);
    if (g) root.addChild(g);
    const t = textsByLayer.get(name);
    if (t) root.addChild(t);
  }
  return { root, byLayer, textsByLayer, skippedTexts, segmentCount };
}

/** Recolour and show/hide layers by role ('ignore' layers are dimmed, not hidden). */
export function applyRoles(dg: DrawingGraphics, roles: Record<string, LayerRole>, hidden: ReadonlySet<string>): void {
  for (const [name, g] of dg.byLayer) {
    g.tint = ROLE_COLOR[roles[name] ?? 'ignore'];
    g.visible = !hidden.has(name);
  }
  for (const [name, t] of dg.textsByLayer) {
    t.tint = ROLE_COLOR[roles[name] ?? 'ignore'];
    t.visible = !hidden.has(name);
  }
}
