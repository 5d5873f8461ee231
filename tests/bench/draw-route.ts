// Draws the demo site's routed trench with our own tiny rasteriser (pngjs for the file only) and
// writes assets/demo/route.png. Run: npx tsx tests/bench/draw-route.ts [out.png]

import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { PNG } from 'pngjs';
import { DEFAULT_ROUTE } from '../../core/settings';
import { routeSite } from '../../core/route/site/routeSite';
import type { Ring } from '../../core/site/site';
import { loadDemo } from '../core/route/site/demoSite';

type RGB = [number, number, number];
const hex = (h: string): RGB => [parseInt(h.slice(1, 3), 16), parseInt(h.slice(3, 5), 16), parseInt(h.slice(5, 7), 16)];
// Furrow's own palette.
const PAPER = hex('#f6f3ec'), PAVE = hex('#d8d4cb'), BUILDING = hex('#55626c'), KEEPOUT = hex('#b9d3bd'),
  EDGE = hex('#2e3338'), FEATURE = hex('#8c6d46'), TRENCH = hex('#c4472f'), STUB = hex('#7a2b1c'), NODE = hex('#1f2a33');

export function drawRoute(outFile: string): { width: number; height: number; bytes: number } {
  const { site, terminals } = loadDemo();
  const net = routeSite(site, terminals, { ...DEFAULT_ROUTE });
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < site.boundary.length; i += 2) {
    minX = Math.min(minX, site.boundary[i]); maxX = Math.max(maxX, site.boundary[i]);
    minY = Math.min(minY, site.boundary[i + 1]); maxY = Math.max(maxY, site.boundary[i + 1]);
  }
  const S = 4, M = 12; // pixels per metre, margin
  const W = Math.ceil((maxX - minX) * S) + 2 * M, H = Math.ceil((maxY - minY) * S) + 2 * M;
  const png = new PNG({ width: W, height: H });
  const px = (x: number): number => (x - minX) * S + M;
  const py = (y: number): number => H - ((y - minY) * S + M);
  const set = (x: number, y: number, c: RGB): void => {
    if (x < 0 || y < 0 || x >= W || y >= H) return;
    const k = (y * W + x) * 4;
    png.data[k] = c[0]; png.data[k + 1] = c[1]; png.data[k + 2] = c[2]; png.data[k + 3] = 255;
  };
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) set(x, y, PAPER);

  /** Even-odd scanline fill of rings given in site coordinates. */
  const fill = (rings: Ring[], c: RGB): void => {
    for (let y = 0; y < H; y++) {
      const yc = y + 0.5;
      const xs: number[] = [];
      for (const r of rings) {
        const n = r.length / 2;
        for (let i = 0; i < n; i++) {
          const j = (i + 1) % n;
          const ay = py(r[2 * i + 1]), by = py(r[2 * j + 1]);
          if ((ay > yc) === (by > yc)) continue;
          const ax = px(r[2 * i]), bx = px(r[2 * j]);
          xs.push(ax + ((yc - ay) * (bx - ax)) / (by - ay));
        }
      }
      xs.sort((a, b) => a - b);
      for (let k = 0; k + 1 < xs.length; k += 2) for (let x = Math.ceil(xs[k] - 0.5); x < xs[k + 1] - 0.5; x++) set(x, y, c);
    }
  };
  /** Thick segment: pixels within w/2 of the segment. */
  const line = (x0: number, y0: number, x1: number, y1: number, w: number, c: RGB): void => {
    const ax = px(x0), ay = py(y0), bx = px(x1), by = py(y1);
    const r = w / 2;
    const dx = bx - ax, dy = by - ay, l2 = dx * dx + dy * dy;
    for (let y = Math.floor(Math.min(ay, by) - r); y <= Math.ceil(Math.max(ay, by) + r); y++) {
      for (let x = Math.floor(Math.min(ax, bx) - r); x <= Math.ceil(Math.max(ax, bx) + r); x++) {
        const t = l2 > 0 ? Math.max(0, Math.min(1, ((x + 0.5 - ax) * dx + (y + 0.5 - ay) * dy) / l2)) : 0;
        if (Math.hypot(x + 0.5 - (ax + t * dx), y + 0.5 - (ay + t * dy)) <= r) set(x, y, c);
      }
    }
  };
  const poly = (p: ArrayLike<number>, closed: boolean, w: number, c: RGB): void => {
    const n = p.length / 2;
    for (let i = 0; i + 1 < n; i++) line(p[2 * i], p[2 * i + 1], p[2 * i + 2], p[2 * i + 3], w, c);
    if (closed && n > 2) line(p[2 * n - 2], p[2 * n - 1], p[0], p[1], w, c);
  };
  const square = (x: number, y: number, half: number, c: RGB): void => {
    for (let yy = Math.round(py(y) - half); yy <= Math.round(py(y) + half); yy++) for (let xx = Math.round(px(x) - half); xx <= Math.round(px(x) + half); xx++) set(xx, yy, c);
  };

  for (const p of site.pavements) fill([p.outer, ...p.holes], PAVE);
  for (const k of site.keepOuts) fill([k.outer, ...k.holes], KEEPOUT);
  for (const b of site.buildings) fill([b.outer, ...b.holes], BUILDING);
  for (const c of site.crossings) if (c.kind === 'line') poly(c.points, c.closed, 1.5, FEATURE);
  poly(site.boundary, true, 2, EDGE);
  for (const s of net.segments) poly(s.points, false, s.stub ? 2.5 : 4, s.stub ? STUB : TRENCH);
  for (const n of net.nodes) {
    if (n.kind === 'junction') square(n.x, n.y, 3, NODE);
    else if (n.kind === 'connection') { square(n.x, n.y, 6, NODE); square(n.x, n.y, 3, TRENCH); }
    else if (n.kind === 'service') square(n.x, n.y, 4, NODE);
  }
  const bytes = PNG.sync.write(png, { colorType: 2 });
  writeFileSync(outFile, bytes);
  return { width: W, height: H, bytes: bytes.length };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const out = process.argv[2] ?? fileURLToPath(new URL('../../assets/demo/route.png', import.meta.url));
  console.log(JSON.stringify(drawRoute(out)));
}
