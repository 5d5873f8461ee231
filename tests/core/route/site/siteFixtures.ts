// Hand-built sites for the router tests (no DXF reader involved). Local metres, frame at 0,0.

import type { CrossingLine, PointInput, Polygon, Site, Terminal } from '../../../../core/site/site';
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

/** Three buildings (one with a courtyard), a keep-out, a road strip and a fence. */
export function obstacleSite(): Site {
  const b2: Polygon = { outer: rect(15, 55, 50, 75), holes: [rect(25, 62, 40, 70)], layer: 'BLDG' };
  return makeSite({
    boundary: rect(0, 0, 120, 80),
    buildings: [building(10, 8, 40, 32), building(62, 8, 100, 28), b2],
    keepOuts: [{ outer: Float64Array.from([70, 50, 95, 50, 82, 72]), holes: [], layer: 'POND' }],
    pavements: [{ outer: rect(0, 40, 120, 46), holes: [], layer: 'ROAD' }],
    crossings: [line([52, 0, 52, 38], 'FENCE')],
  });
}

export const obstaclePoints: PointInput[] = [
  { id: 'C', x: 116, y: 4, role: 'connection', utilities: ['power'] },
  { id: 'X', x: 20, y: 20, role: 'connection', utilities: ['power'] },
  { id: 'S0', x: 25, y: 32.4, role: 'service', utilities: ['power'] },
  { id: 'S1', x: 61.7, y: 18, role: 'service', utilities: ['power'] },
  { id: 'S2', x: 35, y: 54.5, role: 'service', utilities: ['power'] },
  { id: 'S3', x: 100.3, y: 20, role: 'service', utilities: ['power'] },
  { id: 'S4', x: 30, y: 62.2, role: 'service', utilities: ['power'] },
];

