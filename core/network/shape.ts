// Shaping: the grid tree becomes a TrenchNetwork. Grid paths between key nodes become
// polylines; collinear runs merge; staircases are replaced by at most two legs in the style's
// directions (orthogonal: 90°, octilinear: 45° steps) or, any-angle, by straight lines of sight,
// only where the replacement keeps the clearance and costs no more (length × surface,
// crossings, bends). Any-angle junctions are then relaxed toward their Fermat points
// (route/site/relax.ts). Segments run between terminals, stub joints and junctions, oriented
// away from the first point of connection.

import type { Terminal } from '../site/site';
import type { GeometryStyle } from '../settings';
import type { Anchor } from '../route/site/attach';
import { turnDeg } from '../route/site/geom';
import { relaxJunctions, splitHighDegree } from '../route/site/relax';
import { DX, DY, nodeX, nodeY, segmentClear, type RoutingGrid } from '../route/site/routingGrid';
import { crossingsOf, pavedLength, polylineCost, removeCollinear, reversePts, ShapeGraph } from './shapeGraph';
import type { SegmentCrossing, TrenchNode, TrenchSegment } from './trenchNetwork';

const OPP = (d: number): number => (d + 4) & 7;

function popcount8(b: number): number {
  let c = 0;
  for (; b; b &= b - 1) c++;
  return c;
}

/** Builds the working graph from the grid tree and the anchors joined to it. */
export function graphFromTree(g: RoutingGrid, adj: Uint8Array, treeNodes: Int32Array, anchors: readonly Anchor[], terminals: readonly Terminal[]): ShapeGraph {
  const sg = new ShapeGraph();
  const off = new Int32Array(8);
  for (let d = 0; d < 8; d++) off[d] = DX[d] + DY[d] * g.nx;
  const anchorAt = new Map<number, number[]>();
  anchors.forEach((a, i) => { const l = anchorAt.get(a.node); if (l) l.push(i); else anchorAt.set(a.node, [i]); });
  const vertexOf = new Map<number, number>();
  const isKey = (v: number): boolean => anchorAt.has(v) || popcount8(adj[v]) !== 2;
  // Terminals and stubs first, in anchor order (stable ids).
  for (const a of anchors) {
    const t = terminals[a.term];
    const p = sg.addVertex(a.px, a.py, t.role, t.id);
    const gx = nodeX(g, a.node), gy = nodeY(g, a.node);
    const samePG = Math.hypot(a.px - gx, a.py - gy) < 1e-9;
    if (samePG) {
      if (!vertexOf.has(a.node)) vertexOf.set(a.node, p);
      else sg.addRun(vertexOf.get(a.node)!, p, [gx, gy, a.px, a.py], true);
      continue;
    }
    const qIsP = Math.hypot(a.qx - a.px, a.qy - a.py) < 1e-9;
    const qIsG = Math.hypot(a.qx - gx, a.qy - gy) < 1e-9;
    if (qIsP || qIsG) {
      let gv = vertexOf.get(a.node);
      if (gv === undefined) { gv = sg.addVertex(gx, gy, a.stub ? 'bend' : 'end'); vertexOf.set(a.node, gv); }
      sg.addRun(p, gv, [a.px, a.py, gx, gy], a.stub);
      continue;
    }
    const joint = sg.addVertex(a.qx, a.qy, 'bend');
    sg.addRun(p, joint, [a.px, a.py, a.qx, a.qy], true);
    let gv = vertexOf.get(a.node);
    if (gv === undefined) { gv = sg.addVertex(gx, gy, 'end'); vertexOf.set(a.node, gv); }
    sg.addRun(joint, gv, [a.qx, a.qy, gx, gy], false);
  }
  const vtx = (v: number): number => {
    let id = vertexOf.get(v);
    if (id === undefined) {
      id = sg.addVertex(nodeX(g, v), nodeY(g, v), popcount8(adj[v]) >= 3 ? 'junction' : 'end');
      vertexOf.set(v, id);
    } else if (popcount8(adj[v]) + sg.incident(id).length >= 3 && sg.verts[id].kind === 'end') {
      sg.verts[id].kind = 'junction';
    }
    return id;
  };
  for (const s of treeNodes) {
    if (adj[s] === 0 || !isKey(s)) continue;
    for (let d0 = 0; d0 < 8; d0++) {
      if (!((adj[s] >> d0) & 1)) continue;
      const pts = [nodeX(g, s), nodeY(g, s)];
      let v = s, d = d0;
      for (;;) {
        v += off[d];
        pts.push(nodeX(g, v), nodeY(g, v));
        if (isKey(v)) break;
        const bits = adj[v] & ~(1 << OPP(d));
        let e = 0;
        while (!((bits >> e) & 1)) e++;
        d = e;
      }
      const last = OPP(d);
      if (s < v || (s === v && d0 < last)) sg.addRun(vtx(s), vtx(v), pts, false);
    }
  }
  // Degree decides the kind of grid vertices (ends that carry three or more runs are junctions).
  sg.verts.forEach((vx, i) => {
    if (vx.kind === 'end' || vx.kind === 'junction') vx.kind = sg.incident(i).length >= 3 ? 'junction' : 'end';
    if (vx.kind === 'bend' && sg.incident(i).length >= 3) vx.kind = 'junction';
  });
  sg.mergeThrough();
  return sg;
}

