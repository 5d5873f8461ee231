// Hand-built sites for the router tests (no DXF reader involved). Local metres, frame at 0,0.

import type { CrossingLine, Polygon, Site, Terminal } from '../../../../core/site/site';
import { DEFAULT_ROUTE, type RouteSettings } from '../../../../core/settings';

export function rect(x0: number, y0: number, x1: number, y1: number): Float64Array {
  return Float64Array.from([x0, y0, x1, y0, x1, y1, x0, y1]);
}

export function building(x0: number, y0: number, x1: number, y1: number, layer = 'BLDG'): Polygon {
  return { outer: rect(x0, y0, x1, y1), holes: [], layer };
}

export function makeSite(parts: Partial<Site> & { boundary: Float64Array }): Site {
  return {
    units: 'm', frame: { originX: 0, originY: 0, scale: 1 },
    buildings: [], keepOuts: [], pavements: [], crossings: [], roles: {}, warnings: [],
    ...parts,
  };
}

export function line(points: number[], layer = 'FENCE', kind: CrossingLine['kind'] = 'line'): CrossingLine {
  return { points: Float64Array.from(points), closed: false, layer, kind };
}

export function connection(id: string, x: number, y: number): Terminal {
  return { id, role: 'connection', utilities: ['power'], given: { x, y }, x, y, nx: 0, ny: 0, building: -1, snapDistance: 0 };
}

export function service(id: string, x: number, y: number, nx: number, ny: number, buildingIndex: number): Terminal {
  return { id, role: 'service', utilities: ['power'], given: { x, y }, x, y, nx, ny, building: buildingIndex, snapDistance: 0 };
}

export function settings(over: Partial<RouteSettings> = {}): RouteSettings {
  return { ...DEFAULT_ROUTE, ...over };
}
