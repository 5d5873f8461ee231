// Closed rings of one role → polygons with holes. Nesting by containment parity (a ring inside
// one ring is a hole — a courtyard — a ring inside two is an island again); rings whose boxes
// overlap are unioned with clipper-lib (Vatti clipping, nonzero fill) so overlapping footprints
// become one polygon. Self-intersecting rings are repaired with clipper's SimplifyPolygon.

// eslint-disable-next-line @typescript-eslint/ban-ts-comment -- clipper-lib ships no types; another module may declare it
// @ts-ignore
import ClipperLib from 'clipper-lib';
import type { Polygon, Ring } from './site';
import { type Box, boxContains, boxOf, boxesOverlap, pointInRing, reversed, signedArea } from './rings';

/** Integer grid for clipper: 1e-4 routing units (0.1 mm in metres). */
const CLIP_SCALE = 1e4;

export interface LayeredRing { ring: Ring; layer: string }

// Paths are taken relative to an offset (the cluster's lower-left) so clipper stays in its fast
// 53-bit range (|coordinate| < 4.7e7 units, i.e. clusters up to 4.7 km wide at 0.1 mm).
const toPath = (r: Ring, ox = 0, oy = 0): { X: number; Y: number }[] => {
  const out = new Array(r.length / 2);
  for (let i = 0; i < r.length; i += 2) out[i / 2] = { X: Math.round((r[i] - ox) * CLIP_SCALE), Y: Math.round((r[i + 1] - oy) * CLIP_SCALE) };
  return out;
};

const fromPath = (p: { X: number; Y: number }[], ox = 0, oy = 0): Ring => {
  const out = new Float64Array(p.length * 2);
  for (let i = 0; i < p.length; i++) {
    out[2 * i] = p[i].X / CLIP_SCALE + ox;
    out[2 * i + 1] = p[i].Y / CLIP_SCALE + oy;
  }
  return out;
};

const ccw = (r: Ring): Ring => (signedArea(r) < 0 ? reversed(r) : r);
const cw = (r: Ring): Ring => (signedArea(r) > 0 ? reversed(r) : r);

/** Split a self-intersecting ring into simple rings (nonzero fill), dropping pieces of area <= minArea. */
export function repairRing(r: Ring, minArea: number): Ring[] {
  const b = boxOf(r);
  const parts = ClipperLib.Clipper.SimplifyPolygon(toPath(r, b.minX, b.minY), ClipperLib.PolyFillType.pftNonZero) as { X: number; Y: number }[][];
  return parts.map((p) => fromPath(p, b.minX, b.minY)).filter((p) => Math.abs(signedArea(p)) > minArea).map(ccw);
}

/** Assemble polygons from rings; deterministic (input order decides ties). */
export function assemblePolygons(rings: LayeredRing[]): Polygon[] {
  const n = rings.length;
  const boxes: Box[] = rings.map((r) => boxOf(r.ring));
  const signed = new Float64Array(n);
  const areas = new Float64Array(n);
  for (let i = 0; i < n; i++) { signed[i] = signedArea(rings[i].ring); areas[i] = Math.abs(signed[i]); }
  // clusters of rings whose boxes overlap (union-find over a uniform grid of boxes)
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (i: number): number => {
    while (parent[i] !== i) { parent[i] = parent[parent[i]]; i = parent[i]; }
    return i;
  };
  // rings that may contain another (its box contains the other's box): checked exactly later
  const containers = new Map<number, number[]>();
  overlappingPairs(boxes, (a, b) => {
    const ra = find(a), rb = find(b);
    if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
    if (areas[a] !== areas[b]) {
      const [big, small] = areas[a] > areas[b] ? [a, b] : [b, a];
      if (boxContains(boxes[big], boxes[small])) {
        const l = containers.get(small);
        if (l) l.push(big); else containers.set(small, [big]);
      }
    }
  });
  const size = new Int32Array(n);
  for (let i = 0; i < n; i++) size[find(i)]++;
  const clusters = new Map<number, number[]>(); // only clusters of two or more rings
  const out: Polygon[] = [];
  for (let i = 0; i < n; i++) {
    const r = parent[i] === i ? i : find(i);
    if (size[r] === 1) {
      out.push({ outer: signed[i] < 0 ? reversed(rings[i].ring) : rings[i].ring, holes: [], layer: rings[i].layer });
      continue;
    }
    const c = clusters.get(r);
    if (c) c.push(i); else clusters.set(r, [i]);
  }
  for (const members of clusters.values()) out.push(...unionCluster(members, rings, boxes, areas, containers));
  return out;
}