/** Candidate replacements for the piece a→b in the style: one or two legs (corner points). */
function styleCandidates(style: GeometryStyle, ax: number, ay: number, bx: number, by: number, tol: number): number[][] {
  const dx = bx - ax, dy = by - ay;
  const adx = Math.abs(dx), ady = Math.abs(dy);
  const sx = Math.sign(dx), sy = Math.sign(dy);
  if (style === 'any-angle') return [[]];
  if (adx <= tol || ady <= tol) return [[]];
  if (style === 'octilinear') {
    if (Math.abs(adx - ady) <= tol) return [[]];
    const m = Math.min(adx, ady);
    // diagonal first, then axis; or axis first, then diagonal
    return [[ax + sx * m, ay + sy * m], [bx - sx * m, by - sy * m]];
  }
  return [[bx, ay], [ax, by]];
}

/** Greedy straightening of one run: from each point, the farthest point reachable by a cheaper, clear, in-style shortcut. */
export function straightenRun(g: RoutingGrid, pts: number[], style: GeometryStyle): number[] {
  const tol = g.h * 1e-6;
  const p = removeCollinear(pts, tol);
  const m = p.length / 2;
  if (m <= 2) return p;
  const out = [p[0], p[1]];
  let i = 0;
  while (i < m - 1) {
    let done = false;
    for (let j = m - 1; j > i + 1 && !done; j--) {
      const ax = p[2 * i], ay = p[2 * i + 1], bx = p[2 * j], by = p[2 * j + 1];
      const old = p.slice(2 * i, 2 * j + 2);
      const oldCost = polylineCost(g, old);
      const oldCorners = j - i - 1;
      for (const corner of styleCandidates(style, ax, ay, bx, by, tol)) {
        const cand = corner.length ? [ax, ay, corner[0], corner[1], bx, by] : [ax, ay, bx, by];
        if (corner.length / 2 > oldCorners) continue;
        let clear = true;
        for (let k = 0; k + 3 < cand.length && clear; k += 2) clear = segmentClear(g, cand[k], cand[k + 1], cand[k + 2], cand[k + 3]);
        if (!clear) continue;
        if (polylineCost(g, cand) > oldCost + 1e-9) continue;
        for (let k = 2; k < cand.length; k++) out.push(cand[k]);
        i = j;
        done = true;
        break;
      }
    }
    if (!done) {
      out.push(p[2 * (i + 1)], p[2 * (i + 1) + 1]);
      i++;
    }
  }
  return removeCollinear(out, tol);
}

