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

const toPath = (r: Ring): { X: number; Y: number }[] => {
  const out = new Array(r.length / 2);
  for (let i = 0; i < r.length; i += 2) out[i / 2] = { X: Math.round(r[i] * CLIP_SCALE), Y: Math.round(r[i + 1] * CLIP_SCALE) };
  return out;
};

const fromPath = (p: { X: number; Y: number }[]): Ring => {
  const out = new Float64Array(p.length * 2);
  for (let i = 0; i < p.length; i++) {
    out[2 * i] = p[i].X / CLIP_SCALE;
    out[2 * i + 1] = p[i].Y / CLIP_SCALE;
  }
  return out;
};

const ccw = (r: Ring): Ring => (signedArea(r) < 0 ? reversed(r) : r);
const cw = (r: Ring): Ring => (signedArea(r) > 0 ? reversed(r) : r);

/** Split a self-intersecting ring into simple rings (nonzero fill), dropping pieces of area <= minArea. */
export function repairRing(r: Ring, minArea: number): Ring[] {
  const parts = ClipperLib.Clipper.SimplifyPolygon(toPath(r), ClipperLib.PolyFillType.pftNonZero) as { X: number; Y: number }[][];
  return parts.map(fromPath).filter((p) => Math.abs(signedArea(p)) > minArea).map(ccw);
}

/** Assemble polygons from rings; deterministic (input order decides ties). */
export function assemblePolygons(rings: LayeredRing[]): Polygon[] {
  const n = rings.length;
  const boxes: Box[] = rings.map((r) => boxOf(r.ring));
  const areas = rings.map((r) => Math.abs(signedArea(r.ring)));
  // clusters of rings whose boxes overlap (union-find over a sweep on min x)
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) { parent[i] = parent[parent[i]]; i = parent[i]; }
    return i;
  };
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => boxes[a].minX - boxes[b].minX || a - b);
  for (let oi = 0; oi < n; oi++) {
    const a = order[oi];
    for (let oj = oi + 1; oj < n; oj++) {
      const b = order[oj];
      if (boxes[b].minX > boxes[a].maxX) break;
      if (boxesOverlap(boxes[a], boxes[b])) {
        const ra = find(a), rb = find(b);
        if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
      }
    }
  }
  const clusters = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const r = find(i);
    const c = clusters.get(r);
    if (c) c.push(i); else clusters.set(r, [i]);
  }
  const out: Polygon[] = [];
  for (const members of clusters.values()) {
    if (members.length === 1) {
      const i = members[0];
      out.push({ outer: ccw(rings[i].ring), holes: [], layer: rings[i].layer });
      continue;
    }
    out.push(...unionCluster(members, rings, boxes, areas));
  }
  return out;
}

function unionCluster(members: number[], rings: LayeredRing[], boxes: Box[], areas: number[]): Polygon[] {
  // nesting depth: how many other rings of the cluster contain this one
  const byArea = [...members].sort((a, b) => areas[b] - areas[a] || a - b);
  const depth = new Map<number, number>();
  const layers = new Set<string>();
  const paths: { X: number; Y: number }[][] = [];
  for (let k = 0; k < byArea.length; k++) {
    const i = byArea[k];
    layers.add(rings[i].layer);
    let d = 0;
    for (let q = 0; q < k; q++) {
      const j = byArea[q];
      if (areas[j] > areas[i] && boxContains(boxes[j], boxes[i]) && ringInside(rings[i].ring, rings[j].ring)) d++;
    }
    depth.set(i, d);
    paths.push(toPath(d % 2 === 0 ? ccw(rings[i].ring) : cw(rings[i].ring)));
  }
  const c = new ClipperLib.Clipper();
  c.AddPaths(paths, ClipperLib.PolyType.ptSubject, true);
  const tree = new ClipperLib.PolyTree();
  c.Execute(ClipperLib.ClipType.ctUnion, tree, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  const layer = [...layers].sort().join(', ');
  const out: Polygon[] = [];
  const visit = (node: any): void => {
    for (const outerNode of node.Childs()) {
      const holes: Ring[] = [];
      for (const holeNode of outerNode.Childs()) {
        holes.push(cw(fromPath(holeNode.Contour())));
        visit(holeNode); // islands inside a courtyard
      }
      out.push({ outer: ccw(fromPath(outerNode.Contour())), holes, layer });
    }
  };
  visit(tree);
  return out;
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
