// The routing grid: a uniform lattice of nodes over the site boundary, held as flat typed
// arrays. A node is free when it lies strictly inside the boundary and strictly outside every
// obstacle grown by the clearance; a move between two free nodes is allowed when the straight
// segment between them touches no grown obstacle or boundary edge (tested exactly near edges).
// Moves: 8 directions d = 0 E, 1 NE, 2 N, 3 NW, 4 W, 5 SW, 6 S, 7 SE; orthogonal style keeps
// the even ones. Per node: a bit mask of allowed moves, a pavement flag; per forward edge
// (d = 0..3 from a node): the number of crossing features it cuts.

import type { CrossingLine, Ring, Site } from '../../site/site';
import type { GeometryStyle } from '../../settings';
import { EdgeIndex, insideRing } from './geom';
import { growObstacles } from './obstacles';

export const DX = Int8Array.from([1, 1, 0, -1, -1, -1, 0, 1]);
export const DY = Int8Array.from([0, 1, 1, 1, 0, -1, -1, -1]);
export const STEP = Float64Array.from([1, Math.SQRT2, 1, Math.SQRT2, 1, Math.SQRT2, 1, Math.SQRT2]);
/** Moves kept per style (bit d = direction d). */
export function styleMask(style: GeometryStyle): number {
  return style === 'orthogonal' ? 0b01010101 : 0xff;
}

/** Router parameters in routing units (site units), converted from the metre settings. */
export interface GridParams {
  cell: number;
  clearance: number;
  pavementFactor: number;
  crossingPenalty: number;
  /** Penalty per 90° of turning; a turn of θ costs bendPenalty·θ/90°. */
  bendPenalty: number;
  style: GeometryStyle;
}

export interface RoutingGrid {
  params: GridParams;
  x0: number;
  y0: number;
  h: number;
  nx: number;
  ny: number;
  n: number;
  free: Uint8Array;
  /** Bit d set when the move from the node in direction d is allowed (style applied). */
  moves: Uint8Array;
  pave: Uint8Array;
  /** Half-crossings (see edgeCuts) of the edge from node v in direction d (d 0..3) at v*4+d. */
  cross: Uint8Array;
  /** Cost of the allowed move from v in direction d at v*8+d (see moveCost). */
  cost: Float32Array;
  /** Edges of the grown obstacles and the boundary: a trench segment may touch none. */
  blockers: EdgeIndex;
  /** Grown obstacles only, for inside tests. */
  obstacles: EdgeIndex;
  boundary: Ring;
  /** Grown obstacle rings (clearance applied) and the raw obstacles. */
  grown: Ring[];
  /** Union of the pavement areas. */
  pavement: EdgeIndex;
  /** Linear features priced per crossing (crossing lines and pavement edges). */
  crossLines: CrossingLine[];
}

/** Crossing features of a site: its crossing lines, plus pavement edges when the site lists none. */
export function crossingLinesOf(site: Site): CrossingLine[] {
  const out = site.crossings.slice();
  if (!out.some((c) => c.kind === 'pavement-edge')) {
    for (const p of site.pavements) {
      for (const r of [p.outer, ...p.holes]) out.push({ points: r, closed: true, layer: p.layer, kind: 'pavement-edge' });
    }
  }
  return out;
}

/** Fills `mask` with `value` at nodes inside the rings (even-odd, boundary inclusive). */
function fillRings(rings: readonly Ring[], g: { x0: number; y0: number; h: number; nx: number; ny: number }, mask: Uint8Array, value: number): void {
  const rows: number[][] = [];
  for (const r of rings) {
    const nv = r.length / 2;
    for (let i = 0; i < nv; i++) {
      const j = (i + 1) % nv;
      const ax = r[2 * i], ay = r[2 * i + 1], bx = r[2 * j], by = r[2 * j + 1];
      if (ay === by) continue;
      const lo = Math.min(ay, by), hi = Math.max(ay, by);
      const j0 = Math.max(0, Math.ceil((lo - g.y0) / g.h));
      const j1 = Math.min(g.ny - 1, Math.ceil((hi - g.y0) / g.h) - 1);
      for (let row = j0; row <= j1; row++) {
        const y = g.y0 + row * g.h;
        if (y < lo || y >= hi) continue;
        const x = ax + ((y - ay) * (bx - ax)) / (by - ay);
        (rows[row] ??= []).push(x);
      }
    }
  }
  for (let row = 0; row < g.ny; row++) {
    const xs = rows[row];
    if (!xs) continue;
    xs.sort((a, b) => a - b);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      const i0 = Math.max(0, Math.ceil((xs[k] - g.x0) / g.h - 1e-9));
      const i1 = Math.min(g.nx - 1, Math.floor((xs[k + 1] - g.x0) / g.h + 1e-9));
      for (let i = i0; i <= i1; i++) mask[row * g.nx + i] = value;
    }
  }
}