function straightenAll(sg: ShapeGraph, g: RoutingGrid, style: GeometryStyle): void {
  for (const r of sg.runs) if (r.alive && !r.stub) r.pts = straightenRun(g, r.pts, style);
}

/**
 * Any-angle refinement of one run: a vertex is added where the run crosses a pavement edge,
 * then each interior vertex moves (pattern search, steps halving from one cell) while the run
 * gets cheaper and stays clear — so a run refracts across a costly strip as a least-cost path
 * does (Snell's law) instead of crossing it where the straight line happened to.
 */
export function refineRun(g: RoutingGrid, pts: number[]): number[] {
  const p: number[] = [pts[0], pts[1]];
  for (let i = 0; i + 3 < pts.length; i += 2) {
    const ax = pts[i], ay = pts[i + 1], bx = pts[i + 2], by = pts[i + 3];
    const ts: number[] = [];
    g.pavement.crossings(ax, ay, bx, by, ts);
    ts.sort((a, b) => a - b);
    for (const t of ts) p.push(ax + (bx - ax) * t, ay + (by - ay) * t);
    p.push(bx, by);
  }
  const m = p.length / 2;
  if (m <= 2) return p;
  const local = (i: number): number => polylineCost(g, p.slice(Math.max(0, 2 * (i - 2)), Math.min(p.length, 2 * (i + 3))));
  for (let sweep = 0; sweep < 12; sweep++) {
    let gained = 0;
    for (let i = 1; i < m - 1; i++) {
      let best = local(i);
      for (let step = g.h; step > g.h / 512; step /= 2) {
        let moved = true;
        while (moved) {
          moved = false;
          for (let d = 0; d < 8; d++) {
            const ox = p[2 * i], oy = p[2 * i + 1];
            const nx = ox + Math.cos((d * Math.PI) / 4) * step, ny = oy + Math.sin((d * Math.PI) / 4) * step;
            if (!segmentClear(g, p[2 * i - 2], p[2 * i - 1], nx, ny) || !segmentClear(g, nx, ny, p[2 * i + 2], p[2 * i + 3])) continue;
            p[2 * i] = nx; p[2 * i + 1] = ny;
            const c = local(i);
            if (c < best - 1e-12) { gained += best - c; best = c; moved = true; break; }
            p[2 * i] = ox; p[2 * i + 1] = oy;
          }
        }
      }
    }
    if (gained < g.h * 1e-6) break;
  }
  return removeCollinear(p, g.h * 1e-6);
}

/** Shapes the working graph in place for the style. */
export function shapeGraph(sg: ShapeGraph, g: RoutingGrid, style: GeometryStyle): void {
  straightenAll(sg, g, style);
  if (style !== 'any-angle') return;
  splitHighDegree(sg, g);
  for (let round = 0; round < 6; round++) {
    let moved = 0;
    for (let sweep = 0; sweep < 200; sweep++) {
      const m = relaxJunctions(sg, g);
      moved = Math.max(moved, m);
      if (m < g.h * 1e-7) break;
    }
    straightenAll(sg, g, style);
    if (moved < g.h * 1e-6) break;
  }
  for (const r of sg.runs) if (r.alive && !r.stub) r.pts = refineRun(g, r.pts);
}

function polyMetrics(g: RoutingGrid, p: number[]): { length: number; paved: number; crossings: SegmentCrossing[]; bends: number[] } {
  let length = 0, paved = 0;
  const crossings: SegmentCrossing[] = [];
  const bends: number[] = [];
  for (let i = 0; i + 3 < p.length; i += 2) {
    length += Math.hypot(p[i + 2] - p[i], p[i + 3] - p[i + 1]);
    paved += pavedLength(g, p[i], p[i + 1], p[i + 2], p[i + 3]);
    crossingsOf(g, p[i], p[i + 1], p[i + 2], p[i + 3], crossings);
    if (i >= 2) bends.push(turnDeg(p[i - 2], p[i - 1], p[i], p[i + 1], p[i + 2], p[i + 3]));
  }
  return { length, paved, crossings, bends };
}

