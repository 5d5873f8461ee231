// dxf-parser entities → Drawing entities: curves tessellated, block references expanded
// (nested, with scale, mirror, rotation, base point and arrays), paper space dropped.

import type { DrawingEntity, SourceKind } from './drawing';
import { type Affine, IDENTITY, applyInPlace, compose, insertTransform, isIdentity, maxStretch } from './affine';
import { ccwSweep, circleRing, ellipsePoints, interpolateFitPoints, pushArc, pushBulge, splinePoints } from './tessellate';
import type { RawCircle, RawEllipse, RawPolyline } from './parserHandlers';
import { plainText } from './plainText';
import { LIMITS, vertexLimitMessage } from '../limits';

export interface ExplodeLimits { maxEntities: number; maxBlockDepth: number; chordTolerance: number; maxVertices?: number }

export type ExplodeFailure = { kind: 'limit'; message: string };

interface Block { name: string; position?: { x: number; y: number }; entities?: any[] }

const TWO_PI = Math.PI * 2;
/** Highest SPLINE degree read (drawing programs write 1 to 3, some up to 11; common practice). */
const MAX_SPLINE_DEGREE = 25;

class LimitError extends Error {}

export class Exploder {
  readonly out: DrawingEntity[] = [];
  readonly skipped = new Map<string, number>();
  readonly notes: string[] = [];
  private readonly stack: string[] = [];
  private vertices = 0;
  /** Copies of the block being expanded made by the enclosing INSERT arrays. */
  private copies = 1;

  constructor(private readonly blocks: Record<string, Block>, private readonly limits: ExplodeLimits) {}

  /** Expand the model-space entities; a limit breach returns a failure instead of throwing. */
  run(entities: any[]): ExplodeFailure | null {
    try {
      for (const e of entities) {
        if (e.inPaperSpace) continue;
        this.entity(e, IDENTITY, null, e.handle === undefined ? undefined : String(e.handle));
      }
    } catch (x) {
      if (x instanceof LimitError) return { kind: 'limit', message: x.message };
      throw x;
    }
    return null;
  }

  private skip(type: string): void {
    this.skipped.set(type, (this.skipped.get(type) ?? 0) + 1);
  }

  private emit(e: DrawingEntity): void {
    if (this.out.length >= this.limits.maxEntities) {
      throw new LimitError(
        `the drawing expands to more than ${this.limits.maxEntities} entities (block references included); ` +
          'purge unused detail or raise the entity limit',
      );
    }
    if (e.kind === 'polyline') {
      this.vertices += e.points.length / 2;
      const max = this.limits.maxVertices ?? LIMITS.maxVertices;
      if (this.vertices > max) throw new LimitError(vertexLimitMessage(max));
    }
    this.out.push(e);
  }

  private layerOf(e: any, parentLayer: string | null): string {
    const own = typeof e.layer === 'string' && e.layer !== '' ? e.layer : '0';
    // entities on layer 0 inside a block take the layer of the block reference (DXF convention)
    return own === '0' && parentLayer !== null ? parentLayer : own;
  }

  private poly(layer: string, source: SourceKind, pts: number[], closed: boolean, m: Affine, handle?: string): void {
    for (let i = 0; i < pts.length; i++) {
      if (!Number.isFinite(pts[i])) {
        this.skip(`${source} (coordinates not finite numbers)`);
        return;
      }
      if (Math.abs(pts[i]) > LIMITS.maxCoordinate) {
        this.skip(`${source} (coordinates beyond ±${LIMITS.maxCoordinate.toExponential()} drawing units)`);
        return;
      }
    }
    dedupe(pts, closed);
    if (pts.length < 4) {
      this.skip(`${source} (degenerate)`);
      return;
    }
    if (!isIdentity(m)) {
      applyInPlace(m, pts);
      // a block reference's scale or position (NaN, 1e308) can spoil points that were fine in the block
      for (let i = 0; i < pts.length; i++) {
        if (!(Math.abs(pts[i]) <= LIMITS.maxCoordinate)) {
          this.skip(`${source} (block reference places it beyond ±${LIMITS.maxCoordinate.toExponential()} drawing units or at no number)`);
          return;
        }
      }
    }
    const ent: DrawingEntity = { kind: 'polyline', layer, source, points: Float64Array.from(pts), closed };
    if (handle !== undefined) ent.handle = handle;
    this.emit(ent);
  }

