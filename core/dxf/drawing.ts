// The `Drawing`: what the DXF reader returns. Coordinates are in drawing units (the file's own
// frame, full float64 precision); the site stage moves them to a local origin.

export interface DrawingHeader {
  /** $ACADVER, e.g. 'AC1009' (R12) or 'AC1015' (R2000). */
  version: string;
  /** $INSUNITS code (0 unitless, 1 in, 2 ft, 4 mm, 5 cm, 6 m, ...). */
  insUnits: number;
  /** Extents of the model-space geometry actually read (not the header's stale $EXTMIN/$EXTMAX). */
  extents: Extents;
}

export interface Extents { minX: number; minY: number; maxX: number; maxY: number }

export interface DrawingLayer {
  name: string;
  /** ACI colour index (absolute value). */
  color: number;
  on: boolean;
  frozen: boolean;
}

/** Which DXF entity produced a piece of geometry (kept for messages and role suggestions). */
export type SourceKind =
  | 'LINE' | 'LWPOLYLINE' | 'POLYLINE' | 'CIRCLE' | 'ARC' | 'ELLIPSE' | 'SPLINE';

/** Every curve is tessellated to a polyline: flat x,y pairs in drawing units. */
export interface PolylineEntity {
  kind: 'polyline';
  layer: string;
  source: SourceKind;
  /** x0, y0, x1, y1, ... ; a closed polyline does not repeat its first point. */
  points: Float64Array;
  closed: boolean;
  /** Handle of the top-level model-space entity this came from (INSERTs: the INSERT's). */
  handle?: string;
}

export interface TextEntity {
  kind: 'text';
  layer: string;
  x: number;
  y: number;
  height: number;
  rotationDeg: number;
  /** Plain text (MTEXT formatting codes stripped); always shown as text, never as markup. */
  text: string;
  handle?: string;
}

export type DrawingEntity = PolylineEntity | TextEntity;

export interface Drawing {
  header: DrawingHeader;
  layers: DrawingLayer[];
  entities: DrawingEntity[];
  /** Non-fatal findings while reading (unsupported entities skipped, etc.). */
  warnings: string[];
}

export type DxfReadErrorKind =
  | 'binary' | 'empty' | 'garbage' | 'truncated' | 'too-large' | 'limit' | 'no-model-space';

export interface DxfReadError {
  kind: DxfReadErrorKind;
  message: string;
}
