// Damaged files never crash or hang the reader: random line edits of real fixtures always give a
// Result (ok or an error value) quickly. Property-based, seeded (fast-check).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readDxf } from '../../../core/dxf/readDxf';
import { buildSite } from '../../../core/site/buildSite';
import { fixtureBytes } from './fixtures';

const sources = ['blocks_m.dxf', 'polyline_r12.dxf', 'curves_m.dxf'].map((n) => new TextDecoder().decode(fixtureBytes(n)).split('\n'));

const edit = fc.oneof(
  fc.record({ op: fc.constant('delete' as const), at: fc.nat(), count: fc.integer({ min: 1, max: 7 }) }),
  fc.record({ op: fc.constant('replace' as const), at: fc.nat(), text: fc.constantFrom('0', 'SEQEND', 'VERTEX', 'POLYLINE', 'INSERT', 'ENDBLK', 'ENDSEC', '-1', '1e309', 'nan', '', 'BLOCK', '999', '10', 'xyz') }),
  fc.record({ op: fc.constant('truncate' as const), at: fc.nat() }),
);

describe('readDxf on damaged files', () => {
  it('returns a value for every damaged variant, within a second each', () => {
    fc.assert(fc.property(fc.nat({ max: sources.length - 1 }), fc.array(edit, { minLength: 1, maxLength: 6 }), (which, edits) => {
      const lines = [...sources[which]];
      for (const e of edits) {
        const at = e.at % Math.max(1, lines.length);
        if (e.op === 'delete') lines.splice(at, e.count);
        else if (e.op === 'replace') lines[at] = e.text;
        else lines.length = at;
      }
      const t0 = performance.now();
      const r = readDxf(lines.join('\n'));
      if (r.ok) buildSite(r.value, { units: 'm' });
      expect(performance.now() - t0).toBeLessThan(1000);
      expect(typeof r.ok).toBe('boolean');
      if (!r.ok) expect(r.error.message.length).toBeGreaterThan(10);
    }), { numRuns: 400, seed: 20261202 });
  });
});
