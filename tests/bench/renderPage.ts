// Browser side of the render benchmark (bundled by tests/bench/render.ts): a generated drawing of
// N entities drawn by the app's pixi canvas, and the same drawing stroked with Canvas 2D as the peer.

import type { Drawing, DrawingEntity } from '../../core/dxf/drawing';
import type { LayerRole } from '../../core/site/site';
import { createSiteCanvas } from '../../renderer/src/canvas/siteCanvas';
import { fitViewport, panBy, zoomAt, type Viewport } from '../../renderer/src/canvas/viewport';

/** Deterministic LCG (Numerical Recipes constants). */
function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
}

const LAYERS = ['BLDG', 'LOT-LINE', 'DRIVE', 'CURB', 'TREE', 'CONTOUR', 'FENCE', 'WATER-EX', 'SEWER-EX', 'ANNO'];
const ROLES: Record<string, LayerRole> = { BLDG: 'building', 'LOT-LINE': 'boundary', DRIVE: 'pavement', CURB: 'crossing', FENCE: 'crossing', 'WATER-EX': 'crossing' };

/** A subdivision-like drawing in survey coordinates (an invented town), `n` entities. */
export function makeDrawing(n: number): Drawing {
  const r = rng(7);
  const entities: DrawingEntity[] = [];
  const X0 = 512000, Y0 = 4180000;
  const side = Math.ceil(Math.sqrt(n / 5));
  for (let i = 0; entities.length < n; i++) {
    const cx = X0 + (i % side) * 30, cy = Y0 + Math.floor(i / side) * 30;
    const w = 8 + r() * 10, hgt = 8 + r() * 8;
    entities.push({ kind: 'polyline', layer: 'BLDG', source: 'LWPOLYLINE', closed: true, points: Float64Array.of(cx, cy, cx + w, cy, cx + w, cy + hgt, cx, cy + hgt) });
    entities.push({ kind: 'polyline', layer: 'LOT-LINE', source: 'LWPOLYLINE', closed: true, points: Float64Array.of(cx - 5, cy - 5, cx + 25, cy - 5, cx + 25, cy + 25, cx - 5, cy + 25) });
    entities.push({ kind: 'polyline', layer: 'DRIVE', source: 'LINE', closed: false, points: Float64Array.of(cx + w / 2, cy, cx + w / 2, cy - 5) });
    const pts: number[] = [];
    for (let k = 0; k < 8; k++) { const a = (k / 8) * Math.PI * 2; pts.push(cx + 22 + Math.cos(a) * 1.5, cy + 20 + Math.sin(a) * 1.5); }
    entities.push({ kind: 'polyline', layer: 'TREE', source: 'CIRCLE', closed: true, points: Float64Array.from(pts) });
    const layer = LAYERS[3 + (i % 6)];
    const c: number[] = [];
    for (let k = 0; k < 6; k++) c.push(cx + k * 5, cy + 27 + r() * 2);
    entities.push({ kind: 'polyline', layer, source: 'LWPOLYLINE', closed: false, points: Float64Array.from(c) });
    if (i % 200 === 0) entities.push({ kind: 'text', layer: 'ANNO', x: cx, y: cy + 2, height: 1.5, rotationDeg: 0, text: `LOT ${i}` });
  }
  entities.length = n;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const e of entities) {
    if (e.kind !== 'polyline') continue;
    for (let k = 0; k < e.points.length; k += 2) {
      minX = Math.min(minX, e.points[k]); maxX = Math.max(maxX, e.points[k]);
      minY = Math.min(minY, e.points[k + 1]); maxY = Math.max(maxY, e.points[k + 1]);
    }
  }
  return {
    header: { version: 'AC1015', insUnits: 6, extents: { minX, minY, maxX, maxY } },
    layers: LAYERS.map((name, i) => ({ name, color: i + 1, on: true, frozen: false })),
    entities,
    warnings: [],
  };
}

function pct(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
}

/** Canvas 2D peer: strokes every polyline of the drawing under the same view, per layer. */
function canvas2dDraw(ctx: CanvasRenderingContext2D, d: Drawing, vp: Viewport): void {
  ctx.setTransform(1, 0, 0, 1, 0, 0);
  ctx.fillStyle = '#1a1d17';
  ctx.fillRect(0, 0, ctx.canvas.width, ctx.canvas.height);
  ctx.setTransform(vp.scale, 0, 0, -vp.scale, vp.tx, vp.ty);
  ctx.lineWidth = 1 / vp.scale;
  ctx.strokeStyle = '#e3d5b8';
  // strokes in chunks of 500 entities (one path for everything grows slower than linearly in Skia)
  let k = 0;
  ctx.beginPath();
  for (const e of d.entities) {
    if (e.kind !== 'polyline') continue;
    const p = e.points;
    ctx.moveTo(p[0] - vp.ox, p[1] - vp.oy);
    for (let i = 2; i < p.length; i += 2) ctx.lineTo(p[i] - vp.ox, p[i + 1] - vp.oy);
    if (e.closed) ctx.closePath();
    if (++k % 500 === 0) { ctx.stroke(); ctx.beginPath(); }
  }
  ctx.stroke();
}