/** Visits nodes within two cells of every edge of the rings (sampling at h/2). */
function markNear(rings: readonly Ring[], g: { x0: number; y0: number; h: number; nx: number; ny: number }, mask: Uint8Array): void {
  for (const r of rings) {
    const nv = r.length / 2;
    for (let i = 0; i < nv; i++) {
      const j = (i + 1) % nv;
      const ax = r[2 * i], ay = r[2 * i + 1], bx = r[2 * j], by = r[2 * j + 1];
      const steps = Math.max(1, Math.ceil(Math.hypot(bx - ax, by - ay) / (g.h / 2)));
      for (let s = 0; s <= steps; s++) {
        const x = ax + ((bx - ax) * s) / steps, y = ay + ((by - ay) * s) / steps;
        const ci = Math.floor((x - g.x0) / g.h), cj = Math.floor((y - g.y0) / g.h);
        for (let jj = Math.max(0, cj - 2); jj <= Math.min(g.ny - 1, cj + 3); jj++) {
          for (let ii = Math.max(0, ci - 2); ii <= Math.min(g.nx - 1, ci + 3); ii++) mask[jj * g.nx + ii] = 1;
        }
      }
    }
  }
}

export function buildRoutingGrid(site: Site, params: GridParams, timings?: Record<string, number>, check?: () => void): RoutingGrid {
  let tLap = performance.now();
  // `check` throws when the caller cancels: polled between sub-steps and every 64 rows of the big loops.
  const lap = (k: string): void => { const t = performance.now(); if (timings) timings[k] = t - tLap; tLap = t; check?.(); };
  const h = params.cell;
  if (!(h > 0)) throw new Error(`buildRoutingGrid: cell size must be positive, got ${h}`);
  const b = site.boundary;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < b.length; i += 2) {
    minX = Math.min(minX, b[i]); maxX = Math.max(maxX, b[i]);
    minY = Math.min(minY, b[i + 1]); maxY = Math.max(maxY, b[i + 1]);
  }
  const x0 = Math.floor(minX / h) * h, y0 = Math.floor(minY / h) * h;
  const nx = Math.floor((maxX - x0) / h) + 2, ny = Math.floor((maxY - y0) / h) + 2;
  const n = nx * ny;
  const g = { x0, y0, h, nx, ny };

  const grown = growObstacles([...site.buildings, ...site.keepOuts], params.clearance);
  lap('grid.offset');
  const free = new Uint8Array(n);
  fillRings([b], g, free, 1);
  // Nodes on the boundary line itself are not free: the trench stays strictly inside.
  const onEdge = new Uint8Array(n);
  fillRings(grown, g, free, 0);
  const blockRings = [...grown, b];
  markNear(blockRings, g, onEdge);
  const blockers = new EdgeIndex(blockRings, Math.max(4 * h, 1e-9));
  // Strictness at the boundary: a node exactly on the boundary or a grown outline is blocked.
  for (let v = 0; v < n; v++) {
    if (free[v] && onEdge[v]) {
      const x = x0 + (v % nx) * h, y = y0 + Math.floor(v / nx) * h;
      if (blockers.touches(x, y, x, y)) free[v] = 0;
    }
  }

  lap('grid.free');
  const mask = styleMask(params.style);
  const moves = new Uint8Array(n);
  for (let j = 0; j < ny; j++) {
    if ((j & 63) === 0) check?.();
    for (let i = 0; i < nx; i++) {
      const v = j * nx + i;
      if (!free[v]) continue;
      // Forward directions only; the reverse move is set at the same time (symmetric).
      for (let d = 0; d < 4; d++) {
        if (!((mask >> d) & 1)) continue;
        const ii = i + DX[d], jj = j + DY[d];
        if (ii < 0 || jj < 0 || ii >= nx || jj >= ny) continue;
        const u = jj * nx + ii;
        if (!free[u]) continue;
        if ((onEdge[v] || onEdge[u]) && blockers.touches(x0 + i * h, y0 + j * h, x0 + ii * h, y0 + jj * h)) continue;
        moves[v] |= 1 << d;
        moves[u] |= 1 << (d + 4);
      }
    }
  }

  lap('grid.moves');
  const pavementRings = growObstacles(site.pavements, 0);
  const pave = new Uint8Array(n);
  fillRings(pavementRings, g, pave, 1);

  const crossLines = crossingLinesOf(site);
  const cross = new Uint8Array(n * 4);
  markCrossings(crossLines, g, cross);
  lap('grid.crossings');

  const pavement = new EdgeIndex(pavementRings, Math.max(4 * h, 1e-9));
  lap('grid.pavement');
  // Near a pavement edge the paved part of a move is measured exactly; elsewhere both ends agree.
  const paveNear = new Uint8Array(n);
  markNear(pavementRings, g, paveNear);
  const cost = new Float32Array(n * 8);
  const f = params.pavementFactor;
  for (let v = 0; v < n; v++) {
    if ((v & 0xffff) === 0) check?.();
    const bits = moves[v];
    if (bits === 0) continue;
    const vx = x0 + (v % nx) * h, vy = y0 + Math.floor(v / nx) * h;
    for (let d = 0; d < 8; d++) {
      if (!((bits >> d) & 1)) continue;
      const u = v + DX[d] + DY[d] * nx;
      const len = STEP[d] * h;
      // Measured exactly when the ends disagree, or on a diagonal near an edge (it may clip a
      // corner); otherwise both ends agree and nothing lies between them at grid resolution.
      const paved = pave[v] !== pave[u] || ((d & 1) === 1 && (paveNear[v] || paveNear[u]))
        ? pavedMove(pavement, pave[v], pave[u], vx, vy, vx + DX[d] * h, vy + DY[d] * h)
        : pave[v] ? len : 0;
      const c = d < 4 ? cross[v * 4 + d] : cross[u * 4 + d - 4];
      cost[v * 8 + d] = len + (f - 1) * paved + c * 0.5 * params.crossingPenalty;
    }
  }

  const obstacles = new EdgeIndex(grown, Math.max(4 * h, 1e-9));
  lap('grid.costs');
  return {
    params, x0, y0, h, nx, ny, n, free, moves, pave, cross, cost, blockers, grown,
    obstacles, boundary: b,
    pavement, crossLines,
  };
}

