// Drawing + layer roles → Site: building footprints (closed shapes and rings stitched from pieces,
// courtyards as holes, overlaps unioned), keep-outs, pavement areas and their edges, crossing
// lines and the site boundary, all in routing units relative to a local origin.

import type { Drawing, PolylineEntity } from '../dxf/drawing';
import type { CrossingLine, LayerRole, Polygon, Ring, Site } from './site';
import { LAYER_ROLES } from './site';
import type { LengthUnit } from '../units';
import { fromMetres } from '../units';
import { err, ok, type Result } from '../result';
import { resolveFrame, toDrawing, toLocal } from './siteFrame';
import { stitchRings, type OpenChain } from './stitchRings';
import { assemblePolygons, polygonArea, repairRing, type LayeredRing } from './polygonSet';
import { selfIntersection, signedArea } from './rings';
import { suggestRoles } from './suggestRoles';
import { LIMITS } from '../limits';

export interface BuildSiteOptions {
  roles?: Record<string, LayerRole>;
  units?: LengthUnit;
  /** Margin around the drawing extents for the default boundary, metres (default 10). */
  marginM?: number;
  /** Largest gap closed when stitching pieces into rings, in routing units (default 0.02 m / 0.066 ft). */
  stitchTolerance?: number;
}

export interface SiteError { kind: string; message: string }

export const DEFAULT_MARGIN_M = 10;
/** Findings of one kind listed one by one before they are summed up. */
const MAX_LISTED = 10;
export const DEFAULT_STITCH_M = 0.02;

/** Plausible building footprints, m² (practice: a garden shed to a large distribution centre). */
const PLAUSIBLE_MIN_M2 = 4;
const PLAUSIBLE_MAX_M2 = 200_000;

interface RoleGeometry { rings: LayeredRing[]; open: OpenChain[]; openLayers: Map<OpenChain, string> }

