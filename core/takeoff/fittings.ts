// Elbows from route bends: a bend is rounded to the nearest 22.5° and made of standard
// 90°, 45° and 22.5° fittings, largest first (common practice; bends under 11.25° are taken up
// by the conduit itself and need no fitting).

export interface ElbowCount { e90: number; e45: number; e22: number }

export const zeroElbows = (): ElbowCount => ({ e90: 0, e45: 0, e22: 0 });

export function elbowsForBend(deg: number): ElbowCount {
  const n = Math.round(Math.abs(deg) / 22.5);
  return { e90: Math.floor(n / 4), e45: Math.floor((n % 4) / 2), e22: n % 2 };
}

export function addElbows(into: ElbowCount, add: ElbowCount, times = 1): void {
  into.e90 += add.e90 * times;
  into.e45 += add.e45 * times;
  into.e22 += add.e22 * times;
}
