// The working graph the shaper edits: vertices (terminals, stub joints, junctions, ends) and
// runs (polylines between two vertices). Geometry measures for a run: cost as the router
// prices it (length × surface factor, crossings, bends), pavement length and crossing points.

import type { SegmentCrossing, TrenchNodeKind } from './trenchNetwork';
import { pavedLengthOn, type RoutingGrid } from '../route/site/routingGrid';
import { crossingParam, turnDeg } from '../route/site/geom';

export interface ShapeVertex {
  x: number;
  y: number;
  kind: TrenchNodeKind;
  terminalId?: string;
  alive: boolean;
}

export interface ShapeRun {
  a: number;
  b: number;
  /** Flat x,y from vertex a to vertex b, both included. */
  pts: number[];
  stub: boolean;
  alive: boolean;
}

export class ShapeGraph {
  verts: ShapeVertex[] = [];
  runs: ShapeRun[] = [];

  addVertex(x: number, y: number, kind: TrenchNodeKind, terminalId?: string): number {
    this.verts.push({ x, y, kind, terminalId, alive: true });
    return this.verts.length - 1;
  }

  addRun(a: number, b: number, pts: number[], stub: boolean): number {
    this.runs.push({ a, b, pts, stub, alive: true });
    return this.runs.length - 1;
  }

  /** Live runs touching vertex v. */
  incident(v: number): number[] {
    const out: number[] = [];
    this.runs.forEach((r, i) => { if (r.alive && (r.a === v || r.b === v)) out.push(i); });
    return out;
  }

  /** Moves vertex v and the matching end of every incident run. */
  moveVertex(v: number, x: number, y: number): void {
    const vx = this.verts[v];
    vx.x = x;
    vx.y = y;
    for (const r of this.runs) {
      if (!r.alive) continue;
      if (r.a === v) { r.pts[0] = x; r.pts[1] = y; }
      if (r.b === v) { r.pts[r.pts.length - 2] = x; r.pts[r.pts.length - 1] = y; }
    }
  }

  /** Point next to vertex v along run r (the first interior point, or the far end). */
  neighbourOn(r: number, v: number): [number, number] {
    const p = this.runs[r].pts;
    return this.runs[r].a === v ? [p[2], p[3]] : [p[p.length - 4], p[p.length - 3]];
  }

  /** Joins runs through vertices of degree 2 that are neither terminals, joints nor junctions. */
  mergeThrough(): void {
    for (let v = 0; v < this.verts.length; v++) {
      const vx = this.verts[v];
      if (!vx.alive || vx.kind !== 'end') continue;
      const inc = this.incident(v);
      if (inc.length !== 2) continue;
      const [r1, r2] = inc.map((i) => this.runs[i]);
      if (r1.stub || r2.stub) continue;
      const p1 = r1.b === v ? r1.pts : reversePts(r1.pts);
      const p2 = r2.a === v ? r2.pts : reversePts(r2.pts);
      const start = r1.b === v ? r1.a : r1.b;
      const end = r2.a === v ? r2.b : r2.a;
      r1.pts = p1.concat(p2.slice(2));
      r1.a = start;
      r1.b = end;
      r2.alive = false;
      vx.alive = false;
    }
  }
}

export function reversePts(p: number[]): number[] {
  const out = new Array<number>(p.length);
  for (let i = 0; i < p.length; i += 2) {
    out[p.length - 2 - i] = p[i];
    out[p.length - 1 - i] = p[i + 1];
  }
  return out;
}

/** Drops repeated points and interior points on a straight line through their neighbours. */
export function removeCollinear(p: number[], tol: number): number[] {
  const out: number[] = [p[0], p[1]];
  for (let i = 2; i < p.length; i += 2) {
    const x = p[i], y = p[i + 1];
    const n = out.length;
    if (Math.hypot(x - out[n - 2], y - out[n - 1]) <= tol && i < p.length - 2) continue;
    if (n >= 4) {
      const ax = out[n - 4], ay = out[n - 3], bx = out[n - 2], by = out[n - 1];
      const cross = (bx - ax) * (y - ay) - (by - ay) * (x - ax);
      const dot = (bx - ax) * (x - bx) + (by - ay) * (y - by);
      if (Math.abs(cross) <= tol * Math.hypot(x - ax, y - ay) && dot >= 0) { out[n - 2] = x; out[n - 1] = y; continue; }
    }
    out.push(x, y);
  }
  if (out.length === 2) out.push(p[p.length - 2], p[p.length - 1]);
  return out;
}

/** Length of a-b under pavement (union of the pavement areas). */
export function pavedLength(g: RoutingGrid, ax: number, ay: number, bx: number, by: number): number {
  return pavedLengthOn(g.pavement, ax, ay, bx, by);
}

/** Crossings of a-b with the crossing features, in order along a-b (half-open at b). */
export function crossingsOf(g: RoutingGrid, ax: number, ay: number, bx: number, by: number, out: SegmentCrossing[]): number {
  const found: { t: number; c: SegmentCrossing }[] = [];
  const minX = Math.min(ax, bx), maxX = Math.max(ax, bx), minY = Math.min(ay, by), maxY = Math.max(ay, by);
  for (const line of g.crossLines) {
    const p = line.points;
    const nv = p.length / 2;
    const segs = line.closed ? nv : nv - 1;
    for (let s = 0; s < segs; s++) {
      const t = (s + 1) % nv;
      const cx = p[2 * s], cy = p[2 * s + 1], dx = p[2 * t], dy = p[2 * t + 1];
      if (Math.max(cx, dx) < minX || Math.min(cx, dx) > maxX || Math.max(cy, dy) < minY || Math.min(cy, dy) > maxY) continue;
      const u = crossingParam(ax, ay, bx, by, cx, cy, dx, dy);
      if (Number.isNaN(u) || u >= 1) continue;
      found.push({ t: u, c: { x: ax + (bx - ax) * u, y: ay + (by - ay) * u, layer: line.layer, kind: line.kind } });
    }
  }
  found.sort((p, q) => p.t - q.t);
  for (const f of found) out.push(f.c);
  return found.length;
}

/** Cost of a polyline as the router prices it: length × surface, crossings, bends. */
export function polylineCost(g: RoutingGrid, p: number[]): number {
  const P = g.params;
  let c = 0;
  const scratch: SegmentCrossing[] = [];
  for (let i = 0; i + 3 < p.length; i += 2) {
    const ax = p[i], ay = p[i + 1], bx = p[i + 2], by = p[i + 3];
    const len = Math.hypot(bx - ax, by - ay);
    const paved = pavedLength(g, ax, ay, bx, by);
    c += len + (P.pavementFactor - 1) * paved;
    scratch.length = 0;
    c += P.crossingPenalty * crossingsOf(g, ax, ay, bx, by, scratch);
    if (i >= 2) c += (P.bendPenalty * turnDeg(p[i - 2], p[i - 1], ax, ay, bx, by)) / 90;
  }
  return c;
}
