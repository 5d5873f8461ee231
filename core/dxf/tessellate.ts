// Curves to polylines with a bounded chord error (sagitta). For a circular arc of radius r split
// into steps of angle a, the sagitta is r(1 - cos(a/2)) (circle geometry, closed form), so
// a = 2 acos(1 - s/r) keeps every chord within s of the arc. Bulge = tan(theta/4) (DXF reference).
// SPLINE: de Boor's algorithm (C. de Boor, "On calculating with B-splines", J. Approx. Theory 1972),
// sampled by recursive midpoint subdivision until the chord error is within tolerance.

const MAX_STEPS_PER_CURVE = 4096;
const TWO_PI = Math.PI * 2;

/**
 * Sweep from angle a0 to a1 counter-clockwise, in (0, 2π] when a1 <= a0 (a larger positive
 * difference is kept); NaN when either angle is not finite. Closed form, so a huge angle from a
 * damaged file cannot stall the loop that added 2π until the sweep was positive.
 */
export function ccwSweep(a0: number, a1: number): number {
  const s = a1 - a0;
  if (!Number.isFinite(s)) return NaN;
  return s > 0 ? s : (s % TWO_PI) + TWO_PI;
}

/** Number of equal steps for an arc of radius r and sweep |sweep| so the sagitta is <= tol. */
export function arcSteps(radius: number, sweep: number, tol: number): number {
  const a = Math.abs(sweep);
  if (!(radius > 0) || !(a > 0)) return 1;
  const maxStep = tol >= radius ? Math.PI / 2 : 2 * Math.acos(1 - tol / radius);
  const n = Math.ceil(a / Math.min(maxStep, Math.PI / 2) - 1e-9);
  return Math.max(1, Math.min(MAX_STEPS_PER_CURVE, n));
}

/**
 * Points along a circular arc from angle a0 sweeping `sweep` radians (sign = direction),
 * appended to `out` as x,y pairs. The start point is included only when includeStart.
 */
export function pushArc(
  out: number[], cx: number, cy: number, r: number, a0: number, sweep: number, tol: number, includeStart: boolean,
): void {
  const n = arcSteps(r, sweep, tol);
  const step = sweep / n;
  for (let i = includeStart ? 0 : 1; i <= n; i++) {
    const t = a0 + step * i;
    out.push(cx + r * Math.cos(t), cy + r * Math.sin(t));
  }
}

/** Circle as a closed ring (counter-clockwise, first point not repeated). */
export function circleRing(cx: number, cy: number, r: number, tol: number): number[] {
  const n = Math.max(8, arcSteps(r, TWO_PI, tol));
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = (TWO_PI * i) / n;
    out.push(cx + r * Math.cos(t), cy + r * Math.sin(t));
  }
  return out;
}

/**
 * The bulged segment from (x0,y0) to (x1,y1): appends the intermediate points and the end point.
 * bulge = tan(included angle / 4), positive counter-clockwise (DXF reference, LWPOLYLINE group 42).
 */
export function pushBulge(out: number[], x0: number, y0: number, x1: number, y1: number, bulge: number, tol: number): void {
  const dx = x1 - x0;
  const dy = y1 - y0;
  const chord = Math.hypot(dx, dy);
  if (bulge === 0 || !Number.isFinite(bulge) || chord === 0) {
    out.push(x1, y1);
    return;
  }
  const theta = 4 * Math.atan(bulge); // signed included angle
  const r = chord / (2 * Math.abs(Math.sin(theta / 2)));
  // centre lies on the chord's perpendicular bisector at signed distance d = (chord/2) / tan(theta/2)
  const d = chord / 2 / Math.tan(theta / 2);
  const mx = (x0 + x1) / 2;
  const my = (y0 + y1) / 2;
  const cx = mx - (dy / chord) * d;
  const cy = my + (dx / chord) * d;
  const a0 = Math.atan2(y0 - cy, x0 - cx);
  const n = arcSteps(r, theta, tol);
  const step = theta / n;
  for (let i = 1; i < n; i++) {
    const t = a0 + step * i;
    out.push(cx + r * Math.cos(t), cy + r * Math.sin(t));
  }
  out.push(x1, y1);
}