function unionCluster(members: number[], rings: LayeredRing[], boxes: Box[], areas: Float64Array, containers: Map<number, number[]>): Polygon[] {
  let ox = Infinity, oy = Infinity;
  for (const i of members) { ox = Math.min(ox, boxes[i].minX); oy = Math.min(oy, boxes[i].minY); }
  // nesting depth (how many rings contain this one) and the outermost ring around it
  const layers = new Set<string>();
  const groups = new Map<number, number[]>(); // outermost ring → the rings nested in it, itself included
  const paths = new Map<number, Path>();
  for (const i of members) {
    layers.add(rings[i].layer);
    let d = 0;
    let top = i;
    for (const j of containers.get(i) ?? []) {
      if (!ringInside(rings[i].ring, rings[j].ring)) continue;
      d++;
      if (areas[j] > areas[top] || (areas[j] === areas[top] && j < top)) top = j;
    }
    paths.set(i, toPath(d % 2 === 0 ? ccw(rings[i].ring) : cw(rings[i].ring), ox, oy));
    const g = groups.get(top);
    if (g) g.push(i); else groups.set(top, [i]);
  }
  const solution = unionGroups([...groups.values()], paths, boxes);
  const layer = [...layers].sort().join(', ');
  const outers: { ring: Ring; area: number; box: Box; holes: Ring[] }[] = [];
  const holes: Ring[] = [];
  for (const path of solution) {
    const r = fromPath(path, ox, oy);
    const a = signedArea(r);
    if (a > 0) outers.push({ ring: r, area: a, box: boxOf(r), holes: [] });
    else if (a < 0) holes.push(r);
  }
  // each hole belongs to the smallest outer ring around it (islands in courtyards included)
  outers.sort((p, q) => p.area - q.area);
  for (const h of holes) {
    const [px, py] = interiorPoint(h);
    const hb = boxOf(h);
    const owner = outers.find((o) => boxContains(o.box, hb) && pointInRing(px, py, o.ring));
    if (owner) owner.holes.push(h);
  }
  // largest first, as clipper's tree would list them
  return outers.reverse().map((o) => ({ outer: o.ring, holes: o.holes, layer }));
}

type Path = { X: number; Y: number }[];

const UNION_LEAF = 64;

/**
 * Union of groups of rings (a group: an outermost ring and the rings nested in it, so holes stay
 * with their outer ring). Large sets are split in two along their wider axis and the halves' unions
 * unioned again: clipper's cost grows faster than linearly with many shared edges (townhouses,
 * parcels), the split keeps each call small. Output: flat paths, outers positive, holes negative.
 */