/** Final nodes and segments: zero-length runs collapse, ids follow a walk from the root terminal. */
export function toNetwork(sg: ShapeGraph, g: RoutingGrid, rootTerminalId: string | undefined): { nodes: TrenchNode[]; segments: TrenchSegment[] } {
  const tol = g.h * 1e-6;
  // Collapse runs shorter than the tolerance (a junction relaxed onto its neighbour).
  const rank = (k: string): number => (k === 'connection' || k === 'service' ? 3 : k === 'junction' ? 2 : k === 'bend' ? 1 : 0);
  for (const r of sg.runs) {
    if (!r.alive) continue;
    r.pts = removeCollinear(r.pts, tol);
    let len = 0;
    for (let i = 0; i + 3 < r.pts.length; i += 2) len += Math.hypot(r.pts[i + 2] - r.pts[i], r.pts[i + 3] - r.pts[i + 1]);
    if (len > tol || r.a === r.b) continue;
    const va = sg.verts[r.a], vb = sg.verts[r.b];
    if (rank(va.kind) === 3 && rank(vb.kind) === 3) continue;
    const [keep, drop] = rank(vb.kind) > rank(va.kind) ? [r.b, r.a] : [r.a, r.b];
    r.alive = false;
    for (const o of sg.runs) {
      if (!o.alive) continue;
      if (o.a === drop) o.a = keep;
      if (o.b === drop) o.b = keep;
    }
    sg.verts[drop].alive = false;
  }
  // Kinds after collapsing; 'end' vertices left with degree 2 merge away.
  sg.verts.forEach((v, i) => {
    if (!v.alive) return;
    const deg = sg.incident(i).length;
    if ((v.kind === 'end' || v.kind === 'bend' || v.kind === 'junction') && deg >= 3) v.kind = 'junction';
    else if (v.kind === 'junction' && deg < 3) v.kind = deg === 2 ? 'end' : 'end';
  });
  sg.mergeThrough();
  // Walk from the root.
  let root = sg.verts.findIndex((v) => v.alive && v.terminalId === rootTerminalId);
  if (root < 0) root = sg.verts.findIndex((v) => v.alive && (v.kind === 'connection' || v.kind === 'service'));
  const nodes: TrenchNode[] = [];
  const segments: TrenchSegment[] = [];
  if (root < 0) return { nodes, segments };
  const idOf = new Map<number, number>();
  const seenRun = new Set<number>();
  const queue = [root];
  const addNode = (v: number): number => {
    let id = idOf.get(v);
    if (id === undefined) {
      id = nodes.length;
      idOf.set(v, id);
      const vx = sg.verts[v];
      const node: TrenchNode = { id, kind: vx.kind, x: vx.x, y: vx.y };
      if (vx.terminalId !== undefined) node.terminalId = vx.terminalId;
      nodes.push(node);
    }
    return id;
  };
  addNode(root);
  for (let qi = 0; qi < queue.length; qi++) {
    const v = queue[qi];
    const inc = sg.incident(v).filter((r) => !seenRun.has(r));
    // Deterministic order: by the direction each run leaves in.
    inc.sort((a, b) => {
      const [ax, ay] = sg.neighbourOn(a, v), [bx, by] = sg.neighbourOn(b, v);
      const vx = sg.verts[v];
      return Math.atan2(ay - vx.y, ax - vx.x) - Math.atan2(by - vx.y, bx - vx.x) || a - b;
    });
    for (const r of inc) {
      seenRun.add(r);
      const run = sg.runs[r];
      const pts = run.a === v ? run.pts : reversePts(run.pts);
      const other = run.a === v ? run.b : run.a;
      const from = addNode(v);
      const to = addNode(other);
      const m = polyMetrics(g, pts);
      segments.push({
        id: segments.length, from, to, points: Float64Array.from(pts), length: m.length,
        lengthUnderPavement: m.paved, crossings: m.crossings, bendsDeg: m.bends, stub: run.stub,
      });
      queue.push(other);
    }
  }
  return { nodes, segments };
}
