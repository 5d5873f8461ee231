// Synthetic sites for the routing benchmark: an invented business park of `size` × `size` metres
// with a jittered lattice of rectangular buildings, a road grid (pavement), two fences and
// services on building walls; deterministic for a seed.

import type { CrossingLine, PointInput, Polygon, Site } from '../../core/site/site';
import { makeRng } from '../../core/route/rng';


const rect = (x0: number, y0: number, x1: number, y1: number): Float64Array => Float64Array.from([x0, y0, x1, y0, x1, y1, x0, y1]);

export function syntheticSite(size: number, services: number, seed = 7): { site: Site; points: PointInput[] } {
  const r = makeRng(seed);
  const blocks = Math.ceil(Math.sqrt(services * 1.3));
  const pitch = size / (blocks + 1);
  const road = Math.min(8, pitch * 0.15);
  const buildings: Polygon[] = [];
  const pavements: Polygon[] = [];
  // Roads between every fourth row and column of blocks.
  for (let i = 1; i <= blocks; i += 4) {
    const c = i * pitch - pitch / 2;
    pavements.push({ outer: rect(c - road / 2, 2, c + road / 2, size - 2), holes: [], layer: 'ROAD' });
    pavements.push({ outer: rect(2, c - road / 2, size - 2, c + road / 2), holes: [], layer: 'ROAD' });
  }
  for (let j = 0; j < blocks; j++) {
    for (let i = 0; i < blocks; i++) {
      const cx = (i + 1) * pitch + (r() - 0.5) * pitch * 0.1, cy = (j + 1) * pitch + (r() - 0.5) * pitch * 0.1;
      const w = pitch * (0.3 + 0.15 * r()), h = pitch * (0.25 + 0.15 * r());
      buildings.push({ outer: rect(cx - w / 2, cy - h / 2, cx + w / 2, cy + h / 2), holes: [], layer: 'BLDG' });
    }
  }
  const crossings: CrossingLine[] = [
    { points: Float64Array.from([size * 0.33, 1, size * 0.33 + 3, size - 1]), closed: false, layer: 'FENCE', kind: 'line' },
    { points: Float64Array.from([1, size * 0.61, size - 1, size * 0.58]), closed: false, layer: 'EXIST-WATER', kind: 'line' },
  ];
  const points: PointInput[] = [
    { id: 'POC1', x: size / 2 + 0.25, y: 1.25, role: 'connection', utilities: ['power', 'telecom'] },
    { id: 'POC2', x: 1.25, y: size / 2 + 0.25, role: 'connection', utilities: ['water'] },
  ];
  const order = buildings.map((_, i) => i);
  for (let i = order.length - 1; i > 0; i--) { const k = Math.floor(r() * (i + 1)); [order[i], order[k]] = [order[k], order[i]]; }
  for (let s = 0; s < services; s++) {
    const b = buildings[order[s]].outer;
    const side = Math.floor(r() * 4), t = 0.2 + 0.6 * r();
    const [x0, y0, x1, y1] = [b[0], b[1], b[4], b[5]];
    const pt = side === 0 ? [x0 + t * (x1 - x0), y0] : side === 1 ? [x1, y0 + t * (y1 - y0)] : side === 2 ? [x0 + t * (x1 - x0), y1] : [x0, y0 + t * (y1 - y0)];
    points.push({ id: `S${s + 1}`, x: pt[0], y: pt[1], role: 'service', utilities: ['power', 'telecom'] });
  }
  const site: Site = {
    units: 'm', frame: { originX: 0, originY: 0, scale: 1 }, buildings, keepOuts: [], pavements, crossings,
    boundary: rect(0, 0, size, size), roles: {}, warnings: [],
  };
  return { site, points };
}
