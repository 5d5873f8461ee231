// Limits on what Furrow will take on, in one table with their defaults, and the messages that
// explain a refusal: the figure, the limit, and what to change. The DXF reader (readDxf.ts,
// explode.ts) and the site stage take their defaults from here; the router's grid size is checked
// by checkRouteSize before the grid is built. A limit is reached as an error value, never as an
// out-of-memory crash. (The file-size, entity and block-depth messages are built in readDxf.ts
// and explode.ts, beside the checks.)

import type { RouteSettings } from './settings';
import type { Site } from './site/site';
import { fromMetres, metresPerUnit } from './units';

export interface LimitTable {
  /** Largest drawing file read, bytes. */
  maxFileBytes: number;
  /** Most entities a drawing may expand to (block references included). */
  maxEntities: number;
  /** Deepest nesting of block references. */
  maxBlockDepth: number;
  /** Most polyline vertices a drawing may expand to after curves are tessellated (all entities together). */
  maxVertices: number;
  /** Most memory the router's grid and search arrays may take, bytes. */
  maxRouteBytes: number;
  /** Largest |coordinate| kept, drawing units: beyond it sums and squares of coordinates overflow or lose all precision. */
  maxCoordinate: number;
  /** Most vertices of a self-intersecting outline the site stage repairs (more are skipped with a warning). */
  maxRepairVertices: number;
}

const MB = 1024 * 1024;

export const LIMITS: Readonly<LimitTable> = Object.freeze({
  maxFileBytes: 200 * MB,
  maxEntities: 2_000_000,
  maxBlockDepth: 16,
  // 20 M vertices are 320 MB as Float64 x,y pairs: a site plan has thousands to a few hundred thousand
  maxVertices: 20_000_000,
  // a desktop with 8 GB keeps room for the app, the drawing and the exports
  maxRouteBytes: 2048 * MB,
  // state-plane feet and UTM metres are below 1e8, millimetre drawings below 1e11; squares stay far from overflow
  maxCoordinate: 1e12,
  // measured: a 5 000-vertex zig-zag footprint repairs in 1.9 s, 20 000 in 7 s, 40 000 in 32 s
  maxRepairVertices: 10_000,
});

const fmtMB = (bytes: number): string => (bytes >= 1024 * MB ? `${(bytes / (1024 * MB)).toFixed(1)} GB` : `${(bytes / MB).toFixed(bytes >= 10 * MB ? 0 : 1)} MB`);
const fmtInt = (n: number): string => Math.round(n).toLocaleString('en-US');

/** Message for a drawing that expands to too many polyline vertices. */
export function vertexLimitMessage(maxVertices: number): string {
  return `the drawing expands to more than ${fmtInt(maxVertices)} polyline vertices (curves and block references included); ` +
    'simplify dense polylines or curves (or purge detail the site plan does not need), or raise the vertex limit';
}

// ---- routing grid size -------------------------------------------------------------------------
// Bytes the site router allocates per grid node and per search state (a state is a node and the
// direction of arrival: 8 per node). Read from core/route/site (routingGrid.ts, siteSteiner.ts,
// lowerBound.ts, routeSite.ts, bucketQueue.ts); checked against measured allocations in
// tests/hardening/routeMemory.test.ts.
/** Per node: free, onEdge, moves, pave, paveNear (1 each), cross (4), cost (8 × Float32 = 32),
 *  mark, adj (1 each), star-exchange buffers (4 × (Float64 + Int32) = 48), lower bound (Float64 + Int32 = 12),
 *  component labels (Int32 = 4), best-tree copy (1). */
export const ROUTE_BYTES_PER_NODE = 5 + 4 + 32 + 2 + 48 + 12 + 4 + 1;
/** Per state: dist (Float64), pred and stamp (Int32 each) = 16, and the bucket queue's entries: 24 bytes
 *  each (Int32 + Float64 + Int32 + Float64), about 1.5 per state at the pool's largest (measured on
 *  generated sites), and the pool doubles by copying, so the old pool is live while the new one fills:
 *  1.5 × 24 × 2 = 72. */
export const ROUTE_BYTES_PER_STATE = 16 + 72;
export const ROUTE_STATES_PER_NODE = 8;

export interface RouteMemoryEstimate {
  /** Grid nodes (cells) nx × ny over the boundary's bounding box. */
  cells: number;
  nx: number;
  ny: number;
  /** Search states: cells × 8 directions of arrival. */
  states: number;
  /** Estimated peak bytes of the router's arrays. */
  bytes: number;
}

