// Joins each terminal to the routing grid. A service on a wall gets a straight stub along the
// wall's outward normal to a point Q just beyond the clearance, level with a free grid node G,
// and a short link Q→G along the wall direction (zero when G lies on the normal). A point of
// connection, or a service left off the walls, is joined by a straight stub to the nearest
// free grid node it can see. Terminals inside a building or without a free node nearby are
// reported as unreachable with the reason.

import type { Site, Terminal } from '../../site/site';
import { insidePolygon } from './geom';
import { nodeX, nodeY, segmentClear, type RoutingGrid } from './routingGrid';

export interface Anchor {
  /** Index into the terminal list. */
  term: number;
  px: number;
  py: number;
  /** End of the stub (equals P for connections, where the stub runs straight to G). */
  qx: number;
  qy: number;
  /** Grid node where the trench starts. */
  node: number;
  /** Unit direction of travel from G into the link/stub (0,0 when any direction is free). */
  ax: number;
  ay: number;
  /** True when P→Q is a stub (exempt from the clearance); false when P→G is ordinary trench. */
  stub: boolean;
}

export type AttachResult = { ok: true; anchor: Anchor } | { ok: false; reason: string };

function insideAnyBuilding(site: Site, x: number, y: number): number {
  for (let i = 0; i < site.buildings.length; i++) if (insidePolygon(site.buildings[i].outer, site.buildings[i].holes, x, y)) return i;
  return -1;
}

function insideAnyKeepOut(site: Site, x: number, y: number): number {
  for (let i = 0; i < site.keepOuts.length; i++) if (insidePolygon(site.keepOuts[i].outer, site.keepOuts[i].holes, x, y)) return i;
  return -1;
}

export function attachTerminal(site: Site, g: RoutingGrid, t: Terminal, term: number): AttachResult {
  const h = g.h, c = g.params.clearance;
  const reach = c + 4 * h;
  const i0 = Math.max(0, Math.floor((t.x - reach - g.x0) / h)), i1 = Math.min(g.nx - 1, Math.ceil((t.x + reach - g.x0) / h));
  const j0 = Math.max(0, Math.floor((t.y - reach - g.y0) / h)), j1 = Math.min(g.ny - 1, Math.ceil((t.y + reach - g.y0) / h));
  const cand: { v: number; k1: number; k2: number }[] = [];
  const wall = t.building >= 0 && (t.nx !== 0 || t.ny !== 0);
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const v = j * g.nx + i;
      if (!g.free[v] || g.moves[v] === 0) continue;
      const dx = nodeX(g, v) - t.x, dy = nodeY(g, v) - t.y;
      if (wall) {
        const along = dx * t.nx + dy * t.ny;
        const lat = Math.abs(dx * t.ny - dy * t.nx);
        if (along < c - 1e-9 || lat > h + 1e-9) continue;
        cand.push({ v, k1: Math.round(lat * 1e6), k2: along });
      } else {
        cand.push({ v, k1: Math.round(Math.hypot(dx, dy) * 1e6), k2: v });
      }
    }
  }
  cand.sort((a, b) => a.k1 - b.k1 || a.k2 - b.k2 || a.v - b.v);
  if (wall) {
    for (const k of cand) {
      const gx = nodeX(g, k.v), gy = nodeY(g, k.v);
      const along = (gx - t.x) * t.nx + (gy - t.y) * t.ny;
      const qx = t.x + t.nx * along, qy = t.y + t.ny * along;
      const linked = Math.hypot(gx - qx, gy - qy) > 1e-9;
      if (linked && !segmentClear(g, qx, qy, gx, gy)) continue;
      if (!linked && (g.obstacles.inside(qx, qy))) continue;
      const lx = linked ? qx - gx : -t.nx, ly = linked ? qy - gy : -t.ny;
      const l = Math.hypot(lx, ly);
      return { ok: true, anchor: { term, px: t.x, py: t.y, qx: linked ? qx : gx, qy: linked ? qy : gy, node: k.v, ax: lx / l, ay: ly / l, stub: true } };
    }
    return { ok: false, reason: `no free grid node beyond the ${c} ${site.units} clearance in front of the wall at (${t.x.toFixed(2)}, ${t.y.toFixed(2)}); the opening may be narrower than twice the clearance` };
  }
  const b = insideAnyBuilding(site, t.x, t.y);
  if (b >= 0) return { ok: false, reason: `inside building ${b + 1} (layer ${site.buildings[b].layer})` };
  const kz = insideAnyKeepOut(site, t.x, t.y);
  if (kz >= 0) return { ok: false, reason: `inside keep-out zone ${kz + 1} (layer ${site.keepOuts[kz].layer})` };
  const pointFree = segmentClear(g, t.x, t.y, t.x, t.y);
  for (const k of cand) {
    const gx = nodeX(g, k.v), gy = nodeY(g, k.v);
    if (pointFree && !segmentClear(g, t.x, t.y, gx, gy)) continue;
    return { ok: true, anchor: { term, px: t.x, py: t.y, qx: t.x, qy: t.y, node: k.v, ax: 0, ay: 0, stub: !pointFree } };
  }
  return { ok: false, reason: `no free grid node within ${reach.toFixed(2)} ${site.units} (enclosed by obstacles or outside the site boundary)` };
}
