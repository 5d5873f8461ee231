// Inputs the fuzz tests found, kept as fixtures (tests/fixtures/fuzz/): each must end within a
// bound in a worker (so a regression to a hang fails here instead of stalling the run), then
// give the expected drawing and warnings.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readDxf } from '../../core/dxf/readDxf';
import { buildSite } from '../../core/site/buildSite';
import { runInWorker } from './inWorker';

const dir = fileURLToPath(new URL('../fixtures/fuzz/', import.meta.url));
const text = (name: string): string => readFileSync(dir + name, 'latin1');

// found by tests/fuzz/importStages.fuzz.test.ts; each file is the seed's building plus one entity
const CASES: { file: string; warning: RegExp }[] = [
  // ARC 50 = 1e308: the sweep loop added 2π to a sweep of −1e308 forever; at that start angle
  // every step rounds away, so all points coincide and the arc is dropped as degenerate
  { file: 'arc-start-angle-1e308-hang.dxf', warning: /skipped 1 ARC \(degenerate\)/ },
  // ARC 51 = -Infinity: the same loop on an infinite sweep
  { file: 'arc-end-angle-minus-infinity-hang.dxf', warning: /skipped 1 ARC \(angles not finite numbers\)/ },
  // ELLIPSE start parameter 1e308 > end: the same loop in ellipsePoints
  { file: 'ellipse-start-param-1e308-hang.dxf', warning: /skipped 1 ELLIPSE/ },
  // CIRCLE radius 1e308: finite points, but the site boundary (extents ± margin, local frame) overflowed to Infinity
  { file: 'circle-radius-1e308-boundary-overflow.dxf', warning: /skipped 1 CIRCLE \(coordinates beyond ±1e\+12 drawing units\)/ },
  // INSERT with x scale NaN: the block's LINE came out with NaN coordinates (the finite check ran before the transform)
  { file: 'insert-scale-nan.dxf', warning: /skipped 1 LINE \(block reference places it beyond ±1e\+12 drawing units or at no number\)/ },
  // INSERT at x 1e300 with scale 1e300: the block's LINE landed at ±Infinity
  { file: 'insert-scale-1e300.dxf', warning: /skipped 1 LINE \(block reference places it beyond ±1e\+12 drawing units or at no number\)/ },
  // SPLINE degree -2147483649 with fit points: a typed array of negative length threw a RangeError
  { file: 'spline-negative-degree.dxf', warning: /skipped 1 SPLINE \(degree (outside 1 to 11|not a whole number)/ },
];

describe('fuzz regressions', () => {
  for (const c of CASES) {
    it(`${c.file.replace(/\.dxf$/, '')}: ends within 10 s with the building kept and the bad entity skipped with a warning`, async () => {
      const o = await runInWorker({ kind: 'file', path: dir + c.file }, 10_000);
      expect(o.type, JSON.stringify(o)).toBe('done');
      const r = readDxf(text(c.file));
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(r.value.entities.map((e) => e.layer)).toEqual(['BLDG']);
      expect(r.value.warnings.join('\n')).toMatch(c.warning);
      const s = buildSite(r.value);
      expect(s.ok).toBe(true);
      if (s.ok) {
        expect(s.value.buildings).toHaveLength(1);
        for (const v of s.value.boundary) expect(Number.isFinite(v)).toBe(true);
      }
    });
  }
});
