// Any-angle junction relaxation. Each junction moves toward the Fermat point of its neighbours
// (the point minimising the sum of distances — at a Steiner point of a minimal tree the three
// branches meet at 120°; Gilbert & Pollak 1968), found by Weiszfeld's iteration (1937), as far
// as the clearances allow (halving the step until every new branch is clear). Junctions of
// degree four or more are first split into degree-three junctions joined by a short run.

import type { ShapeGraph } from '../../network/shapeGraph';
import { segmentClear, type RoutingGrid } from './routingGrid';

/** Weiszfeld iteration for the point minimising Σ|p − q_i| (starting from x0,y0). */
export function fermatPoint(qs: readonly [number, number][], x0: number, y0: number, iterations = 200, tol = 1e-10): [number, number] {
  // Closed form corner case: a vertex where the other points subtend ≥ 120° is the minimiser.
  for (let i = 0; i < qs.length; i++) {
    let gx = 0, gy = 0;
    for (let j = 0; j < qs.length; j++) {
      if (j === i) continue;
      const dx = qs[j][0] - qs[i][0], dy = qs[j][1] - qs[i][1];
      const l = Math.hypot(dx, dy);
      if (l > 0) { gx += dx / l; gy += dy / l; }
    }
    // q_i is optimal when the unit vectors to the others sum to length ≤ 1 (subgradient test).
    if (Math.hypot(gx, gy) <= 1) return [qs[i][0], qs[i][1]];
  }
  let x = x0, y = y0;
  for (let it = 0; it < iterations; it++) {
    let sx = 0, sy = 0, sw = 0;
    for (const [qx, qy] of qs) {
      const d = Math.max(Math.hypot(x - qx, y - qy), 1e-12);
      sx += qx / d; sy += qy / d; sw += 1 / d;
    }
    const nx = sx / sw, ny = sy / sw;
    const moved = Math.hypot(nx - x, ny - y);
    x = nx; y = ny;
    if (moved < tol) break;
  }
  return [x, y];
}

/** Splits junctions of degree ≥ 4: the two angularly closest branches move to a new junction. */
export function splitHighDegree(sg: ShapeGraph, g: RoutingGrid): void {
  for (let v = 0; v < sg.verts.length; v++) {
    const vx = sg.verts[v];
    if (!vx.alive || vx.kind !== 'junction') continue;
    for (;;) {
      const inc = sg.incident(v);
      if (inc.length < 4) break;
      const ang = inc.map((r) => {
        const [nx, ny] = sg.neighbourOn(r, v);
        return { r, a: Math.atan2(ny - vx.y, nx - vx.x) };
      }).sort((p, q) => p.a - q.a || p.r - q.r);
      let bi = 0, bg = Infinity;
      for (let i = 0; i < ang.length; i++) {
        const j = (i + 1) % ang.length;
        let gap = ang[j].a - ang[i].a;
        if (gap <= 0) gap += 2 * Math.PI;
        if (gap < bg - 1e-12) { bg = gap; bi = i; }
      }
      const p = ang[bi], q = ang[(bi + 1) % ang.length];
      const mid = p.a + bg / 2;
      const eps = g.h * 1e-3;
      const w = sg.addVertex(vx.x + Math.cos(mid) * eps, vx.y + Math.sin(mid) * eps, 'junction');
      for (const r of [p.r, q.r]) {
        const run = sg.runs[r];
        if (run.a === v) { run.a = w; run.pts[0] = sg.verts[w].x; run.pts[1] = sg.verts[w].y; } else { run.b = w; run.pts[run.pts.length - 2] = sg.verts[w].x; run.pts[run.pts.length - 1] = sg.verts[w].y; }
      }
      sg.addRun(v, w, [vx.x, vx.y, sg.verts[w].x, sg.verts[w].y], false);
    }
  }
}

/** One relaxation sweep over all junctions; returns the largest move. */
export function relaxJunctions(sg: ShapeGraph, g: RoutingGrid): number {
  let biggest = 0;
  for (let v = 0; v < sg.verts.length; v++) {
    const vx = sg.verts[v];
    if (!vx.alive || vx.kind !== 'junction') continue;
    const inc = sg.incident(v);
    if (inc.length < 3) continue;
    const qs = inc.map((r) => sg.neighbourOn(r, v));
    const [fx, fy] = fermatPoint(qs, vx.x, vx.y);
    let tx = fx, ty = fy;
    for (let k = 0; k < 12; k++) {
      const ok = qs.every(([qx, qy]) => segmentClear(g, tx, ty, qx, qy));
      if (ok) break;
      tx = (tx + vx.x) / 2;
      ty = (ty + vx.y) / 2;
      if (k === 11) { tx = vx.x; ty = vx.y; }
    }
    const moved = Math.hypot(tx - vx.x, ty - vx.y);
    if (moved > 0) {
      sg.moveVertex(v, tx, ty);
      biggest = Math.max(biggest, moved);
    }
  }
  return biggest;
}
