// DXF fixtures written by an independent writer (ezdxf, tests/fixtures/dxf/make_fixtures.py) and
// the values ezdxf computes for them (expected.json). Regenerate with FURROW_REGEN_FIXTURES=1.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { readDxfBytes, type ReadDxfOptions } from '../../../core/dxf/readDxf';
import type { Drawing } from '../../../core/dxf/drawing';

export const FIXTURES = fileURLToPath(new URL('../../fixtures/dxf/files/', import.meta.url));

if (process.env.FURROW_REGEN_FIXTURES === '1') {
  execFileSync('/usr/bin/python3', [fileURLToPath(new URL('../../fixtures/dxf/make_fixtures.py', import.meta.url)), FIXTURES]);
}

export const fixturePath = (name: string): string => join(FIXTURES, name);
export const fixtureBytes = (name: string): Uint8Array => readFileSync(fixturePath(name));
export const expected = (): Record<string, any> => JSON.parse(readFileSync(fixturePath('expected.json'), 'utf8'));

export function readFixture(name: string, opts?: ReadDxfOptions): Drawing {
  const r = readDxfBytes(fixtureBytes(name), opts);
  if (!r.ok) throw new Error(`${name}: ${r.error.kind}: ${r.error.message}`);
  return r.value;
}

/** Distance from (x, y) to the nearest point of an open polyline given as [[x, y], ...]. */
export function distanceToPolyline(x: number, y: number, line: number[][]): number {
  let best = Infinity;
  for (let i = 0; i + 1 < line.length; i++) {
    const [ax, ay] = line[i];
    const [bx, by] = line[i + 1];
    const dx = bx - ax, dy = by - ay;
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / len2));
    best = Math.min(best, Math.hypot(ax + t * dx - x, ay + t * dy - y));
  }
  return best;
}

export const pairs = (p: ArrayLike<number>): number[][] => {
  const out: number[][] = [];
  for (let i = 0; i < p.length; i += 2) out.push([p[i], p[i + 1]]);
  return out;
};
