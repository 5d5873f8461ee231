// The `Site`: the understood drawing, in routing units (m or ft) relative to a local origin.
// drawing = origin + local / unitsPerDrawingUnit... see Frame.

import type { LengthUnit } from '../units';

export type LayerRole = 'building' | 'keep-out' | 'pavement' | 'crossing' | 'boundary' | 'ignore';
export const LAYER_ROLES: readonly LayerRole[] = ['building', 'keep-out', 'pavement', 'crossing', 'boundary', 'ignore'];

/** local = (drawing - origin) * scale ;  drawing = local / scale + origin. */
export interface Frame {
  originX: number;
  originY: number;
  /** routing units per drawing unit (1 when the drawing is already in m or ft). */
  scale: number;
}

/** A ring is flat x,y pairs, not closed (the last point does not repeat the first). */
export type Ring = Float64Array;

export interface Polygon {
  outer: Ring;
  holes: Ring[];
  /** Layer(s) it came from, for messages. */
  layer: string;
}

export interface CrossingLine {
  points: Float64Array;
  closed: boolean;
  layer: string;
  /** 'edge' for the boundary of a pavement area, 'line' for a crossing-role feature. */
  kind: 'line' | 'pavement-edge';
}

export interface RoleSuggestion {
  layer: string;
  role: LayerRole;
  reason: string;
}

export interface Site {
  units: LengthUnit;
  frame: Frame;
  buildings: Polygon[];
  keepOuts: Polygon[];
  pavements: Polygon[];
  crossings: CrossingLine[];
  /** The area routing may use (default: extents plus a margin). */
  boundary: Ring;
  /** The roles used, given or suggested. */
  roles: Record<string, LayerRole>;
  warnings: string[];
}

export type TerminalRole = 'service' | 'connection';

/** A service or connection point as the user gave it (drawing units, original frame). */
export interface PointInput {
  id: string;
  x: number;
  y: number;
  role: TerminalRole;
  utilities: string[];
}

/** A point placed on the site (local routing units). */
export interface Terminal {
  id: string;
  role: TerminalRole;
  utilities: string[];
  /** Where the user put it. */
  given: { x: number; y: number };
  /** Snapped onto the wall (services) or as given (connections). */
  x: number;
  y: number;
  /** Outward unit normal of the wall when snapped to a building, else 0,0. */
  nx: number;
  ny: number;
  /** Index into Site.buildings when on a wall, else -1. */
  building: number;
  /** Distance moved by snapping. */
  snapDistance: number;
}