/** Ellipse arc: centre, major-axis end point (relative), ratio minor/major, parameters t0..t1 (radians). */
export function ellipsePoints(
  cx: number, cy: number, mx: number, my: number, ratio: number, t0: number, t1: number, tol: number,
): { points: number[]; closed: boolean } {
  const a = Math.hypot(mx, my);
  const b = a * ratio;
  let sweep = ccwSweep(t0, t1);
  if (Number.isNaN(sweep)) return { points: [], closed: false };
  const closed = Math.abs(sweep - TWO_PI) < 1e-9 || sweep > TWO_PI;
  if (closed) sweep = TWO_PI;
  // in the parameter t the chord error is a*dt^2/8 at worst (at the major-axis ends the curvature
  // radius is b^2/a and the tangent turns a/b per unit t), the same as a circle of radius a
  const n = Math.max(closed ? 8 : 1, arcSteps(Math.max(a, 1e-12), sweep, tol));
  const ux = a > 0 ? mx / a : 1;
  const uy = a > 0 ? my / a : 0;
  const out: number[] = [];
  const last = closed ? n - 1 : n;
  for (let i = 0; i <= last; i++) {
    const t = t0 + (sweep * i) / n;
    const c = Math.cos(t) * a;
    const s = Math.sin(t) * b;
    out.push(cx + ux * c - uy * s, cy + uy * c + ux * s);
  }
  return { points: out, closed };
}

/** Evaluate a non-rational B-spline of degree p at parameter u (de Boor). ctrl: x,y pairs. */
export function deBoor(p: number, knots: ArrayLike<number>, ctrl: ArrayLike<number>, u: number, work: Float64Array): [number, number] {
  const nCtrl = ctrl.length / 2;
  // knot span k with knots[k] <= u < knots[k+1], clamped to the valid range [p, nCtrl-1]
  let k = p;
  while (k < nCtrl - 1 && knots[k + 1] <= u) k++;
  for (let j = 0; j <= p; j++) {
    work[2 * j] = ctrl[2 * (j + k - p)];
    work[2 * j + 1] = ctrl[2 * (j + k - p) + 1];
  }
  for (let r = 1; r <= p; r++) {
    for (let j = p; j >= r; j--) {
      const i = j + k - p;
      const den = knots[i + p - r + 1] - knots[i];
      const alpha = den === 0 ? 0 : (u - knots[i]) / den;
      work[2 * j] = (1 - alpha) * work[2 * j - 2] + alpha * work[2 * j];
      work[2 * j + 1] = (1 - alpha) * work[2 * j - 1] + alpha * work[2 * j + 1];
    }
  }
  return [work[2 * p], work[2 * p + 1]];
}

/** Sample a B-spline so every chord is within tol of the curve (checked at chord midpoints). */
export function splinePoints(p: number, knots: ArrayLike<number>, ctrl: ArrayLike<number>, tol: number): number[] {
  const nCtrl = ctrl.length / 2;
  const u0 = knots[p];
  const work = new Float64Array(2 * (p + 1));
  const out: number[] = [];
  const [sx, sy] = deBoor(p, knots, ctrl, u0, work);
  out.push(sx, sy);
  // seed with the distinct knot values so each polynomial piece is sampled at least once
  const seeds: number[] = [u0];
  for (let i = p + 1; i <= nCtrl; i++) if (knots[i] > seeds[seeds.length - 1]) seeds.push(knots[i]);
  let budget = MAX_STEPS_PER_CURVE * 4;
  const refine = (ua: number, ax: number, ay: number, ub: number, bx: number, by: number, depth: number): void => {
    const um = (ua + ub) / 2;
    const [mx, my] = deBoor(p, knots, ctrl, um, work);
    const qx = (ax + bx) / 2;
    const qy = (ay + by) / 2;
    // also probe the quarter points: a piece can be symmetric about its midpoint
    const uq = (ua + um) / 2;
    const [q1x, q1y] = deBoor(p, knots, ctrl, uq, work);
    const dq = Math.hypot(q1x - (ax * 3 + bx) / 4, q1y - (ay * 3 + by) / 4);
    if (depth < 24 && budget > 0 && (Math.hypot(mx - qx, my - qy) > tol || dq > tol)) {
      budget--;
      refine(ua, ax, ay, um, mx, my, depth + 1);
      refine(um, mx, my, ub, bx, by, depth + 1);
    } else {
      out.push(bx, by);
    }
  };
  let ax = sx;
  let ay = sy;
  for (let i = 1; i < seeds.length; i++) {
    const ub = seeds[i];
    const [bx, by] = deBoor(p, knots, ctrl, ub, work);
    refine(seeds[i - 1], ax, ay, ub, bx, by, 0);
    ax = bx;
    ay = by;
  }
  return out;
}

/**
 * Global curve interpolation through fit points: a B-spline of degree p through every point, with
 * chord-length parameters and knots by averaging (Piegl & Tiller, "The NURBS Book", 2nd ed., 1997,
 * §9.2.1, eqs. 9.5 and 9.8, Algorithm A9.1). Returns knots and control points (x,y pairs), or null
 * when the points are too many for the dense solve or degenerate.
 */
