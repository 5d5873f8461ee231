// Small geometry on flat x,y rings: signed area (shoelace formula), bounding box, even-odd
// point-in-ring test, and a proper self-intersection check for simple-polygon validation.

export function signedArea(r: ArrayLike<number>): number {
  const n = r.length;
  if (n < 6) return 0;
  let s = 0;
  // shoelace, relative to the first vertex for precision
  const x0 = r[0], y0 = r[1];
  for (let i = 2; i + 2 < n; i += 2) {
    s += (r[i] - x0) * (r[i + 3] - y0) - (r[i + 2] - x0) * (r[i + 1] - y0);
  }
  return s / 2;
}

export interface Box { minX: number; minY: number; maxX: number; maxY: number }

export function boxOf(r: ArrayLike<number>): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < r.length; i += 2) {
    const x = r[i], y = r[i + 1];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return { minX, minY, maxX, maxY };
}

export const boxContains = (a: Box, b: Box): boolean =>
  a.minX <= b.minX && a.minY <= b.minY && a.maxX >= b.maxX && a.maxY >= b.maxY;

export const boxesOverlap = (a: Box, b: Box): boolean =>
  a.minX <= b.maxX && b.minX <= a.maxX && a.minY <= b.maxY && b.minY <= a.maxY;

/** Even-odd crossing test; points exactly on an edge may fall either way. */
export function pointInRing(x: number, y: number, r: ArrayLike<number>): boolean {
  let inside = false;
  const n = r.length;
  for (let i = 0, j = n - 2; i < n; j = i, i += 2) {
    const xi = r[i], yi = r[i + 1], xj = r[j], yj = r[j + 1];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** A copy of the ring in the opposite direction. */
export function reversed(r: Float64Array): Float64Array {
  const out = new Float64Array(r.length);
  const n = r.length / 2;
  for (let i = 0; i < n; i++) {
    out[2 * i] = r[2 * (n - 1 - i)];
    out[2 * i + 1] = r[2 * (n - 1 - i) + 1];
  }
  return out;
}

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

/**
 * First pair of non-adjacent edges that cross or touch, as the crossing point; null when the ring is
 * simple. Edges are sorted by min x and swept, so typical rings cost about n log n.
 */
export function selfIntersection(r: ArrayLike<number>): { x: number; y: number } | null {
  const n = r.length / 2;
  if (n < 4) return null;
  if (n <= 24) return selfIntersectionSmall(r, n);
  const order = new Int32Array(n);
  const lo = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    lo[i] = Math.min(r[2 * i], r[2 * j]);
    order[i] = i;
  }
  order.sort((a, b) => lo[a] - lo[b] || a - b);
  for (let oi = 0; oi < n; oi++) {
    const i = order[oi];
    const i2 = (i + 1) % n;
    const ax = r[2 * i], bx = r[2 * i2];
    const hiX = Math.max(ax, bx);
    for (let oj = oi + 1; oj < n; oj++) {
      const j = order[oj];
      if (lo[j] > hiX) break;
      if (j === i2 || i === (j + 1) % n) continue; // adjacent edges share a vertex
      const hit = edgesMeet(r, i, i2, j, (j + 1) % n);
      if (hit) return hit;
    }
  }
  return null;
}

/** All pairs, no allocation: faster for the few-vertex outlines most footprints are. */
function selfIntersectionSmall(r: ArrayLike<number>, n: number): { x: number; y: number } | null {
  for (let i = 0; i < n; i++) {
    const i2 = i + 1 === n ? 0 : i + 1;
    for (let j = i + 2; j < n; j++) {
      const j2 = j + 1 === n ? 0 : j + 1;
      if (j2 === i) continue; // adjacent through the closing edge
      const hit = edgesMeet(r, i, i2, j, j2);
      if (hit) return hit;
    }
  }
  return null;
}

/** Where edge (i,i2) crosses or touches edge (j,j2), or null. */
function edgesMeet(r: ArrayLike<number>, i: number, i2: number, j: number, j2: number): { x: number; y: number } | null {
  const ax = r[2 * i], ay = r[2 * i + 1], bx = r[2 * i2], by = r[2 * i2 + 1];
  const cx = r[2 * j], cy = r[2 * j + 1], dx = r[2 * j2], dy = r[2 * j2 + 1];
  if (Math.max(cx, dx) < Math.min(ax, bx) || Math.min(cx, dx) > Math.max(ax, bx)) return null;
  if (Math.max(cy, dy) < Math.min(ay, by) || Math.min(cy, dy) > Math.max(ay, by)) return null;
  const d1 = orient(ax, ay, bx, by, cx, cy);
  const d2 = orient(ax, ay, bx, by, dx, dy);
  const d3 = orient(cx, cy, dx, dy, ax, ay);
  const d4 = orient(cx, cy, dx, dy, bx, by);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    const t = d3 / (d3 - d4);
    return { x: ax + (bx - ax) * t, y: ay + (by - ay) * t };
  }
  // touching: an endpoint of one edge on the other (collinear overlap included)
  if (d1 === 0 && onSeg(ax, ay, bx, by, cx, cy)) return { x: cx, y: cy };
  if (d2 === 0 && onSeg(ax, ay, bx, by, dx, dy)) return { x: dx, y: dy };
  if (d3 === 0 && onSeg(cx, cy, dx, dy, ax, ay)) return { x: ax, y: ay };
  if (d4 === 0 && onSeg(cx, cy, dx, dy, bx, by)) return { x: bx, y: by };
  return null;
}

function onSeg(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return px >= Math.min(ax, bx) && px <= Math.max(ax, bx) && py >= Math.min(ay, by) && py <= Math.max(ay, by);
}