export function buildSite(drawing: Drawing, opts: BuildSiteOptions = {}): Result<Site, SiteError> {
  const warnings: string[] = [];
  const roles = resolveRoles(drawing, opts.roles, warnings);
  if (!roles.ok) return roles;
  const roleOf = roles.value;

  // extents of what is used (ignored layers such as title blocks far away do not widen the site)
  const ext = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  // one pass: group polylines by role and take the extents of what is used
  const byRole = new Map<LayerRole, PolylineEntity[]>();
  let lastLayer = '';
  let lastList: PolylineEntity[] | null = null;
  for (const e of drawing.entities) {
    if (e.kind !== 'polyline') continue;
    if (e.layer !== lastLayer) {
      lastLayer = e.layer;
      const role = roleOf[e.layer] ?? 'ignore';
      if (role === 'ignore') lastList = null;
      else {
        lastList = byRole.get(role) ?? null;
        if (!lastList) { lastList = []; byRole.set(role, lastList); }
      }
    }
    if (lastList === null) continue;
    lastList.push(e);
    const p = e.points;
    for (let i = 0; i < p.length; i += 2) {
      const x = p[i], y = p[i + 1];
      if (x < ext.minX) ext.minX = x;
      if (x > ext.maxX) ext.maxX = x;
      if (y < ext.minY) ext.minY = y;
      if (y > ext.maxY) ext.maxY = y;
    }
  }
  const usedExt = Number.isFinite(ext.minX) ? ext : drawing.header.extents;
  const fr = resolveFrame(drawing.header.insUnits, usedExt, opts.units);
  if (!fr.ok) return fr;
  const { units, frame } = fr.value;
  const tol = opts.stitchTolerance ?? fromMetres(DEFAULT_STITCH_M, units);
  const minArea = tol * tol;

  const where = (x: number, y: number): string => {
    const p = toDrawing(frame, x, y);
    return `(${fmt(p.x)}, ${fmt(p.y)})`;
  };

  const gather = (role: LayerRole): RoleGeometry => {
    const ents = byRole.get(role) ?? [];
    const closed: LayeredRing[] = [];
    const pieces: Float64Array[] = [];
    const pieceLayer: string[] = [];
    for (const e of ents) {
      const pts = toLocal(frame, e.points);
      if (e.closed) closed.push({ ring: pts, layer: e.layer });
      else { pieces.push(pts); pieceLayer.push(e.layer); }
    }
    // stitch per layer so pieces on different layers never join
    const open: OpenChain[] = [];
    const openLayers = new Map<OpenChain, string>();
    const perLayer = new Map<string, Float64Array[]>();
    for (let i = 0; i < pieces.length; i++) {
      const l = perLayer.get(pieceLayer[i]);
      if (l) l.push(pieces[i]); else perLayer.set(pieceLayer[i], [pieces[i]]);
    }
    for (const [layer, mine] of perLayer) {
      const st = stitchRings(mine, tol);
      for (const r of st.rings) closed.push({ ring: r, layer });
      for (const o of st.open) { open.push(o); openLayers.set(o, layer); }
    }
    return { rings: cleanRings(closed, minArea, role, warnings, where), open, openLayers };
  };

  // buildings
  const buildingLayers = Object.keys(roleOf).filter((l) => roleOf[l] === 'building').sort();
  if (buildingLayers.length === 0) {
    return err({ kind: 'no-building-layer', message: 'no layer has the building role; name the footprint layer(s) in roles.json (e.g. { "BLDG": "building" })' });
  }
  const bg = gather('building');
  if (bg.rings.length === 0) {
    const gaps = bg.open.slice(0, 5).map((o) => `gap of ${fmt(o.gap.length / frame.scale)} between ${where(o.gap.x0, o.gap.y0)} and ${where(o.gap.x1, o.gap.y1)} on ${bg.openLayers.get(o)}`);
    return err({
      kind: 'no-buildings',
      message: `no closed shapes on the building layer(s) ${buildingLayers.join(', ')}` +
        (gaps.length ? `; open outlines: ${gaps.join('; ')}${bg.open.length > 5 ? ` and ${bg.open.length - 5} more` : ''}` : '') +
        '. Close the outlines (or raise the stitch tolerance), or give the footprint layer in roles.json',
    });
  }
  for (const o of bg.open.slice(0, MAX_LISTED)) {
    warnings.push(`open outline on building layer ${bg.openLayers.get(o)} not used: gap of ${fmt(o.gap.length / frame.scale)} drawing units between ${where(o.gap.x0, o.gap.y0)} and ${where(o.gap.x1, o.gap.y1)}`);
  }
  if (bg.open.length > MAX_LISTED) warnings.push(`… and ${bg.open.length - MAX_LISTED} more open outlines on building layers`);
  const buildings = assemblePolygons(bg.rings);
  plausibility(buildings, units, warnings);

  const kg = gather('keep-out');
  for (const o of kg.open.slice(0, MAX_LISTED)) warnings.push(`open outline on keep-out layer ${kg.openLayers.get(o)} ignored (gap at ${where(o.gap.x0, o.gap.y0)})`);
  if (kg.open.length > MAX_LISTED) warnings.push(`… and ${kg.open.length - MAX_LISTED} more open outlines on keep-out layers`);
  const keepOuts = assemblePolygons(kg.rings);

  const pg = gather('pavement');
  const pavements = assemblePolygons(pg.rings);
  const crossings: CrossingLine[] = [];
  for (const p of pavements) {
    for (const r of [p.outer, ...p.holes]) crossings.push({ points: r, closed: true, layer: p.layer, kind: 'pavement-edge' });
  }
  for (const o of pg.open) crossings.push({ points: o.points, closed: false, layer: pg.openLayers.get(o) ?? '', kind: 'pavement-edge' });
  if (pg.open.length > 0) warnings.push(`${pg.open.length} open line(s) on pavement layers counted as pavement edges only (no area)`);

  for (const e of byRole.get('crossing') ?? []) {
    crossings.push({ points: toLocal(frame, e.points), closed: e.closed, layer: e.layer, kind: 'line' });
  }

  // boundary: the largest closed ring on a boundary layer, else the used extents plus a margin
  let boundary: Ring | null = null;
  const bd = gather('boundary');
  for (const r of bd.rings) if (!boundary || Math.abs(signedArea(r.ring)) > Math.abs(signedArea(boundary))) boundary = r.ring;
  if (boundary) boundary = ccwRing(boundary);
  if (!boundary) {
    if ((byRole.get('boundary') ?? []).length > 0) warnings.push('no closed ring on the boundary layer(s); using the drawing extents plus a margin');
    const m = fromMetres(opts.marginM ?? DEFAULT_MARGIN_M, units);
    const lo = toLocal(frame, [usedExt.minX, usedExt.minY, usedExt.maxX, usedExt.maxY]);
    boundary = Float64Array.from([lo[0] - m, lo[1] - m, lo[2] + m, lo[1] - m, lo[2] + m, lo[3] + m, lo[0] - m, lo[3] + m]);
  }

  return ok({ units, frame, buildings, keepOuts, pavements, crossings, boundary, roles: roleOf, warnings: [...drawing.warnings, ...warnings] });
}

