// Planar helpers for the site router: a bucketed index of ring edges answering "does this
// segment touch any edge" and "is this point inside", plus small vector functions.
// Rings are flat x,y pairs, not closed (site/site.ts). Inside is the even-odd rule over all rings.

import type { Ring } from '../../site/site';

/** Edges of many rings, bucketed on a square grid so segment queries look only nearby. */
export class EdgeIndex {
  readonly ex: Float64Array; // ax, ay, bx, by per edge
  readonly count: number;
  private readonly minX: number;
  private readonly minY: number;
  private readonly cell: number;
  private readonly cols: number;
  private readonly rows: number;
  private readonly start: Int32Array;
  private readonly items: Int32Array;
  private readonly stamp: Int32Array;
  private epoch = 0;

  constructor(rings: readonly Ring[], cell: number) {
    let m = 0;
    for (const r of rings) m += r.length / 2;
    this.count = m;
    this.ex = new Float64Array(m * 4);
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    let k = 0;
    for (const r of rings) {
      const nv = r.length / 2;
      for (let i = 0; i < nv; i++) {
        const j = (i + 1) % nv;
        const ax = r[2 * i], ay = r[2 * i + 1], bx = r[2 * j], by = r[2 * j + 1];
        this.ex[k++] = ax; this.ex[k++] = ay; this.ex[k++] = bx; this.ex[k++] = by;
        minX = Math.min(minX, ax, bx); minY = Math.min(minY, ay, by);
        maxX = Math.max(maxX, ax, bx); maxY = Math.max(maxY, ay, by);
      }
    }
    if (m === 0) { minX = 0; minY = 0; maxX = 1; maxY = 1; }
    this.minX = minX;
    this.minY = minY;
    this.cell = cell;
    this.cols = Math.max(1, Math.floor((maxX - minX) / cell) + 1);
    this.rows = Math.max(1, Math.floor((maxY - minY) / cell) + 1);
    const nb = this.cols * this.rows;
    const cnt = new Int32Array(nb + 1);
    const visit = (e: number, fn: (b: number) => void): void => {
      const [c0, r0, c1, r1] = this.range(
        Math.min(this.ex[4 * e], this.ex[4 * e + 2]), Math.min(this.ex[4 * e + 1], this.ex[4 * e + 3]),
        Math.max(this.ex[4 * e], this.ex[4 * e + 2]), Math.max(this.ex[4 * e + 1], this.ex[4 * e + 3]));
      for (let r = r0; r <= r1; r++) for (let c = c0; c <= c1; c++) fn(r * this.cols + c);
    };
    for (let e = 0; e < m; e++) visit(e, (b) => { cnt[b + 1]++; });
    for (let b = 0; b < nb; b++) cnt[b + 1] += cnt[b];
    this.start = cnt.slice();
    this.items = new Int32Array(cnt[nb]);
    const fill = cnt.slice(0, nb);
    for (let e = 0; e < m; e++) visit(e, (b) => { this.items[fill[b]++] = e; });
    this.stamp = new Int32Array(m);
  }

  private range(x0: number, y0: number, x1: number, y1: number): [number, number, number, number] {
    const cl = (v: number, hi: number): number => (v < 0 ? 0 : v > hi ? hi : v);
    return [
      cl(Math.floor((x0 - this.minX) / this.cell), this.cols - 1), cl(Math.floor((y0 - this.minY) / this.cell), this.rows - 1),
      cl(Math.floor((x1 - this.minX) / this.cell), this.cols - 1), cl(Math.floor((y1 - this.minY) / this.cell), this.rows - 1),
    ];
  }

