// Obstacle-free trees against closed forms.
// Sources: Gilbert & Pollak, "Steiner minimal trees", SIAM J. Appl. Math. 16 (1968): the unit
// square's Euclidean Steiner minimal tree is 1 + √3 long with two Steiner points where the
// branches meet at 120°; the equilateral triangle of side 1 has √3 (one Steiner point, its
// Fermat point). Hanan, "On Steiner's problem with rectilinear distance", SIAM J. Appl. Math.
// 14 (1966): the rectilinear Steiner minimal tree of three points is half the perimeter of
// their bounding box; the unit square's is 3.
import { describe, expect, it } from 'vitest';
import { routeSite } from '../../../../core/route/site/routeSite';
import type { TrenchNetwork } from '../../../../core/network/trenchNetwork';
import { connection, makeSite, rect, settings } from './siteFixtures';

const total = (n: TrenchNetwork): number => n.segments.reduce((a, s) => a + s.length, 0);

/** Angles in degrees between the branches at a node, sorted. */
function branchAngles(n: TrenchNetwork, nodeId: number): number[] {
  const node = n.nodes[nodeId];
  const dirs: number[] = [];
  for (const s of n.segments) {
    const p = s.points;
    if (s.from === nodeId) dirs.push(Math.atan2(p[3] - node.y, p[2] - node.x));
    if (s.to === nodeId) dirs.push(Math.atan2(p[p.length - 3] - node.y, p[p.length - 4] - node.x));
  }
  dirs.sort((a, b) => a - b);
  return dirs.map((d, i) => {
    let gap = (i + 1 < dirs.length ? dirs[i + 1] : dirs[0] + 2 * Math.PI) - d;
    if (gap < 0) gap += 2 * Math.PI;
    return (gap * 180) / Math.PI;
  });
}

describe('obstacle-free closed forms', () => {
  const s = 40;
  const square = [connection('A', 0, 0), connection('B', s, 0), connection('C', s, s), connection('D', 0, s)];
  const open = makeSite({ boundary: rect(-15, -15, s + 15, s + 15) });

  it('any-angle square corners: (1+√3)·s within 0.5 %, two junctions at 120° (Gilbert & Pollak 1968)', () => {
    const net = routeSite(open, square, settings({ style: 'any-angle' }));
    expect(Math.abs(total(net) - (1 + Math.sqrt(3)) * s) / ((1 + Math.sqrt(3)) * s)).toBeLessThan(0.005);
    const junctions = net.nodes.filter((x) => x.kind === 'junction');
    expect(junctions).toHaveLength(2);
    for (const j of junctions) {
      const angles = branchAngles(net, j.id);
      expect(angles).toHaveLength(3);
      for (const a of angles) expect(Math.abs(a - 120)).toBeLessThan(1); // 1° tolerance
    }
    expect(net.unreachable).toEqual([]);
  });

  it('orthogonal square corners: exactly 3·s (Hanan 1966)', () => {
    const net = routeSite(open, square, settings({ style: 'orthogonal' }));
    expect(total(net)).toBeCloseTo(3 * s, 6);
    // The reported lower bound never exceeds the closed-form optimum, and is close to it.
    expect(net.quality.lowerBound).toBeLessThanOrEqual(3 * s * (1 + 1e-12));
    expect(net.quality.lowerBound).toBeGreaterThanOrEqual(0.9 * 3 * s);
    for (const seg of net.segments) {
      const p = seg.points;
      for (let i = 0; i + 3 < p.length; i += 2) expect(p[i] === p[i + 2] || p[i + 1] === p[i + 3]).toBe(true);
    }
  });

  it('orthogonal, three terminals: half the bounding-box perimeter (Hanan 1966)', () => {
    const pts = [connection('P', 0, 0), connection('Q', 30, 10), connection('R', 12, 40)];
    const site = makeSite({ boundary: rect(-10, -10, 45, 55) });
    // Bounding box 30 × 40 → half perimeter 70.
    const net = routeSite(site, pts, settings({ style: 'orthogonal' }));
    expect(total(net)).toBeCloseTo(70, 6);
    expect(net.quality.lowerBound).toBeLessThanOrEqual(70 * (1 + 1e-12));
    expect(net.quality.lowerBound).toBeGreaterThanOrEqual(0.9 * 70);
  });

  it('any-angle equilateral triangle of side s: √3·s within 0.5 % (Gilbert & Pollak 1968)', () => {
    const h = (s * Math.sqrt(3)) / 2;
    const pts = [connection('P', 0, 0), connection('Q', s, 0), connection('R', s / 2, h)];
    const site = makeSite({ boundary: rect(-15, -15, s + 15, h + 15) });
    const net = routeSite(site, pts, settings({ style: 'any-angle' }));
    expect(Math.abs(total(net) - Math.sqrt(3) * s) / (Math.sqrt(3) * s)).toBeLessThan(0.005);
    const junctions = net.nodes.filter((x) => x.kind === 'junction');
    expect(junctions).toHaveLength(1);
    // The Fermat point of an equilateral triangle is its centroid.
    expect(Math.hypot(junctions[0].x - s / 2, junctions[0].y - h / 3)).toBeLessThan(0.01 * s);
  });

  it('a site in feet routes in feet: the 0.5 m cell becomes 0.5/0.3048 ft and the orthogonal square is 3·s (Hanan 1966)', () => {
    const h = 0.5 / 0.3048; // the default cell in feet (1 ft = 0.3048 m exactly)
    const s0 = 10 * h, f = 80 * h; // corners on lattice nodes (the lattice starts at the boundary corner)
    const site = { ...makeSite({ boundary: rect(0, 0, 100 * h, 100 * h) }), units: 'ft' as const };
    const pts = [connection('A', s0, s0), connection('B', s0 + f, s0), connection('C', s0 + f, s0 + f), connection('D', s0, s0 + f)];
    const net = routeSite(site, pts, settings({ style: 'orthogonal' }));
    expect(net.units).toBe('ft');
    expect(total(net)).toBeCloseTo(3 * f, 6);
  });

  it('octilinear square corners: the diagonal cross 2√2·s, every leg at a multiple of 45°', () => {
    // Octilinear length of a 45° leg from a corner to the centre: √2·s/2 (elementary geometry).
    const net = routeSite(open, square, settings({ style: 'octilinear' }));
    expect(total(net)).toBeCloseTo(2 * Math.SQRT2 * s, 6);
    for (const seg of net.segments) {
      const p = seg.points;
      for (let i = 0; i + 3 < p.length; i += 2) {
        const a = (Math.atan2(p[i + 3] - p[i + 1], p[i + 2] - p[i]) * 180) / Math.PI;
        expect(Math.abs(a / 45 - Math.round(a / 45))).toBeLessThan(1e-9);
      }
    }
  });
});