function ccwRing(r: Ring): Ring {
  // rebuild pairwise (Float64Array.reverse would swap x and y)
  if (signedArea(r) >= 0) return r;
  const n = r.length / 2;
  const out = new Float64Array(r.length);
  for (let i = 0; i < n; i++) { out[2 * i] = r[2 * (n - 1 - i)]; out[2 * i + 1] = r[2 * (n - 1 - i) + 1]; }
  return out;
}

function resolveRoles(drawing: Drawing, given: Record<string, LayerRole> | undefined, warnings: string[]): Result<Record<string, LayerRole>, SiteError> {
  const out: Record<string, LayerRole> = {};
  if (!given) {
    for (const s of suggestRoles(drawing)) out[s.layer] = s.role;
    return ok(out);
  }
  // DXF layer names are case-insensitive: a role for 'bldg' applies to layer 'BLDG'
  const byUpper = new Map(drawing.layers.map((l) => [l.name.toUpperCase(), l.name]));
  for (const [layer, role] of Object.entries(given)) {
    if (!LAYER_ROLES.includes(role)) {
      return err({ kind: 'bad-role', message: `layer '${layer}' has role '${String(role)}'; roles are ${LAYER_ROLES.join(', ')}` });
    }
    const name = byUpper.get(layer.toUpperCase());
    if (name === undefined) {
      warnings.push(`roles name layer '${layer}', which the drawing does not have`);
      out[layer] = role;
    } else {
      out[name] = role;
    }
  }
  for (const l of drawing.layers) if (!(l.name in out)) out[l.name] = 'ignore';
  return ok(out);
}

/** Drop degenerate and zero-area rings, repair self-intersecting ones; warnings say where. */
function cleanRings(rings: LayeredRing[], minArea: number, role: LayerRole, allWarnings: string[], where: (x: number, y: number) => string): LayeredRing[] {
  const out: LayeredRing[] = [];
  let repaired = 0, dropped = 0;
  for (const r of rings) {
    const hit = r.ring.length >= 8 ? selfIntersection(r.ring) : null;
    if (hit && r.ring.length / 2 > LIMITS.maxRepairVertices) {
      // the repair (a polygon union) grows with the square of the crossings: a 40 000-vertex zig-zag took 30 s
      allWarnings.push(`self-intersecting outline of ${r.ring.length / 2} vertices on ${role} layer ${r.layer} near ${where(hit.x, hit.y)} skipped: over ${LIMITS.maxRepairVertices} vertices is too many to repair; fix the outline in the drawing`);
      continue;
    }
    if (hit) {
      const parts = repairRing(r.ring, minArea);
      if (repaired++ < MAX_LISTED) allWarnings.push(`self-intersecting outline on ${role} layer ${r.layer} near ${where(hit.x, hit.y)} repaired into ${parts.length} simple ring(s)`);
      for (const p of parts) out.push({ ring: p, layer: r.layer });
      continue;
    }
    if (r.ring.length < 6 || Math.abs(signedArea(r.ring)) <= minArea) {
      if (dropped++ < MAX_LISTED) allWarnings.push(`zero-area ring on ${role} layer ${r.layer} at ${where(r.ring[0], r.ring[1])} skipped`);
      continue;
    }
    out.push(r);
  }
  if (repaired > MAX_LISTED) allWarnings.push(`… and ${repaired - MAX_LISTED} more self-intersecting outlines repaired on ${role} layers`);
  if (dropped > MAX_LISTED) allWarnings.push(`… and ${dropped - MAX_LISTED} more zero-area rings skipped on ${role} layers`);
  return out;
}

function plausibility(buildings: Polygon[], units: LengthUnit, warnings: string[]): void {
  const k = units === 'm' ? 1 : 0.3048 * 0.3048;
  const areas = buildings.map((b) => polygonArea(b) * k).sort((a, b) => a - b);
  const median = areas[Math.floor(areas.length / 2)];
  if (median < PLAUSIBLE_MIN_M2 || median > PLAUSIBLE_MAX_M2) {
    const shown = units === 'm' ? `${fmt(median)} m²` : `${fmt(median / k)} ft²`;
    warnings.push(
      `building footprints look implausible for ${units === 'm' ? 'metres' : 'feet'} (median ${shown}); check the drawing units (--units) or the building layer`,
    );
  }
}

function fmt(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(Math.abs(v) >= 1000 ? 2 : 3);
}