/** Counts, per forward grid edge, the crossing-line segments it cuts (edge half-open at its far end). */
function markCrossings(lines: readonly CrossingLine[], g: { x0: number; y0: number; h: number; nx: number; ny: number }, cross: Uint8Array): void {
  const seen = new Set<number>();
  for (const line of lines) {
    const p = line.points;
    const nv = p.length / 2;
    const segs = line.closed ? nv : nv - 1;
    for (let s = 0; s < segs; s++) {
      const t = (s + 1) % nv;
      const cx = p[2 * s], cy = p[2 * s + 1], dx = p[2 * t], dy = p[2 * t + 1];
      seen.clear();
      const steps = Math.max(1, Math.ceil(Math.hypot(dx - cx, dy - cy) / (g.h / 2)));
      for (let k = 0; k <= steps; k++) {
        const x = cx + ((dx - cx) * k) / steps, y = cy + ((dy - cy) * k) / steps;
        const ci = Math.floor((x - g.x0) / g.h), cj = Math.floor((y - g.y0) / g.h);
        for (let jj = Math.max(0, cj - 1); jj <= Math.min(g.ny - 1, cj + 2); jj++) {
          for (let ii = Math.max(0, ci - 1); ii <= Math.min(g.nx - 1, ci + 2); ii++) {
            for (let d = 0; d < 4; d++) {
              const i2 = ii + DX[d], j2 = jj + DY[d];
              if (i2 < 0 || i2 >= g.nx || j2 >= g.ny) continue;
              const e = (jj * g.nx + ii) * 4 + d;
              if (seen.has(e)) continue;
              seen.add(e);
              const ax = g.x0 + ii * g.h, ay = g.y0 + jj * g.h, bx = g.x0 + i2 * g.h, by = g.y0 + j2 * g.h;
              cross[e] = Math.min(255, cross[e] + edgeCuts(ax, ay, bx, by, cx, cy, dx, dy));
            }
          }
        }
      }
    }
  }
}