function sync2d(ctx: CanvasRenderingContext2D): void {
  ctx.getImageData(0, 0, 1, 1); // waits for the drawing to land
}

export interface RenderBenchResult {
  entities: number;
  renderer: string;
  firstDrawMs: number;
  frameP50Ms: number;
  frameP95Ms: number;
  frames: number;
  /** Re-rendering the whole drawing crisp once the view is still (off the interaction path). */
  settleP50Ms: number;
  /** Intervals between displayed frames while the view pans continuously (includes compositing). */
  rafP50Ms: number;
  rafP95Ms: number;
  settleMaxMs: number;
  peerFirstDrawMs: number;
  peerFrameP95Ms: number;
  nonBackgroundPixels: number;
}

export async function runRenderBench(n: number, frames: number): Promise<RenderBenchResult> {
  const host = document.getElementById('host')!;
  const drawing = makeDrawing(n);
  const view = await createSiteCanvas(host);
  const roles: Record<string, LayerRole> = {};
  for (const l of drawing.layers) roles[l.name] = ROLES[l.name] ?? 'ignore';

  // first draw: building the graphics for every entity plus the first complete frame
  const t0 = performance.now();
  view.showDrawing(drawing, roles);
  view.renderSync(true);
  const firstDrawMs = performance.now() - t0;

  // pan/zoom: each frame moves or zooms the view, renders and waits for the GPU
  const times: number[] = [];
  const { width, height } = view.size();
  for (let i = 0; i < frames; i++) {
    const vp = view.viewport();
    const next = i % 4 === 0 ? zoomAt(vp, width * 0.4, height * 0.6, i % 8 === 0 ? 1.25 : 0.8) : panBy(vp, i % 2 ? 7 : -5, i % 3 ? 4 : -6);
    view.setViewport(next);
    times.push(view.renderSync());
  }
  // continuous pan driven by requestAnimationFrame: the time between frames the browser shows
  const intervals: number[] = [];
  await new Promise<void>((resolve) => {
    let last = 0;
    let k = 0;
    const step = (t: number): void => {
      if (last) intervals.push(t - last);
      last = t;
      view.setViewport(k % 10 === 0 ? zoomAt(view.viewport(), width / 2, height / 2, k % 20 === 0 ? 1.1 : 0.91) : panBy(view.viewport(), 6, -4));
      if (++k <= 90) requestAnimationFrame(step); else resolve();
    };
    requestAnimationFrame(step);
  });
  const settles: number[] = [];
  for (let i = 0; i < 5; i++) {
    view.setViewport(panBy(view.viewport(), 11, -9));
    settles.push(view.renderSync(true));
  }
  const pixels = (() => {
    const c = document.createElement('canvas');
    c.width = 64; c.height = 64;
    const g = c.getContext('2d')!;
    view.renderSync(true);
    g.drawImage(document.querySelector('canvas.drawing-canvas') as HTMLCanvasElement, 0, 0, 64, 64);
    const data = g.getImageData(0, 0, 64, 64).data;
    let k = 0;
    for (let i = 0; i < data.length; i += 4) if (Math.abs(data[i] - 0x1a) > 12 || Math.abs(data[i + 1] - 0x1d) > 12 || Math.abs(data[i + 2] - 0x17) > 12) k++;
    return k;
  })();

  // peer: Canvas 2D, same drawing, same views
  const c2 = document.createElement('canvas');
  c2.width = width; c2.height = height;
  document.body.append(c2);
  const ctx = c2.getContext('2d')!;
  const vp0 = fitViewport(drawing.header.extents, width, height);
  const p0 = performance.now();
  canvas2dDraw(ctx, drawing, vp0);
  sync2d(ctx);
  const peerFirstDrawMs = performance.now() - p0;
  const peerTimes: number[] = [];
  let vp = vp0;
  for (let i = 0; i < 5; i++) { // the peer redraws everything each frame: 5 frames keep the run short
    vp = i % 4 === 0 ? zoomAt(vp, width * 0.4, height * 0.6, i % 8 === 0 ? 1.25 : 0.8) : panBy(vp, i % 2 ? 7 : -5, i % 3 ? 4 : -6);
    const s = performance.now();
    canvas2dDraw(ctx, drawing, vp);
    sync2d(ctx);
    peerTimes.push(performance.now() - s);
  }
  return {
    entities: n,
    renderer: view.canvas.getAttribute('data-renderer') ?? '?',
    firstDrawMs, frameP50Ms: pct(times, 50), frameP95Ms: pct(times, 95), frames,
    rafP50Ms: pct(intervals, 50), rafP95Ms: pct(intervals, 95),
    settleP50Ms: pct(settles, 50), settleMaxMs: Math.max(...settles),
    peerFirstDrawMs, peerFrameP95Ms: pct(peerTimes, 95), nonBackgroundPixels: pixels,
  };
}

(window as unknown as { runRenderBench: typeof runRenderBench }).runRenderBench = runRenderBench;