function unionGroups(groups: number[][], paths: Map<number, Path>, boxes: Box[]): Path[] {
  const count = groups.reduce((n, g) => n + g.length, 0);
  const run = (subject: Path[]): Path[] => {
    const c = new ClipperLib.Clipper();
    c.AddPaths(subject, ClipperLib.PolyType.ptSubject, true);
    const solution: Path[] = []; // flat paths: about 3× faster than clipper's PolyTree here
    c.Execute(ClipperLib.ClipType.ctUnion, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
    return solution;
  };
  if (count <= UNION_LEAF || groups.length < 2) return run(groups.flat().map((i) => paths.get(i)!));
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const cx = groups.map((g) => { const b = boxes[g[0]]; return (b.minX + b.maxX) / 2; });
  const cy = groups.map((g) => { const b = boxes[g[0]]; return (b.minY + b.maxY) / 2; });
  for (let k = 0; k < groups.length; k++) {
    minX = Math.min(minX, cx[k]); maxX = Math.max(maxX, cx[k]); minY = Math.min(minY, cy[k]); maxY = Math.max(maxY, cy[k]);
  }
  const key = maxX - minX >= maxY - minY ? cx : cy;
  const order = groups.map((_, k) => k).sort((a, b) => key[a] - key[b] || a - b);
  const half = order.length >> 1;
  const left = unionGroups(order.slice(0, half).map((k) => groups[k]), paths, boxes);
  const right = unionGroups(order.slice(half).map((k) => groups[k]), paths, boxes);
  return run([...left, ...right]);
}

/** A point just inside a simple ring: the midpoint of its first edge, moved a hair to the inner side. */
function interiorPoint(r: Ring): [number, number] {
  const x0 = r[0], y0 = r[1], x1 = r[2], y1 = r[3];
  const len = Math.hypot(x1 - x0, y1 - y0) || 1;
  const side = signedArea(r) > 0 ? 1 : -1; // counter-clockwise: the inside is on the left
  const eps = 1e-6 * len;
  return [(x0 + x1) / 2 - (side * (y1 - y0) / len) * eps, (y0 + y1) / 2 + (side * (x1 - x0) / len) * eps];
}

/**
 * Calls back once for every pair of overlapping boxes. Boxes are entered into the cells of a uniform
 * grid (cell = twice the median box size, at most 4096 × 4096 cells) as (cell, box) keys in one typed
 * array, sorted; a pair is tested only in the cell holding the lower-left corner of the two boxes'
 * intersection, so it is reported once. Near-linear for footprints; boxes covering very many cells
 * are tested against all others instead.
 */
export function overlappingPairs(boxes: Box[], onPair: (a: number, b: number) => void): void {
  const n = boxes.length;
  if (n < 2) return;
  let gx = Infinity, gy = Infinity, gX = -Infinity, gY = -Infinity;
  const sizes = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const b = boxes[i];
    if (b.minX < gx) gx = b.minX;
    if (b.minY < gy) gy = b.minY;
    if (b.maxX > gX) gX = b.maxX;
    if (b.maxY > gY) gY = b.maxY;
    sizes[i] = Math.max(b.maxX - b.minX, b.maxY - b.minY);
  }
  sizes.sort();
  const span = Math.max(gX - gx, gY - gy, 1e-9);
  const DIM = 4096;
  const cell = Math.max(2 * sizes[n >> 1], span / (DIM - 1), 1e-9);
  const MAX_CELLS_PER_BOX = 256;
  const cx = (x: number): number => Math.min(DIM - 1, Math.floor((x - gx) / cell));
  const cy = (y: number): number => Math.min(DIM - 1, Math.floor((y - gy) / cell));
  // key = cell * n + box: cell < 2^24 and n < 2^29 keep keys exact in a float64
  let count = 0;
  const big: number[] = [];
  for (let i = 0; i < n; i++) {
    const b = boxes[i];
    const c = (cx(b.maxX) - cx(b.minX) + 1) * (cy(b.maxY) - cy(b.minY) + 1);
    if (c > MAX_CELLS_PER_BOX) big.push(i); else count += c;
  }
  const isBig = new Uint8Array(n);
  for (const i of big) isBig[i] = 1;
  const keys = new Float64Array(count);
  let w = 0;
  for (let i = 0; i < n; i++) {
    if (isBig[i]) continue;
    const b = boxes[i];
    const x0 = cx(b.minX), x1 = cx(b.maxX), y0 = cy(b.minY), y1 = cy(b.maxY);
    for (let x = x0; x <= x1; x++) for (let y = y0; y <= y1; y++) keys[w++] = (x * DIM + y) * n + i;
  }
  keys.sort();
  for (let s = 0; s < count; ) {
    const cellId = Math.floor(keys[s] / n);
    let e = s + 1;
    while (e < count && Math.floor(keys[e] / n) === cellId) e++;
    if (e - s > 1) {
      const kx = Math.floor(cellId / DIM), ky = cellId - kx * DIM;
      for (let p = s; p < e; p++) {
        const ia = keys[p] - cellId * n;
        const a = boxes[ia];
        for (let q = p + 1; q < e; q++) {
          const ib = keys[q] - cellId * n;
          const b = boxes[ib];
          if (!boxesOverlap(a, b)) continue;
          if (cx(Math.max(a.minX, b.minX)) !== kx || cy(Math.max(a.minY, b.minY)) !== ky) continue;
          onPair(ia, ib);
        }
      }
    }
    s = e;
  }
  for (const i of big) {
    for (let j = 0; j < n; j++) {
      if (j === i || (isBig[j] && j < i)) continue;
      if (boxesOverlap(boxes[i], boxes[j])) onPair(Math.min(i, j), Math.max(i, j));
    }
  }
}

/** Every vertex of `inner` inside `outer` (even-odd); rings that only touch are not nested. */
function ringInside(inner: Ring, outer: Ring): boolean {
  for (let i = 0; i < inner.length; i += 2) if (!pointInRing(inner[i], inner[i + 1], outer)) return false;
  return true;
}

/** Net area of a polygon (outer minus holes). */
export function polygonArea(p: Polygon): number {
  let a = Math.abs(signedArea(p.outer));
  for (const h of p.holes) a -= Math.abs(signedArea(h));
  return a;
}
