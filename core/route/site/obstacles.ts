// Obstacles grown by the clearance: building footprints (holes become courtyards that shrink)
// and keep-out zones offset outward with clipper-lib (Vatti clipping / Clipper offsetting),
// merged into one non-overlapping set of rings (even-odd fill gives the blocked area).

import ClipperLib from 'clipper-lib';
import type { Polygon, Ring } from '../../site/site';
import { ringArea } from './geom';

/** Integer scale for clipper: 1e4 integer steps per routing unit (0.1 mm on a metre site). */
const SCALE = 1e4;

type IntPath = { X: number; Y: number }[];

function toPath(r: Ring, wantPositive: boolean): IntPath {
  const n = r.length / 2;
  const p: IntPath = [];
  for (let i = 0; i < n; i++) p.push({ X: Math.round(r[2 * i] * SCALE), Y: Math.round(r[2 * i + 1] * SCALE) });
  if ((ringArea(r) > 0) !== wantPositive) p.reverse();
  return p;
}

function fromPath(p: IntPath): Ring {
  const r = new Float64Array(p.length * 2);
  for (let i = 0; i < p.length; i++) {
    r[2 * i] = p[i].X / SCALE;
    r[2 * i + 1] = p[i].Y / SCALE;
  }
  return r;
}

/**
 * Rings of the polygons grown by `clearance` (routing units), round joins with an arc
 * tolerance of `arcTolerance` units. Holes narrower than twice the clearance vanish.
 */
export function growObstacles(polys: readonly Polygon[], clearance: number, arcTolerance = 0.005): Ring[] {
  if (polys.length === 0) return [];
  const paths: IntPath[] = [];
  for (const p of polys) {
    if (p.outer.length < 6) continue;
    paths.push(toPath(p.outer, true));
    for (const h of p.holes) if (h.length >= 6) paths.push(toPath(h, false));
  }
  const solution: IntPath[] = [];
  if (clearance > 0) {
    const co = new ClipperLib.ClipperOffset(2, arcTolerance * SCALE);
    co.AddPaths(paths, ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
    co.Execute(solution, clearance * SCALE);
  } else {
    const c = new ClipperLib.Clipper();
    c.AddPaths(paths, ClipperLib.PolyType.ptSubject, true);
    c.Execute(ClipperLib.ClipType.ctUnion, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  }
  return solution.filter((p) => p.length >= 3).map(fromPath);
}
