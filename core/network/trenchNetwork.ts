// The `TrenchNetwork`: the shaped route, ready for contents, pull points and the take-off.
// Coordinates are local routing units (see site/site.ts Frame).

import type { Frame } from '../site/site';
import type { LengthUnit } from '../units';

export type TrenchNodeKind = 'connection' | 'service' | 'junction' | 'bend' | 'end';

export interface TrenchNode {
  id: number;
  kind: TrenchNodeKind;
  x: number;
  y: number;
  /** Terminal id for connection/service nodes. */
  terminalId?: string;
}

export interface SegmentCrossing {
  x: number;
  y: number;
  layer: string;
  kind: 'line' | 'pavement-edge';
}

export interface TrenchSegment {
  id: number;
  /** Node ids at the two ends (from is nearer the first point of connection). */
  from: number;
  to: number;
  /** Polyline x,y pairs from `from` to `to`. */
  points: Float64Array;
  length: number;
  lengthUnderPavement: number;
  crossings: SegmentCrossing[];
  /** Turning angle in degrees at each interior vertex of `points` (0 = straight). */
  bendsDeg: number[];
  /** True for the short perpendicular stub from a wall to the grid. */
  stub: boolean;
}

export interface RouteQuality {
  /** Cost of the route on the routing graph (length-equivalent units). */
  cost: number;
  /** Lower bound on the optimum for the same graph. */
  lowerBound: number;
  /** (cost - lowerBound) / cost, 0..1. */
  gap: number;
}

export interface TrenchNetwork {
  units: LengthUnit;
  frame: Frame;
  nodes: TrenchNode[];
  segments: TrenchSegment[];
  quality: RouteQuality;
  /** Terminal ids that could not be reached, each with the reason. */
  unreachable: { id: string; reason: string }[];
  warnings: string[];
  /** Optional: milliseconds per routing stage (grid, attach, solve, bound, shape, total). */
  timingsMs?: Record<string, number>;
}
