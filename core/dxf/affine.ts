// 2D affine transforms for block references: [a, b, c, d, e, f] maps (x, y) to
// (a x + c y + e, b x + d y + f). INSERT: WCS = position + R(rotation) S(sx, sy) (p - base)
// (DXF reference, INSERT and BLOCK group codes).

export type Affine = readonly [number, number, number, number, number, number];

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0];

/** m1 after m2: (m1 ∘ m2)(p) = m1(m2(p)). */
export function compose(m1: Affine, m2: Affine): Affine {
  const [a1, b1, c1, d1, e1, f1] = m1;
  const [a2, b2, c2, d2, e2, f2] = m2;
  return [
    a1 * a2 + c1 * b2,
    b1 * a2 + d1 * b2,
    a1 * c2 + c1 * d2,
    b1 * c2 + d1 * d2,
    a1 * e2 + c1 * f2 + e1,
    b1 * e2 + d1 * f2 + f1,
  ];
}

/** The transform of one INSERT (one array cell at column/row offsets colX,rowY in block units). */
export function insertTransform(
  px: number, py: number, sx: number, sy: number, rotationDeg: number, baseX: number, baseY: number,
  colX = 0, rowY = 0, mirrorOcs = false,
): Affine {
  const t = (rotationDeg * Math.PI) / 180;
  const cos = Math.cos(t);
  const sin = Math.sin(t);
  // p -> p - base -> scale -> + array offset (in the rotated, unscaled frame) -> rotate -> + position
  const scaleMove: Affine = [sx, 0, 0, sy, -sx * baseX + colX, -sy * baseY + rowY];
  const rot: Affine = [cos, sin, -sin, cos, px, py];
  const m = compose(rot, scaleMove);
  // OCS with extrusion (0,0,-1): the arbitrary-axis algorithm gives X_ocs = -X_wcs (DXF reference)
  return mirrorOcs ? compose([-1, 0, 0, 1, 0, 0], m) : m;
}

/** Largest stretch factor of the linear part (the larger singular value). */
export function maxStretch(m: Affine): number {
  const [a, b, c, d] = m;
  const s = a * a + b * b + c * c + d * d;
  const det = a * d - b * c;
  const disc = Math.sqrt(Math.max(0, s * s - 4 * det * det));
  return Math.sqrt((s + disc) / 2);
}

export function isIdentity(m: Affine): boolean {
  return m[0] === 1 && m[1] === 0 && m[2] === 0 && m[3] === 1 && m[4] === 0 && m[5] === 0;
}

/** Apply m to flat x,y pairs in place. */
export function applyInPlace(m: Affine, pts: number[] | Float64Array): void {
  const [a, b, c, d, e, f] = m;
  for (let i = 0; i < pts.length; i += 2) {
    const x = pts[i];
    const y = pts[i + 1];
    pts[i] = a * x + c * y + e;
    pts[i + 1] = b * x + d * y + f;
  }
}
