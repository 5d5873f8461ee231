// A generated site for the hardening tests: a rows × cols block of 12 m × 8 m buildings on a
// 30 m pitch inside a rectangular boundary, one point of connection at the lower left and a
// service on the south wall of every building. Metres, local frame at the origin.
import type { PointInput, Polygon, Site } from '../../core/site/site';

export function gridSite(rows: number, cols: number, pitchM = 30): { site: Site; points: PointInput[] } {
  const buildings: Polygon[] = [];
  const points: PointInput[] = [{ id: 'POC', x: 2, y: 2, role: 'connection', utilities: ['power', 'telecom'] }];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const x = 10 + c * pitchM, y = 10 + r * pitchM;
      buildings.push({ outer: Float64Array.from([x, y, x + 12, y, x + 12, y + 8, x, y + 8]), holes: [], layer: 'BLDG' });
      points.push({ id: `S${r}-${c}`, x: x + 6, y, role: 'service', utilities: ['power', 'telecom'] });
    }
  }
  const w = 10 + cols * pitchM, h = 10 + rows * pitchM;
  const site: Site = {
    units: 'm', frame: { originX: 0, originY: 0, scale: 1 }, buildings, keepOuts: [], pavements: [], crossings: [],
    boundary: Float64Array.from([0, 0, w, 0, w, h, 0, h]), roles: { BLDG: 'building' }, warnings: [],
  };
  return { site, points };
}
