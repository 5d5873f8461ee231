import { describe, expect, it } from 'vitest';
import { computeContents } from '../../../core/network/contents';
import { placePullBoxes, placePullBoxesWithWarnings } from '../../../core/network/pullBoxes';
import { DEFAULT_UTILITIES } from '../../../core/settings';
import type { UtilitySetting } from '../../../core/settings';
import { handNetwork, singleRun, terminal } from '../takeoff/handNetwork';

const power = (over: Partial<UtilitySetting> = {}): UtilitySetting => ({ ...(DEFAULT_UTILITIES.find((u) => u.key === 'power') as UtilitySetting), ...over });

/** Staircase of n quarter bends, 10 m legs, alternating left and right turns. */
function staircase(n: number): number[] {
  const pts = [0, 0];
  let x = 0, y = 0;
  for (let i = 0; i <= n; i++) {
    if (i % 2 === 0) x += 10;
    else y += 10;
    pts.push(x, y);
  }
  return pts;
}

function boxesFor(pts: number[], u: UtilitySetting, countRisers: boolean) {
  const { net, terminals } = singleRun(pts, [u.key]);
  const contents = computeContents(net, terminals, [u]);
  return placePullBoxesWithWarnings(net, contents, [u], { countRisers });
}

describe('pull boxes: bend limit', () => {
  // NEC 2023 352.26: no more than the equivalent of four quarter bends (360°) between pull points.
  it('four quarter bends in one run need no pull box (NEC 352.26, 360°)', () => {
    const r = boxesFor(staircase(4), power(), false);
    expect(r.boxes).toHaveLength(0);
    expect(r.warnings).toEqual([]);
  });

  it('five quarter bends get one pull box, at the fifth bend (NEC 352.26, 360°)', () => {
    const pts = staircase(5);
    const r = boxesFor(pts, power(), false);
    expect(r.boxes).toHaveLength(1);
    const b = r.boxes[0];
    // The fifth bend is the sixth vertex (index 5) of the polyline.
    expect([b.x, b.y]).toEqual([pts[10], pts[11]]);
    expect(b.utilities).toEqual(['power']);
    expect(b.reasons[0].kind).toBe('bend');
  });

  it('counts the riser sweep at each end: two plan bends fit 360°, three do not (NEC 352.26)', () => {
    expect(boxesFor(staircase(2), power(), true).boxes).toHaveLength(0);
    expect(boxesFor(staircase(3), power(), true).boxes).toHaveLength(1);
  });

  it('telecom allows 180° between pull points (ANSI/TIA-758-A as quoted by BICSI)', () => {
    const tel = DEFAULT_UTILITIES.find((u) => u.key === 'telecom') as UtilitySetting;
    expect(tel.bendLimitDeg).toBe(180);
    expect(boxesFor(staircase(2), tel, false).boxes).toHaveLength(0);
    expect(boxesFor(staircase(3), tel, false).boxes).toHaveLength(1);
  });
});

describe('pull boxes: pull length', () => {
  it('splits a 400 m straight run at 152.4 m and 304.8 m for the 500 ft power limit (practice; 1 ft = 0.3048 m, NIST)', () => {
    const r = boxesFor([0, 0, 400, 0], power(), false);
    expect(r.boxes.map((b) => b.x)).toEqual([expect.closeTo(152.4, 9), expect.closeTo(304.8, 9)]);
    expect(r.boxes.every((b) => b.nodeId === -1 && b.reasons[0].kind === 'length')).toBe(true);
  });

  it('works in feet: a 1000 ft run with a 600 ft telecom limit gets one box at 600 ft (ANSI/TIA-758-A as quoted)', () => {
    const tel = { ...(DEFAULT_UTILITIES.find((u) => u.key === 'telecom') as UtilitySetting) };
    const { net, terminals } = singleRun([0, 0, 1000, 0], ['telecom'], 'ft');
    const boxes = placePullBoxes(net, computeContents(net, terminals, [tel]), [tel], { countRisers: false });
    expect(boxes).toHaveLength(1);
    expect(boxes[0].x).toBeCloseTo(600, 6);
  });
});

describe('pull boxes: pulling tension (capstan equation)', () => {
  // 100 ft straight, a 90° bend, 100 ft straight; f = 0.5, W = 2 lb/ft.
  // Straight: T = f·W·L = 100 lb; bend: × e^(0.5·π/2) = 2.193 (capstan, closed form); straight: + 100 lb.
  const pts = [0, 0, 100, 0, 100, 100];
  const expected = 100 * Math.exp(0.5 * Math.PI / 2) + 100;

  it('the closed form gives e^(0.5·π/2) = 2.193 (DOMAIN.md capstan check)', () => {
    expect(Math.exp(0.5 * Math.PI / 2)).toBeCloseTo(2.193, 3);
    expect(expected).toBeCloseTo(319.33, 2);
  });

  for (const [maxT, boxes] of [[expected - 0.5, 1], [expected + 0.5, 0]] as [number, number][]) {
    it(`with a ${maxT.toFixed(1)} lb limit places ${boxes} box(es)`, () => {
      const u = power({ bendLimitDeg: 0, maxPullM: 0, cable: { weightLbPerFt: 2, friction: 0.5, maxTensionLb: maxT } });
      const { net, terminals } = singleRun(pts, ['power'], 'ft');
      const r = placePullBoxesWithWarnings(net, computeContents(net, terminals, [u]), [u], { countRisers: false });
      expect(r.boxes).toHaveLength(boxes);
      if (boxes) {
        expect([r.boxes[0].x, r.boxes[0].y]).toEqual([100, 0]);
        expect(r.boxes[0].reasons[0].kind).toBe('tension');
      }
    });
  }
});

describe('pull boxes: shared by the runs of one utility', () => {
  it('places one box on the shared junction for two telecom runs that each need one there', () => {
    // Connection at (0,0), junction J at (40,0), services north (40,30) and south (40,-30).
    const net = handNetwork(
      [
        { id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'P' },
        { id: 1, kind: 'junction', x: 40, y: 0 },
        { id: 2, kind: 'service', x: 40, y: 30, terminalId: 'A' },
        { id: 3, kind: 'service', x: 40, y: -30, terminalId: 'B' },
      ],
      [
        { from: 0, to: 1, pts: [0, 0, 40, 0] },
        { from: 1, to: 2, pts: [40, 0, 40, 30] },
        { from: 1, to: 3, pts: [40, 0, 40, -30] },
      ],
    );
    const terms = [terminal('P', 'connection', ['telecom', 'water'], 0, 0), terminal('A', 'service', ['telecom', 'water'], 40, 30), terminal('B', 'service', ['telecom'], 40, -30)];
    const utils = DEFAULT_UTILITIES.filter((u) => u.key === 'telecom' || u.key === 'water');
    // riser 90 + turn 90 + riser 90 = 270° > 180° on each run: one box at J serves both.
    const boxes = placePullBoxes(net, computeContents(net, terms, utils), utils);
    expect(boxes).toHaveLength(1);
    expect(boxes[0].nodeId).toBe(1);
    expect(boxes[0].utilities).toEqual(['telecom']); // water is a main: not pulled, no boxes
  });
});
