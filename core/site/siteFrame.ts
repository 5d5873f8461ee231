// Routing units and the local frame of a site: which unit (m or ft) routing uses, how many
// routing units one drawing unit is, and a rounded local origin so large (state-plane)
// coordinates keep their precision.

import type { LengthUnit } from '../units';
import { metresPerInsUnit, metresPerUnit } from '../units';
import type { Extents } from '../dxf/drawing';
import type { Frame } from './site';
import { err, ok, type Result } from '../result';

const IMPERIAL_CODES = new Set([1, 2, 3, 10, 21]);

export type FrameError = { kind: 'units-needed'; message: string };

/** The routing unit and Frame for a drawing with $INSUNITS `insUnits` and the given extents. */
export function resolveFrame(insUnits: number, extents: Extents, units?: LengthUnit): Result<{ units: LengthUnit; frame: Frame }, FrameError> {
  const mpu = metresPerInsUnit(insUnits);
  let u: LengthUnit;
  let scale: number;
  if (mpu === null) {
    if (!units) {
      return err({
        kind: 'units-needed',
        message: `the drawing does not say its units ($INSUNITS = ${insUnits}); give them with --units m or --units ft (the unit one drawing unit stands for)`,
      });
    }
    u = units;
    scale = 1;
  } else {
    u = units ?? (IMPERIAL_CODES.has(insUnits) ? 'ft' : 'm');
    scale = mpu / metresPerUnit(u);
    // keep an exact 1 when the drawing is already in the routing unit
    if (Math.abs(scale - 1) < 1e-15) scale = 1;
  }
  return ok({ units: u, frame: { originX: roundDown(extents.minX), originY: roundDown(extents.minY), scale } });
}

/** Lower-left rounded down to a multiple of 10 drawing units (0 when the drawing is near the origin). */
function roundDown(v: number): number {
  if (!Number.isFinite(v)) return 0;
  return Math.floor(v / 10) * 10;
}

/** Drawing coordinates → local routing coordinates, in place on flat x,y pairs. */
export function toLocal(frame: Frame, src: ArrayLike<number>): Float64Array {
  const out = new Float64Array(src.length);
  const { originX, originY, scale } = frame;
  for (let i = 0; i < src.length; i += 2) {
    out[i] = (src[i] - originX) * scale;
    out[i + 1] = (src[i + 1] - originY) * scale;
  }
  return out;
}

/** A local point back in drawing coordinates. */
export function toDrawing(frame: Frame, x: number, y: number): { x: number; y: number } {
  return { x: x / frame.scale + frame.originX, y: y / frame.scale + frame.originY };
}
