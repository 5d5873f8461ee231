// Places service entries and points of connection on the site: drawing units → local routing
// units through site.frame; a service within the snap tolerance of a building wall is moved
// onto the nearest point of that wall and takes the wall's outward normal (for the
// perpendicular stub); farther away it stays where given and a problem is reported.
// Points of connection always stay where given.

import { insidePolygon } from '../route/site/geom';
import type { PointInput, Site, Terminal } from './site';

export interface PlaceProblem {
  id: string;
  message: string;
}

export interface PlaceOptions {
  /** Largest distance a service may be moved onto a wall, routing units. */
  snapTolerance: number;
}

interface WallHit {
  building: number;
  x: number;
  y: number;
  nx: number;
  ny: number;
  dist: number;
}

/** Nearest point on any building wall (outer rings and courtyards) with the wall's outward normal. */
export function nearestWall(site: Site, px: number, py: number): WallHit | null {
  let best: WallHit | null = null;
  site.buildings.forEach((b, bi) => {
    for (const r of [b.outer, ...b.holes]) {
      const nv = r.length / 2;
      for (let i = 0; i < nv; i++) {
        const j = (i + 1) % nv;
        const ax = r[2 * i], ay = r[2 * i + 1], bx = r[2 * j], by = r[2 * j + 1];
        const ex = bx - ax, ey = by - ay;
        const len2 = ex * ex + ey * ey;
        if (len2 === 0) continue;
        const t = Math.max(0, Math.min(1, ((px - ax) * ex + (py - ay) * ey) / len2));
        const qx = ax + t * ex, qy = ay + t * ey;
        const dist = Math.hypot(px - qx, py - qy);
        if (best && dist >= best.dist) continue;
        const len = Math.sqrt(len2);
        let nx = ey / len, ny = -ex / len;
        // Probe a hair outside the wall's midpoint to learn which side is the building.
        const eps = Math.max(1e-6, len * 1e-6);
        const mx = ax + ex / 2, my = ay + ey / 2;
        if (insidePolygon(b.outer, b.holes, mx + nx * eps, my + ny * eps)) { nx = -nx; ny = -ny; }
        best = { building: bi, x: qx, y: qy, nx, ny, dist };
      }
    }
  });
  return best;
}

export function placeTerminals(site: Site, points: readonly PointInput[], opts: PlaceOptions): { terminals: Terminal[]; problems: PlaceProblem[] } {
  const terminals: Terminal[] = [];
  const problems: PlaceProblem[] = [];
  const f = site.frame;
  const seen = new Set<string>();
  for (const p of points) {
    if (seen.has(p.id)) problems.push({ id: p.id, message: `point id "${p.id}" is used more than once; each copy is placed` });
    seen.add(p.id);
    if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) {
      problems.push({ id: p.id, message: `point ${p.id} has no valid coordinates (${p.x}, ${p.y}); left out` });
      continue;
    }
    const gx = (p.x - f.originX) * f.scale;
    const gy = (p.y - f.originY) * f.scale;
    const base: Terminal = {
      id: p.id, role: p.role, utilities: p.utilities.slice(), given: { x: gx, y: gy },
      x: gx, y: gy, nx: 0, ny: 0, building: -1, snapDistance: 0,
    };
    if (p.role === 'service') {
      const w = nearestWall(site, gx, gy);
      if (!w) {
        problems.push({ id: p.id, message: `service ${p.id}: the site has no building wall to attach it to; kept where given` });
      } else if (w.dist > opts.snapTolerance) {
        problems.push({
          id: p.id,
          message: `service ${p.id} is ${w.dist.toFixed(2)} ${site.units} from the nearest building wall (snap tolerance ${opts.snapTolerance} ${site.units}); kept where given, not snapped`,
        });
      } else {
        base.x = w.x; base.y = w.y; base.nx = w.nx + 0; base.ny = w.ny + 0; // + 0 turns -0 into 0
        base.building = w.building; base.snapDistance = w.dist;
      }
    }
    terminals.push(base);
  }
  return { terminals, problems };
}
