// Random octilinear runs: every pull section between consecutive pull points (connection, boxes,
// service) must respect the limits, checked by an independent walk written here; for bend-only
// limits the number of boxes must equal the minimum found by brute force over vertex subsets.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeContents } from '../../../core/network/contents';
import { placePullBoxesWithWarnings } from '../../../core/network/pullBoxes';
import { DEFAULT_UTILITIES } from '../../../core/settings';
import type { UtilitySetting } from '../../../core/settings';
import { singleRun } from '../takeoff/handNetwork';

const power = DEFAULT_UTILITIES.find((u) => u.key === 'power') as UtilitySetting;
const legArb = fc.record({ turn: fc.constantFrom(-135, -90, -45, 0, 45, 90, 135), len: fc.integer({ min: 3, max: 60 }) });

/** Polyline from legs: heading changes by `turn` degrees before each leg after the first. */
function path(legs: { turn: number; len: number }[]): { pts: number[]; turns: number[]; legLen: number[] } {
  const pts = [0, 0];
  let h = 0, x = 0, y = 0;
  const turns: number[] = [];
  legs.forEach((l, i) => {
    if (i > 0) { h += l.turn; turns.push(Math.abs(l.turn)); }
    x += l.len * Math.cos((h * Math.PI) / 180);
    y += l.len * Math.sin((h * Math.PI) / 180);
    pts.push(x, y);
  });
  return { pts, turns, legLen: legs.map((l) => l.len) };
}

interface Limits { bend: number; pull: number; cable?: { w: number; f: number; max: number }; riser: number }

/** Pull sections by distance along the path; returns the worst excess over each limit (≤ 0 is fine). */
function check(p: ReturnType<typeof path>, boxesAt: number[], lim: Limits): { bend: number; pull: number; tension: number } {
  // Events along the path: vertex k (between leg k and k+1) at distance sum(legLen[0..k]).
  const vAt: number[] = [];
  let s = 0;
  p.legLen.forEach((l, k) => { s += l; if (k < p.legLen.length - 1) vAt.push(s); });
  const total = s;
  const cuts = [...boxesAt].sort((a, b) => a - b);
  const bounds = [0, ...cuts, total];
  const worst = { bend: -Infinity, pull: -Infinity, tension: -Infinity };
  for (let i = 0; i + 1 < bounds.length; i++) {
    const a = bounds[i], b = bounds[i + 1];
    let bend = (i === 0 ? lim.riser : 0) + (i + 2 === bounds.length ? lim.riser : 0);
    let t = 0;
    let pos = a;
    const f = lim.cable?.f ?? 0, w = lim.cable?.w ?? 0;
    if (i === 0 && lim.riser) t = 0; // nothing pulled before the first sweep
    vAt.forEach((v, k) => {
      if (v > a + 1e-7 && v < b - 1e-7) {
        t += f * w * (v - pos); // feet: the test runs in ft
        t *= Math.exp(f * (p.turns[k] * Math.PI) / 180);
        pos = v;
        bend += p.turns[k];
      }
    });
    t += f * w * (b - pos);
    if (i + 2 === bounds.length) t *= Math.exp(f * (lim.riser * Math.PI) / 180);
    worst.bend = Math.max(worst.bend, lim.bend ? bend - lim.bend : -1);
    worst.pull = Math.max(worst.pull, lim.pull ? (b - a) * 0.3048 - lim.pull : -1);
    worst.tension = Math.max(worst.tension, lim.cable ? t - lim.cable.max : -1);
  }
  return worst;
}

/** Where each box sits as distance along the path (its `at`), after checking that point is (x, y). */
function along(pts: number[], boxes: { x: number; y: number; at: number; segmentId: number }[]): number[] {
  return boxes.map((b) => {
    expect(b.segmentId).toBe(0);
    let s = 0;
    for (let i = 0; i + 2 < pts.length; i += 2) {
      const L = Math.hypot(pts[i + 2] - pts[i], pts[i + 3] - pts[i + 1]);
      if (b.at <= s + L + 1e-9) {
        const f = L ? (b.at - s) / L : 0;
        expect(Math.hypot(pts[i] + f * (pts[i + 2] - pts[i]) - b.x, pts[i + 1] + f * (pts[i + 3] - pts[i + 1]) - b.y)).toBeLessThan(1e-6);
        return b.at;
      }
      s += L;
    }
    throw new Error(`box at ${b.x},${b.y} (at ${b.at}) is past the end of the path`);
  });
}

/** Fewest boxes at vertices keeping every section's bend within the limit (brute force). */
function minBoxes(turns: number[], limit: number, riser: number): number {
  const n = turns.length;
  let best = Infinity;
  for (let mask = 0; mask < 1 << n; mask++) {
    let bend = riser, okay = true, count = 0;
    for (let k = 0; k < n && okay; k++) {
      if (mask & (1 << k)) { count++; if (bend > limit) okay = false; bend = 0; }
      else bend += turns[k];
    }
    if (okay && bend + riser <= limit) best = Math.min(best, count);
  }
  return best;
}

function place(pts: number[], u: UtilitySetting, risers: boolean) {
  const { net, terminals } = singleRun(pts, [u.key], 'ft');
  return placePullBoxesWithWarnings(net, computeContents(net, terminals, [u]), [u], { countRisers: risers });
}

describe('pull boxes on random runs', () => {
  it('bend-only limits: every section within the limit, with the fewest boxes possible (brute force)', () => {
    fc.assert(fc.property(fc.array(legArb, { minLength: 1, maxLength: 9 }), fc.constantFrom(180, 360), fc.boolean(), (legs, limit, risers) => {
      const p = path(legs);
      const u = { ...power, bendLimitDeg: limit, maxPullM: 0 };
      const r = place(p.pts, u, risers);
      expect(r.warnings).toEqual([]);
      const at = along(p.pts, r.boxes);
      expect(check(p, at, { bend: limit, pull: 0, riser: risers ? 90 : 0 }).bend).toBeLessThanOrEqual(1e-9);
      expect(r.boxes.length).toBe(minBoxes(p.turns, limit, risers ? 90 : 0));
    }), { numRuns: 300, seed: 7 });
  });

  it('bend, length and capstan tension together: every section within all limits', () => {
    fc.assert(fc.property(
      fc.array(legArb, { minLength: 1, maxLength: 8 }),
      fc.integer({ min: 30, max: 120 }), fc.integer({ min: 150, max: 900 }), fc.boolean(),
      (legs, pullM, maxT, risers) => {
        const p = path(legs);
        const cable = { weightLbPerFt: 1.5, friction: 0.5, maxTensionLb: maxT };
        const u = { ...power, bendLimitDeg: 360, maxPullM: pullM, cable };
        const r = place(p.pts, u, risers);
        const at = along(p.pts, r.boxes);
        const worst = check(p, at, { bend: 360, pull: pullM, cable: { w: 1.5, f: 0.5, max: maxT }, riser: risers ? 90 : 0 });
        if (r.warnings.length === 0) {
          expect(worst.bend).toBeLessThanOrEqual(1e-9);
          expect(worst.pull).toBeLessThanOrEqual(1e-6);
          expect(worst.tension).toBeLessThanOrEqual(1e-6);
        } else {
          // Only a sweep or bend that breaks the tension limit on its own may be left, and it is reported.
          expect(r.warnings.join(' ')).toMatch(/tension/);
        }
      }), { numRuns: 300, seed: 11 });
  });
});
