// Trench outline: each segment's centreline buffered to the trench width, joints filled with a
// disc at every node where segments meet, all unioned (clipper-lib: offset + union, Vatti clipping).

import ClipperLib from 'clipper-lib';

/** Integer scale for clipper (it works on integers): 1e4 per routing unit, i.e. 0.1 mm or 0.0001 ft. */
const SCALE = 1e4;
const DISC_SIDES = 24;

export interface OutlineInput {
  /** Centreline x,y pairs in local routing units. */
  points: Float64Array;
  /** Full trench width, routing units. */
  width: number;
}

/** Union of the buffered segments and joint discs: closed rings (x,y pairs, local units), outer and holes alike. */
export function trenchOutline(segments: readonly OutlineInput[], joints: readonly { x: number; y: number; radius: number }[]): Float64Array[] {
  const paths: { X: number; Y: number }[][] = [];
  for (const s of segments) {
    if (s.points.length < 4 || !(s.width > 0)) continue;
    const path: { X: number; Y: number }[] = [];
    for (let i = 0; i < s.points.length; i += 2) path.push({ X: Math.round(s.points[i] * SCALE), Y: Math.round(s.points[i + 1] * SCALE) });
    const co = new ClipperLib.ClipperOffset(2, 0.25 * SCALE * 0.01);
    co.AddPath(path, ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etOpenButt);
    const out: { X: number; Y: number }[][] = [];
    co.Execute(out, (s.width / 2) * SCALE);
    for (const p of out) paths.push(p);
  }
  for (const j of joints) {
    if (!(j.radius > 0)) continue;
    const ring: { X: number; Y: number }[] = [];
    for (let k = 0; k < DISC_SIDES; k++) {
      const a = (2 * Math.PI * k) / DISC_SIDES;
      ring.push({ X: Math.round((j.x + j.radius * Math.cos(a)) * SCALE), Y: Math.round((j.y + j.radius * Math.sin(a)) * SCALE) });
    }
    paths.push(ring);
  }
  if (paths.length === 0) return [];
  const c = new ClipperLib.Clipper();
  c.AddPaths(paths, ClipperLib.PolyType.ptSubject, true);
  const solution: { X: number; Y: number }[][] = [];
  c.Execute(ClipperLib.ClipType.ctUnion, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  const cleaned: { X: number; Y: number }[][] = ClipperLib.Clipper.CleanPolygons(solution, 0.5);
  return cleaned
    .filter((r) => r.length >= 3)
    .map((r) => {
      const f = new Float64Array(r.length * 2);
      r.forEach((p, i) => { f[2 * i] = p.X / SCALE; f[2 * i + 1] = p.Y / SCALE; });
      return f;
    });
}