export function interpolateFitPoints(fit: ArrayLike<number>, degree = 3): { p: number; knots: Float64Array; ctrl: Float64Array } | null {
  const m = fit.length / 2; // number of points, n + 1
  if (m < 2 || m > 400 || !Number.isInteger(degree) || degree < 1) return null;
  const p = Math.min(degree, m - 1);
  const n = m - 1;
  const u = new Float64Array(m);
  let total = 0;
  for (let k = 1; k < m; k++) total += Math.hypot(fit[2 * k] - fit[2 * k - 2], fit[2 * k + 1] - fit[2 * k - 1]);
  if (!(total > 0)) return null;
  for (let k = 1; k < m; k++) u[k] = u[k - 1] + Math.hypot(fit[2 * k] - fit[2 * k - 2], fit[2 * k + 1] - fit[2 * k - 1]) / total;
  u[n] = 1;
  const knots = new Float64Array(m + p + 1);
  for (let j = 0; j <= p; j++) knots[m + j] = 1;
  for (let j = 1; j <= n - p; j++) {
    let s = 0;
    for (let i = j; i <= j + p - 1; i++) s += u[i];
    knots[j + p] = s / p;
  }
  // A[k][i] = N_{i,p}(u_k)
  const A = Array.from({ length: m }, () => new Float64Array(m));
  const N = new Float64Array(p + 1);
  for (let k = 0; k < m; k++) {
    const span = findSpan(n, p, u[k], knots);
    basisFuns(span, u[k], p, knots, N);
    for (let j = 0; j <= p; j++) A[k][span - p + j] = N[j];
  }
  const bx = new Float64Array(m), by = new Float64Array(m);
  for (let k = 0; k < m; k++) { bx[k] = fit[2 * k]; by[k] = fit[2 * k + 1]; }
  if (!solveInPlace(A, bx, by)) return null;
  const ctrl = new Float64Array(2 * m);
  for (let i = 0; i < m; i++) { ctrl[2 * i] = bx[i]; ctrl[2 * i + 1] = by[i]; }
  return { p, knots, ctrl };
}

/** Knot span index for u (The NURBS Book, Algorithm A2.1). */
function findSpan(n: number, p: number, u: number, U: ArrayLike<number>): number {
  if (u >= U[n + 1]) return n;
  let lo = p, hi = n + 1;
  let mid = (lo + hi) >> 1;
  while (u < U[mid] || u >= U[mid + 1]) {
    if (u < U[mid]) hi = mid; else lo = mid;
    mid = (lo + hi) >> 1;
  }
  return mid;
}

/** The p+1 non-zero basis functions at u (The NURBS Book, Algorithm A2.2). */
function basisFuns(i: number, u: number, p: number, U: ArrayLike<number>, N: Float64Array): void {
  const left = new Float64Array(p + 1), right = new Float64Array(p + 1);
  N[0] = 1;
  for (let j = 1; j <= p; j++) {
    left[j] = u - U[i + 1 - j];
    right[j] = U[i + j] - u;
    let saved = 0;
    for (let r = 0; r < j; r++) {
      const temp = N[r] / (right[r + 1] + left[j - r]);
      N[r] = saved + right[r + 1] * temp;
      saved = left[j - r] * temp;
    }
    N[j] = saved;
  }
}

/** Gaussian elimination with partial pivoting on A x = b for two right-hand sides, in place. */
function solveInPlace(A: Float64Array[], b1: Float64Array, b2: Float64Array): boolean {
  const m = A.length;
  for (let c = 0; c < m; c++) {
    let piv = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r][c]) > Math.abs(A[piv][c])) piv = r;
    if (Math.abs(A[piv][c]) < 1e-14) return false;
    if (piv !== c) {
      [A[piv], A[c]] = [A[c], A[piv]];
      [b1[piv], b1[c]] = [b1[c], b1[piv]];
      [b2[piv], b2[c]] = [b2[c], b2[piv]];
    }
    for (let r = c + 1; r < m; r++) {
      const f = A[r][c] / A[c][c];
      if (f === 0) continue;
      for (let k = c; k < m; k++) A[r][k] -= f * A[c][k];
      b1[r] -= f * b1[c];
      b2[r] -= f * b2[c];
    }
  }
  for (let r = m - 1; r >= 0; r--) {
    let s1 = b1[r], s2 = b2[r];
    for (let k = r + 1; k < m; k++) { s1 -= A[r][k] * b1[k]; s2 -= A[r][k] * b2[k]; }
    b1[r] = s1 / A[r][r];
    b2[r] = s2 / A[r][r];
  }
  return true;
}
