// Entity handlers registered into dxf-parser in place of its own for POLYLINE, LWPOLYLINE, CIRCLE
// and ELLIPSE: the stock POLYLINE handler loops forever when SEQEND is missing, the stock LWPOLYLINE
// handler throws on zero vertices, and the stock CIRCLE and ELLIPSE handlers drop the extrusion
// direction (a mirrored circle or ellipse has 210/220/230 = 0,0,-1). Group codes: DXF reference.

export interface Group { code: number; value: number | string | boolean }
export interface GroupScanner {
  next(): Group;
  isEOF(): boolean;
  lastReadGroup: Group;
}

export interface RawVertex { x: number; y: number; bulge: number; flags: number }

export interface RawPolyline {
  type: 'POLYLINE' | 'LWPOLYLINE';
  layer?: string;
  handle?: string | number;
  inPaperSpace?: boolean;
  flags: number;
  extrusionZ: number;
  vertices: RawVertex[];
  /** POLYLINE only: the SEQEND was missing (the next entity started right after the vertices). */
  seqendMissing?: boolean;
}

export interface RawCircle {
  type: 'CIRCLE';
  layer?: string;
  handle?: string | number;
  inPaperSpace?: boolean;
  center: { x: number; y: number };
  radius: number;
  extrusionZ: number;
}

type Common = { layer?: string; handle?: string | number; inPaperSpace?: boolean };

function common(e: Common, g: Group): void {
  if (g.code === 8) e.layer = String(g.value);
  else if (g.code === 5) e.handle = String(g.value);
  else if (g.code === 67) e.inPaperSpace = g.value !== 0;
}

const num = (v: Group['value']): number => (typeof v === 'number' ? v : Number(v));

export class PolylineHandler {
  public ForEntityName = 'POLYLINE' as const;
  public parseEntity(scanner: GroupScanner, start: Group): RawPolyline {
    const e: RawPolyline = { type: 'POLYLINE', flags: 0, extrusionZ: 1, vertices: [] };
    let g = scanner.next();
    while (g.code !== 0) {
      if (g.code === 70) e.flags = num(g.value) | 0;
      else if (g.code === 230) e.extrusionZ = num(g.value);
      else common(e, g);
      if (scanner.isEOF()) return e;
      g = scanner.next();
    }
    void start;
    while (g.code === 0 && g.value === 'VERTEX') {
      const v: RawVertex = { x: 0, y: 0, bulge: 0, flags: 0 };
      g = scanner.next();
      while (g.code !== 0) {
        if (g.code === 10) v.x = num(g.value);
        else if (g.code === 20) v.y = num(g.value);
        else if (g.code === 42) v.bulge = num(g.value);
        else if (g.code === 70) v.flags = num(g.value) | 0;
        g = scanner.next();
      }
      e.vertices.push(v);
    }
    if (g.code === 0 && g.value === 'SEQEND') {
      g = scanner.next();
      while (g.code !== 0) g = scanner.next();
    } else {
      e.seqendMissing = true;
    }
    return e;
  }
}

export class LwPolylineHandler {
  public ForEntityName = 'LWPOLYLINE' as const;
  public parseEntity(scanner: GroupScanner, _start: Group): RawPolyline {
    const e: RawPolyline = { type: 'LWPOLYLINE', flags: 0, extrusionZ: 1, vertices: [] };
    let v: RawVertex | null = null;
    let g = scanner.next();
    while (g.code !== 0) {
      switch (g.code) {
        case 10:
          v = { x: num(g.value), y: 0, bulge: 0, flags: 0 };
          e.vertices.push(v);
          break;
        case 20:
          if (v) v.y = num(g.value);
          break;
        case 42:
          if (v) v.bulge = num(g.value);
          break;
        case 70:
          e.flags = num(g.value) | 0;
          break;
        case 230:
          e.extrusionZ = num(g.value);
          break;
        default:
          common(e, g);
      }
      g = scanner.next();
    }
    return e;
  }
}

export class CircleHandler {
  public ForEntityName = 'CIRCLE' as const;
  public parseEntity(scanner: GroupScanner, _start: Group): RawCircle {
    const e: RawCircle = { type: 'CIRCLE', center: { x: 0, y: 0 }, radius: 0, extrusionZ: 1 };
    let g = scanner.next();
    while (g.code !== 0) {
      if (g.code === 10) e.center.x = num(g.value);
      else if (g.code === 20) e.center.y = num(g.value);
      else if (g.code === 40) e.radius = num(g.value);
      else if (g.code === 230) e.extrusionZ = num(g.value);
      else common(e, g);
      g = scanner.next();
    }
    return e;
  }
}

export interface RawEllipse {
  type: 'ELLIPSE';
  layer?: string;
  handle?: string | number;
  inPaperSpace?: boolean;
  center: { x: number; y: number };
  majorAxisEndPoint: { x: number; y: number };
  axisRatio: number;
  startAngle: number;
  endAngle: number;
  extrusionZ: number;
}

export class EllipseHandler {
  public ForEntityName = 'ELLIPSE' as const;
  public parseEntity(scanner: GroupScanner, _start: Group): RawEllipse {
    const e: RawEllipse = {
      type: 'ELLIPSE', center: { x: 0, y: 0 }, majorAxisEndPoint: { x: 1, y: 0 }, axisRatio: 1,
      startAngle: 0, endAngle: 2 * Math.PI, extrusionZ: 1,
    };
    let g = scanner.next();
    while (g.code !== 0) {
      switch (g.code) {
        case 10: e.center.x = num(g.value); break;
        case 20: e.center.y = num(g.value); break;
        case 11: e.majorAxisEndPoint.x = num(g.value); break;
        case 21: e.majorAxisEndPoint.y = num(g.value); break;
        case 40: e.axisRatio = num(g.value); break;
        case 41: e.startAngle = num(g.value); break;
        case 42: e.endAngle = num(g.value); break;
        case 230: e.extrusionZ = num(g.value); break;
        default: common(e, g);
      }
      g = scanner.next();
    }
    return e;
  }
}