  private entity(e: any, m: Affine, parentLayer: string | null, handle: string | undefined): void {
    const layer = this.layerOf(e, parentLayer);
    const tol = this.limits.chordTolerance / Math.max(1e-12, maxStretch(m));
    switch (e.type) {
      case 'LINE': {
        const v = e.vertices;
        if (!v || v.length < 2) return this.skip('LINE (incomplete)');
        this.poly(layer, 'LINE', [v[0].x, v[0].y, v[1].x, v[1].y], false, m, handle);
        return;
      }
      case 'LWPOLYLINE':
      case 'POLYLINE':
        return this.polyline(e as RawPolyline, layer, m, tol, handle);
      case 'CIRCLE': {
        const c = e as RawCircle;
        if (!(c.radius > 0)) return this.skip('CIRCLE (zero radius)');
        const mm = c.extrusionZ < 0 ? compose(m, [-1, 0, 0, 1, 0, 0]) : m;
        this.poly(layer, 'CIRCLE', circleRing(c.center.x, c.center.y, c.radius, tol), true, mm, handle);
        return;
      }
      case 'ARC': {
        if (!e.center || !(e.radius > 0)) return this.skip('ARC (incomplete)');
        const sweep = ccwSweep(e.startAngle ?? 0, e.endAngle ?? TWO_PI);
        if (Number.isNaN(sweep)) return this.skip('ARC (angles not finite numbers)');
        const pts: number[] = [];
        pushArc(pts, e.center.x, e.center.y, e.radius, e.startAngle ?? 0, sweep, tol, true);
        const mm = (e.extrusionDirectionZ ?? 1) < 0 ? compose(m, [-1, 0, 0, 1, 0, 0]) : m;
        this.poly(layer, 'ARC', pts, false, mm, handle);
        return;
      }
      case 'ELLIPSE': {
        const el = e as RawEllipse;
        // centre and major axis are WCS; the minor axis is extrusion × major, so with extrusion
        // (0,0,-1) the ellipse runs the other way: mirror across the major axis (DXF reference)
        const r = ellipsePoints(
          el.center.x, el.center.y, el.majorAxisEndPoint.x, el.majorAxisEndPoint.y, el.axisRatio,
          el.startAngle, el.endAngle, tol,
        );
        const points = el.extrusionZ < 0 ? mirrorAcross(r.points, el.center.x, el.center.y, el.majorAxisEndPoint.x, el.majorAxisEndPoint.y) : r.points;
        this.poly(layer, 'ELLIPSE', points, r.closed, m, handle);
        return;
      }
      case 'SPLINE':
        return this.spline(e, layer, m, tol, handle);
      case 'INSERT':
        return this.insert(e, m, layer, handle);
      case 'TEXT':
      case 'MTEXT': {
        const p = e.type === 'TEXT' ? e.startPoint : e.position;
        if (!p || typeof e.text !== 'string') return this.skip(`${e.type} (incomplete)`);
        const pt = [p.x, p.y];
        applyInPlace(m, pt);
        if (!Number.isFinite(pt[0]) || !Number.isFinite(pt[1])) return this.skip(`${e.type} (coordinates not finite numbers)`);
        if (Math.abs(pt[0]) > LIMITS.maxCoordinate || Math.abs(pt[1]) > LIMITS.maxCoordinate) return this.skip(`${e.type} (coordinates beyond ±${LIMITS.maxCoordinate.toExponential()} drawing units)`);
        const h = (e.type === 'TEXT' ? e.textHeight : e.height) ?? 1;
        const rot = (Math.atan2(m[1], m[0]) * 180) / Math.PI + (e.rotation ?? 0);
        const ent: DrawingEntity = {
          kind: 'text', layer, x: pt[0], y: pt[1], height: h * Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2])),
          rotationDeg: rot, text: plainText(e.text, e.type === 'MTEXT'),
        };
        if (handle !== undefined) ent.handle = handle;
        this.emit(ent);
        return;
      }
      default:
        this.skip(String(e.type));
    }
  }

  private polyline(e: RawPolyline, layer: string, m: Affine, tol: number, handle?: string): void {
    if (e.type === 'POLYLINE' && (e.flags & (16 | 64)) !== 0) return this.skip('POLYLINE (mesh)');
    if (e.seqendMissing) this.notes.push(`a POLYLINE${e.handle ? ` (handle ${e.handle})` : ''} has no SEQEND; read up to the next entity`);
    const is3d = (e.flags & 8) !== 0;
    // spline-fit frame control points are not on the curve; the fitted vertices are
    const vs = e.vertices.filter((v) => (v.flags & 16) === 0);
    if (vs.length < 2) return this.skip(`${e.type} (fewer than 2 vertices)`);
    const closed = (e.flags & 1) !== 0;
    const pts: number[] = [vs[0].x, vs[0].y];
    const n = vs.length;
    const segs = closed ? n : n - 1;
    for (let i = 0; i < segs; i++) {
      const a = vs[i];
      const b = vs[(i + 1) % n];
      pushBulge(pts, a.x, a.y, b.x, b.y, is3d ? 0 : a.bulge, tol);
    }
    if (closed) pts.length -= 2; // the last segment ended on the first point
    const mm = e.extrusionZ < 0 ? compose(m, [-1, 0, 0, 1, 0, 0]) : m;
    this.poly(layer, e.type, pts, closed, mm, handle);
  }

  private spline(e: any, layer: string, m: Affine, tol: number, handle?: string): void {
    const cps: { x: number; y: number }[] | undefined = e.controlPoints;
    const knots: number[] | undefined = e.knotValues;
    const p: number = e.degreeOfSplineCurve ?? 3;
    // a degree from a damaged file (negative, fractional, huge) would size arrays with it
    if (!Number.isInteger(p) || p < 1 || p > MAX_SPLINE_DEGREE) return this.skip(`SPLINE (degree not a whole number from 1 to ${MAX_SPLINE_DEGREE})`);
    let pts: number[];
    if (cps && knots && cps.length > p && knots.length === cps.length + p + 1) {
      const ctrl = new Float64Array(cps.length * 2);
      cps.forEach((c, i) => { ctrl[2 * i] = c.x; ctrl[2 * i + 1] = c.y; });
      pts = splinePoints(p, knots, ctrl, tol);
      if (e.rational) this.notes.push('a rational SPLINE was approximated without its weights');
    } else if (e.fitPoints && e.fitPoints.length >= 2) {
      const fit: number[] = e.fitPoints.flatMap((f: { x: number; y: number }) => [f.x, f.y]);
      const curve = interpolateFitPoints(fit, p);
      if (curve) {
        pts = splinePoints(curve.p, curve.knots, curve.ctrl, tol);
      } else {
        pts = fit;
        this.notes.push('a SPLINE with only fit points was drawn as straight segments through them');
      }
    } else {
      return this.skip('SPLINE (incomplete)');
    }
    const closed = !!e.closed || (pts.length >= 6 && pts[0] === pts[pts.length - 2] && pts[1] === pts[pts.length - 1]);
    if (closed && pts[0] === pts[pts.length - 2] && pts[1] === pts[pts.length - 1]) pts.length -= 2;
    this.poly(layer, 'SPLINE', pts, closed, m, handle);
  }

  private insert(e: any, m: Affine, layer: string, handle?: string): void {
    const name: string = e.name;
    const block = this.blocks[name];
    if (!block) {
      this.notes.push(`INSERT of unknown block '${name}' skipped`);
      return;
    }
    if (this.stack.includes(name)) {
      throw new LimitError(`block '${name}' inserts itself (${[...this.stack, name].join(' → ')}); the drawing's blocks are recursive`);
    }
    if (this.stack.length >= this.limits.maxBlockDepth) {
      throw new LimitError(`blocks nest deeper than ${this.limits.maxBlockDepth} levels (${[...this.stack, name].join(' → ')})`);
    }
    const base = block.position ?? { x: 0, y: 0 };
    const pos = e.position ?? { x: 0, y: 0 };
    const cols = Math.max(1, e.columnCount ?? 1);
    const rows = Math.max(1, e.rowCount ?? 1);
    if (cols * rows > this.limits.maxEntities) {
      throw new LimitError(`an INSERT array of ${cols} × ${rows} exceeds the entity limit of ${this.limits.maxEntities}`);
    }
    // arrays inside arrays multiply: refuse before expanding rather than after millions of entities
    const copies = this.copies * cols * rows;
    if (copies > this.limits.maxEntities) {
      throw new LimitError(`block '${name}' would be drawn ${copies.toExponential(1)} times (INSERT arrays nested in arrays: ${[...this.stack, name].join(' → ')}), over the entity limit of ${this.limits.maxEntities}`);
    }
    const mirror = (e.extrusionDirection?.z ?? 1) < 0;
    const outerCopies = this.copies;
    this.copies = copies;
    this.stack.push(name);
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const local = insertTransform(
          pos.x, pos.y, e.xScale ?? 1, e.yScale ?? 1, e.rotation ?? 0, base.x, base.y,
          c * (e.columnSpacing ?? 0), r * (e.rowSpacing ?? 0), mirror,
        );
        const mm = compose(m, local);
        for (const child of block.entities ?? []) {
          if (child.type === 'ATTDEF') continue;
          this.entity(child, mm, layer, handle);
        }
      }
    }
    this.stack.pop();
    this.copies = outerCopies;
  }
}

/** Remove repeated consecutive points (and a closing repeat of the first point when closed). */
function dedupe(pts: number[], closed: boolean): void {
  let w = 2;
  for (let r = 2; r < pts.length; r += 2) {
    if (pts[r] !== pts[w - 2] || pts[r + 1] !== pts[w - 1]) {
      pts[w] = pts[r];
      pts[w + 1] = pts[r + 1];
      w += 2;
    }
  }
  pts.length = w;
  if (closed && w >= 4 && pts[0] === pts[w - 2] && pts[1] === pts[w - 1]) pts.length = w - 2;
}

/** Reflect points across the line through (cx, cy) with direction (dx, dy). */
function mirrorAcross(pts: number[], cx: number, cy: number, dx: number, dy: number): number[] {
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len, uy = dy / len;
  const out = new Array<number>(pts.length);
  for (let i = 0; i < pts.length; i += 2) {
    const x = pts[i] - cx, y = pts[i + 1] - cy;
    const along = x * ux + y * uy;
    out[i] = cx + 2 * along * ux - x;
    out[i + 1] = cy + 2 * along * uy - y;
  }
  return out;
}