function boundaryBox(site: Site): { minX: number; minY: number; maxX: number; maxY: number } {
  const b = site.boundary;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i + 1 < b.length; i += 2) {
    if (b[i] < minX) minX = b[i];
    if (b[i] > maxX) maxX = b[i];
    if (b[i + 1] < minY) minY = b[i + 1];
    if (b[i + 1] > maxY) maxY = b[i + 1];
  }
  return { minX, minY, maxX, maxY };
}

/** Grid size for a cell of `cell` site units over the box (the router's lattice: routingGrid.ts). */
function gridDims(box: { minX: number; minY: number; maxX: number; maxY: number }, cell: number): { nx: number; ny: number } {
  const x0 = Math.floor(box.minX / cell) * cell, y0 = Math.floor(box.minY / cell) * cell;
  return { nx: Math.floor((box.maxX - x0) / cell) + 2, ny: Math.floor((box.maxY - y0) / cell) + 2 };
}

function estimateFor(box: { minX: number; minY: number; maxX: number; maxY: number }, cell: number): RouteMemoryEstimate {
  const { nx, ny } = gridDims(box, cell);
  const cells = nx * ny;
  const states = cells * ROUTE_STATES_PER_NODE;
  return { cells, nx, ny, states, bytes: cells * ROUTE_BYTES_PER_NODE + states * ROUTE_BYTES_PER_STATE };
}

/** The router's grid size and peak memory for a site and route settings, before building anything. */
export function estimateRouteMemory(site: Site, route: RouteSettings): RouteMemoryEstimate {
  const cell = fromMetres(route.cellM, site.units);
  const box = boundaryBox(site);
  if (!(cell > 0) || ![box.minX, box.minY, box.maxX, box.maxY].every(Number.isFinite)) {
    return { cells: Infinity, nx: Infinity, ny: Infinity, states: Infinity, bytes: Infinity };
  }
  return estimateFor(box, cell);
}

export interface LimitError { kind: 'limit'; message: string }

/** Cell sizes offered in a suggestion, metres (coarser steps for bigger sites). */
const NICE_CELLS_M = [0.1, 0.2, 0.25, 0.3, 0.4, 0.5, 0.6, 0.75, 0.8, 1, 1.2, 1.25, 1.5, 2, 2.5, 3, 4, 5, 6, 7.5, 8, 10];

/**
 * null when the route fits in `maxBytes` (default LIMITS.maxRouteBytes); else a limit error whose
 * message names the grid, its memory, and a cell size that fits (or a smaller boundary).
 */
export function checkRouteSize(site: Site, route: RouteSettings, maxBytes: number = LIMITS.maxRouteBytes): LimitError | null {
  const est = estimateRouteMemory(site, route);
  if (est.bytes <= maxBytes) return null;
  const box = boundaryBox(site);
  const u = site.units;
  const w = box.maxX - box.minX, h = box.maxY - box.minY;
  if (!Number.isFinite(est.bytes)) {
    return { kind: 'limit', message: `the site boundary is not a finite area (${w} × ${h} ${u}); draw a closed site boundary on a boundary layer` };
  }
  const perUnitM = metresPerUnit(u);
  let fit: { cellM: number; est: RouteMemoryEstimate } | null = null;
  for (const c of NICE_CELLS_M) {
    if (c <= route.cellM) continue;
    const e = estimateFor(box, fromMetres(c, u));
    if (e.bytes <= maxBytes) { fit = { cellM: c, est: e }; break; }
  }
  const grid = `${fmtInt(est.nx)} × ${fmtInt(est.ny)} = ${fmtInt(est.cells)} cells × ${ROUTE_STATES_PER_NODE} directions = ${fmtInt(est.states)} search states`;
  const area = `${(w * perUnitM).toFixed(0)} m × ${(h * perUnitM).toFixed(0)} m${u === 'ft' ? ` (${w.toFixed(0)} ft × ${h.toFixed(0)} ft)` : ''}`;
  const cellText = (m: number): string => `${m} m${u === 'ft' ? ` (${(m / perUnitM).toFixed(2)} ft)` : ''}`;
  const suggest = fit
    ? `use a coarser grid cell: route.cellM ${cellText(fit.cellM)} would need about ${fmtMB(fit.est.bytes)}; or draw a smaller site boundary around the area to route`
    : 'draw a smaller site boundary (a closed outline on a boundary layer) around the area to route; no cell size up to 10 m fits this area';
  return {
    kind: 'limit',
    message: `routing a site of ${area} with ${cellText(route.cellM)} cells makes a grid of ${grid} and would need about ${fmtMB(est.bytes)} of memory, over the ${fmtMB(maxBytes)} limit; ${suggest}`,
  };
}