  /** True when segment a-b touches any edge (closed test: touching and overlap count). */
  touches(ax: number, ay: number, bx: number, by: number): boolean {
    if (this.count === 0) return false;
    const inv = 1 / this.cell, cm = this.cols - 1, rm = this.rows - 1;
    let c0 = Math.floor((Math.min(ax, bx) - this.minX) * inv), c1 = Math.floor((Math.max(ax, bx) - this.minX) * inv);
    let r0 = Math.floor((Math.min(ay, by) - this.minY) * inv), r1 = Math.floor((Math.max(ay, by) - this.minY) * inv);
    if (c1 < 0 || r1 < 0 || c0 > cm || r0 > rm) return false;
    c0 = c0 < 0 ? 0 : c0; r0 = r0 < 0 ? 0 : r0; c1 = c1 > cm ? cm : c1; r1 = r1 > rm ? rm : r1;
    const ep = ++this.epoch;
    const ex = this.ex;
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const b = r * this.cols + c;
        for (let i = this.start[b]; i < this.start[b + 1]; i++) {
          const e = this.items[i];
          if (this.stamp[e] === ep) continue;
          this.stamp[e] = ep;
          if (segmentsTouch(ax, ay, bx, by, ex[4 * e], ex[4 * e + 1], ex[4 * e + 2], ex[4 * e + 3])) return true;
        }
      }
    }
    return false;
  }

  /** Appends to `out` the parameters t in (0,1) where a-b crosses an edge. */
  crossings(ax: number, ay: number, bx: number, by: number, out: number[]): void {
    if (this.count === 0) return;
    const inv = 1 / this.cell, cm = this.cols - 1, rm = this.rows - 1;
    let c0 = Math.floor((Math.min(ax, bx) - this.minX) * inv), c1 = Math.floor((Math.max(ax, bx) - this.minX) * inv);
    let r0 = Math.floor((Math.min(ay, by) - this.minY) * inv), r1 = Math.floor((Math.max(ay, by) - this.minY) * inv);
    if (c1 < 0 || r1 < 0 || c0 > cm || r0 > rm) return;
    c0 = c0 < 0 ? 0 : c0; r0 = r0 < 0 ? 0 : r0; c1 = c1 > cm ? cm : c1; r1 = r1 > rm ? rm : r1;
    const ep = ++this.epoch;
    const ex = this.ex;
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const b = r * this.cols + c;
        for (let i = this.start[b]; i < this.start[b + 1]; i++) {
          const e = this.items[i];
          if (this.stamp[e] === ep) continue;
          this.stamp[e] = ep;
          const t = crossingParam(ax, ay, bx, by, ex[4 * e], ex[4 * e + 1], ex[4 * e + 2], ex[4 * e + 3]);
          if (t > 0 && t < 1) out.push(t);
        }
      }
    }
  }

  /** Even-odd point-in-rings test by a ray towards +x (half-open rule on edge ends). */
  inside(px: number, py: number): boolean {
    if (this.count === 0) return false;
    const r0 = Math.floor((py - this.minY) / this.cell);
    if (r0 < 0 || r0 >= this.rows) return false;
    const c0 = Math.max(0, Math.floor((px - this.minX) / this.cell));
    const ep = ++this.epoch;
    const ex = this.ex;
    let odd = false;
    for (let c = c0; c < this.cols; c++) {
      const b = r0 * this.cols + c;
      for (let i = this.start[b]; i < this.start[b + 1]; i++) {
        const e = this.items[i];
        if (this.stamp[e] === ep) continue;
        this.stamp[e] = ep;
        const ax = ex[4 * e], ay = ex[4 * e + 1], bx = ex[4 * e + 2], by = ex[4 * e + 3];
        if ((ay > py) !== (by > py)) {
          const x = ax + ((py - ay) * (bx - ax)) / (by - ay);
          if (x > px) odd = !odd;
        }
      }
    }
    return odd;
  }
}

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

function onSeg(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

/** Closed segment intersection (touching counts). */
export function segmentsTouch(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): boolean {
  const o1 = orient(ax, ay, bx, by, cx, cy);
  const o2 = orient(ax, ay, bx, by, dx, dy);
  const o3 = orient(cx, cy, dx, dy, ax, ay);
  const o4 = orient(cx, cy, dx, dy, bx, by);
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) return true;
  if (o1 === 0 && onSeg(ax, ay, bx, by, cx, cy)) return true;
  if (o2 === 0 && onSeg(ax, ay, bx, by, dx, dy)) return true;
  if (o3 === 0 && onSeg(cx, cy, dx, dy, ax, ay)) return true;
  if (o4 === 0 && onSeg(cx, cy, dx, dy, bx, by)) return true;
  return false;
}

/**
 * Parameter t along a-b where it crosses c-d, counting a crossing only once when a-b passes
 * through a vertex (half-open at d); NaN when they do not cross.
 */
export function crossingParam(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): number {
  const rx = bx - ax, ry = by - ay, sx = dx - cx, sy = dy - cy;
  const den = rx * sy - ry * sx;
  if (den === 0) return NaN;
  const qx = cx - ax, qy = cy - ay;
  const t = (qx * sy - qy * sx) / den;
  const u = (qx * ry - qy * rx) / den;
  if (t < 0 || t > 1 || u < 0 || u >= 1) return NaN;
  return t;
}

/** Signed area (positive when counter-clockwise). */
export function ringArea(r: Ring): number {
  let a = 0;
  const n = r.length / 2;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    a += r[2 * i] * r[2 * j + 1] - r[2 * j] * r[2 * i + 1];
  }
  return a / 2;
}

/** Even-odd inside test over one polygon (outer + holes), no index (small polygons). */
export function insidePolygon(outer: Ring, holes: readonly Ring[], px: number, py: number): boolean {
  let odd = insideRing(outer, px, py);
  for (const h of holes) if (insideRing(h, px, py)) odd = !odd;
  return odd;
}

export function insideRing(r: Ring, px: number, py: number): boolean {
  let odd = false;
  const n = r.length / 2;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const ay = r[2 * i + 1], by = r[2 * j + 1];
    if ((ay > py) !== (by > py)) {
      const x = r[2 * i] + ((py - ay) * (r[2 * j] - r[2 * i])) / (by - ay);
      if (x > px) odd = !odd;
    }
  }
  return odd;
}

/** Turning angle in degrees at b along a→b→c (0 straight, 180 reversal). */
export function turnDeg(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  const ux = bx - ax, uy = by - ay, vx = cx - bx, vy = cy - by;
  const lu = Math.hypot(ux, uy), lv = Math.hypot(vx, vy);
  if (lu === 0 || lv === 0) return 0;
  const c = Math.max(-1, Math.min(1, (ux * vx + uy * vy) / (lu * lv)));
  return (Math.acos(c) * 180) / Math.PI;
}
