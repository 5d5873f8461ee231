// Trench networks built by hand for the take-off tests (no router involved).
import type { Terminal } from '../../../core/site/site';
import type { SegmentCrossing, TrenchNetwork, TrenchNodeKind } from '../../../core/network/trenchNetwork';
import type { LengthUnit } from '../../../core/units';

export interface HandSegment {
  from: number;
  to: number;
  /** x,y pairs from `from` to `to`. */
  pts: number[];
  pave?: number;
  crossings?: SegmentCrossing[];
  stub?: boolean;
}

export function polyLen(pts: number[]): number {
  let l = 0;
  for (let i = 2; i < pts.length; i += 2) l += Math.hypot(pts[i] - pts[i - 2], pts[i + 1] - pts[i - 1]);
  return l;
}

export function handNetwork(
  nodes: { id: number; kind: TrenchNodeKind; x: number; y: number; terminalId?: string }[],
  segs: HandSegment[],
  units: LengthUnit = 'm',
): TrenchNetwork {
  return {
    units,
    frame: { originX: 0, originY: 0, scale: 1 },
    nodes,
    segments: segs.map((s, i) => ({
      id: i, from: s.from, to: s.to, points: Float64Array.from(s.pts), length: polyLen(s.pts),
      lengthUnderPavement: s.pave ?? 0, crossings: s.crossings ?? [], bendsDeg: [], stub: s.stub ?? false,
    })),
    quality: { cost: 0, lowerBound: 0, gap: 0 },
    unreachable: [],
    warnings: [],
  };
}

export function terminal(id: string, role: 'service' | 'connection', utilities: string[], x: number, y: number): Terminal {
  return { id, role, utilities, given: { x, y }, x, y, nx: 0, ny: 0, building: -1, snapDistance: 0 };
}

/** A single run from a connection at the first point to a service at the last, through the given vertices. */
export function singleRun(pts: number[], utilities: string[], units: LengthUnit = 'm'): { net: TrenchNetwork; terminals: Terminal[] } {
  const n = pts.length;
  const net = handNetwork(
    [
      { id: 0, kind: 'connection', x: pts[0], y: pts[1], terminalId: 'P' },
      { id: 1, kind: 'service', x: pts[n - 2], y: pts[n - 1], terminalId: 'S' },
    ],
    [{ from: 0, to: 1, pts }],
    units,
  );
  return { net, terminals: [terminal('P', 'connection', utilities, pts[0], pts[1]), terminal('S', 'service', utilities, pts[n - 2], pts[n - 1])] };
}
