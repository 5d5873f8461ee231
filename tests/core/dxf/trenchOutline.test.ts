// Trench outline (clipper-lib offset + union) against a closed form and against shapely's
// buffer/union of the same pieces (independent geometry library, /usr/bin/python3).
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { trenchOutline } from '../../../core/dxf/trenchOutline';
import { countBends } from '../../../core/pipeline';
import type { TrenchNetwork } from '../../../core/network/trenchNetwork';

function ringArea(r: Float64Array): number {
  let a = 0;
  for (let i = 0, n = r.length / 2; i < n; i++) {
    const j = (i + 1) % n;
    a += r[2 * i] * r[2 * j + 1] - r[2 * j] * r[2 * i + 1];
  }
  return a / 2;
}
// outer rings counter-clockwise, holes clockwise (clipper's orientation): the signed sum is the area
const area = (rings: Float64Array[]): number => rings.reduce((s, r) => s + ringArea(r), 0);

describe('trench outline', () => {
  it('a straight segment is a rectangle: area = length × width (closed form)', () => {
    const rings = trenchOutline([{ points: Float64Array.of(0, 0, 40, 0), width: 0.6 }], []);
    expect(rings).toHaveLength(1);
    expect(Math.abs(area(rings) - 40 * 0.6)).toBeLessThan(1e-6);
  });

  it('a bent, branching network matches shapely’s union of the same buffers', () => {
    const segs = [
      { points: [0, 0, 20, 0, 30, 10], width: 0.6 },
      { points: [20, 0, 20, -15], width: 0.45 },
      { points: [30, 10, 30, 25, 45, 25], width: 0.5 },
    ];
    const joints = [{ x: 20, y: 0, r: 0.3 }, { x: 30, y: 10, r: 0.3 }];
    const rings = trenchOutline(segs.map((s) => ({ points: Float64Array.from(s.points), width: s.width })), joints.map((j) => ({ x: j.x, y: j.y, radius: j.r })));
    const py = `
import json, sys
from shapely.geometry import LineString, Point
from shapely.ops import unary_union
d = json.loads(sys.argv[1])
parts = [LineString(list(zip(s["points"][0::2], s["points"][1::2]))).buffer(s["width"] / 2, cap_style=2, join_style=2, mitre_limit=2) for s in d["segs"]]
parts += [Point(j["x"], j["y"]).buffer(j["r"], 6) for j in d["joints"]]
u = unary_union(parts)
print(json.dumps({"area": u.area, "parts": len(getattr(u, "geoms", [u]))}))
`;
    const ref = JSON.parse(execFileSync('/usr/bin/python3', ['-c', py, JSON.stringify({ segs, joints })], { encoding: 'utf8' }));
    expect(ref.parts).toBe(1);
    // clipper works on a 1e-4 grid and both approximate the discs with 24 sides: 0.1 % of the area
    expect(Math.abs(area(rings) - ref.area) / ref.area).toBeLessThan(0.001);
  });
});

describe('bend count', () => {
  it('counts turns inside segments and at nodes where two segments meet, not straight runs or junctions', () => {
    const seg = (id: number, from: number, to: number, pts: number[], bendsDeg: number[]) => ({
      id, from, to, points: Float64Array.from(pts), length: 0, lengthUnderPavement: 0, crossings: [], bendsDeg, stub: false,
    });
    const net: TrenchNetwork = {
      units: 'm', frame: { originX: 0, originY: 0, scale: 1 },
      nodes: [], quality: { cost: 0, lowerBound: 0, gap: 0 }, unreachable: [], warnings: [],
      segments: [
        seg(0, 0, 1, [0, 0, 10, 0, 10, 10], [90]), // one 90° bend inside
        seg(1, 1, 2, [10, 10, 20, 20], []), // 45° turn at node 1 (degree 2)
        seg(2, 2, 3, [20, 20, 30, 30], []), // leaves node 2 in line with segment 1
        seg(3, 2, 4, [20, 20, 20, 30], []), // node 2 has degree 3 after this: a junction, not a bend
      ],
    };
    expect(countBends(net)).toBe(2);
  });
});