/**
 * Half-crossings of grid edge a–b with feature segment c→d (half-open at d): 2 when the feature
 * passes through the edge's interior, 1 when it touches an end node — a path through that node
 * meets two such edges, so it pays one crossing whichever way it turns (as the shaped line does).
 */
function edgeCuts(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): number {
  const rx = bx - ax, ry = by - ay, sx = dx - cx, sy = dy - cy;
  const den = rx * sy - ry * sx;
  if (den === 0) return 0;
  const qx = cx - ax, qy = cy - ay;
  const t = (qx * sy - qy * sx) / den;
  const u = (qx * ry - qy * rx) / den;
  if (u < 0 || u >= 1 || t < 0 || t > 1) return 0;
  return t === 0 || t === 1 ? 1 : 2;
}

/** Node coordinates. */
export function nodeX(g: RoutingGrid, v: number): number {
  return g.x0 + (v % g.nx) * g.h;
}
export function nodeY(g: RoutingGrid, v: number): number {
  return g.y0 + Math.floor(v / g.nx) * g.h;
}

/** Cost of the move from v in direction d: length × mean surface factor + crossing penalties. */
export function moveCost(g: RoutingGrid, v: number, d: number): number {
  return g.cost[v * 8 + d];
}

/** Bend cost table: turning from travel direction a to b costs bendPenalty·θ/90°; index a*8+b. */
export function bendTable(bendPenalty: number): Float64Array {
  const t = new Float64Array(64);
  for (let a = 0; a < 8; a++) {
    for (let b = 0; b < 8; b++) {
      const k = Math.abs(a - b) % 8;
      const steps = Math.min(k, 8 - k);
      t[a * 8 + b] = (bendPenalty * steps * 45) / 90;
    }
  }
  return t;
}

/** A straight trench piece a→b keeps its clearance: a is in the routable area and the piece touches no grown obstacle or boundary edge. */
export function segmentClear(g: RoutingGrid, ax: number, ay: number, bx: number, by: number): boolean {
  if (g.blockers.touches(ax, ay, bx, by)) return false;
  return !g.obstacles.inside(ax, ay) && insideRing(g.boundary, ax, ay);
}

/** Length of a-b inside the rings of `index` (even-odd, split at every edge crossing). */
export function pavedLengthOn(index: EdgeIndex, ax: number, ay: number, bx: number, by: number): number {
  if (index.count === 0) return 0;
  const ts = [0, 1];
  index.crossings(ax, ay, bx, by, ts);
  ts.sort((p, q) => p - q);
  const len = Math.hypot(bx - ax, by - ay);
  let paved = 0;
  // Inside status flips at each proper crossing; one test fixes the first interval. Coincident
  // crossings (through a vertex) are re-tested rather than flipped twice.
  let status: boolean | null = null;
  for (let i = 0; i + 1 < ts.length; i++) {
    const t0 = ts[i], t1 = ts[i + 1];
    if (t1 - t0 <= 1e-12) { status = null; continue; }
    if (status === null) {
      const tm = (t0 + t1) / 2;
      status = index.inside(ax + (bx - ax) * tm, ay + (by - ay) * tm);
    } else status = !status;
    if (status) paved += (t1 - t0) * len;
  }
  return paved;
}

const scratchTs: number[] = [];

/** Paved length of a short grid move: ends agree and nothing is crossed → all or nothing. */
function pavedMove(index: EdgeIndex, pa: number, pb: number, ax: number, ay: number, bx: number, by: number): number {
  scratchTs.length = 0;
  index.crossings(ax, ay, bx, by, scratchTs);
  const len = Math.hypot(bx - ax, by - ay);
  if (scratchTs.length === 0 && pa === pb) return pa ? len : 0;
  return pavedLengthOn(index, ax, ay, bx, by);
}
