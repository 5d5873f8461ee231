// Property test: random trench networks (fast-check) merged into R12 and R2018 originals and
// written layer-only; every file passes the ezdxf audit and the raw handle/owner check, and the
// centreline comes back at its length (ezdxf 0.18, one batch call).
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { writeLayerOnlyDxf, writeMergedDxf, type TrenchDrawingInput } from '../../../core/dxf/writeDxf';
import type { TrenchSegment } from '../../../core/network/trenchNetwork';
import { defaultSettings } from '../../../core/settings';

const PY = '/usr/bin/python3';
const TOOL = join(__dirname, 'dxf_check.py');
const DIR = join(__dirname, '..', '..', '.tmp', `dxf-prop-${process.pid}`);

const point = fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true }));
const segment = fc.array(point, { minLength: 2, maxLength: 6 });
const network = fc.record({
  segments: fc.array(fc.record({ pts: segment, width: fc.double({ min: 0.2, max: 2, noNaN: true }), stub: fc.boolean() }), { minLength: 1, maxLength: 8 }),
  utilities: fc.subarray(['power', 'telecom', 'water', 'gas', 'steam'], { minLength: 1 }),
  id: fc.string({ minLength: 1, maxLength: 12 }),
  units: fc.constantFrom<'m' | 'ft'>('m', 'ft'),
});

type NetCase = typeof network extends fc.Arbitrary<infer T> ? T : never;

function toInput(n: NetCase): TrenchDrawingInput {
  const segments: TrenchSegment[] = n.segments.map((s, i) => {
    const points = Float64Array.from(s.pts.flat());
    let length = 0;
    for (let k = 2; k < points.length; k += 2) length += Math.hypot(points[k] - points[k - 2], points[k + 1] - points[k - 1]);
    return { id: i, from: 2 * i, to: 2 * i + 1, points, length, lengthUnderPavement: 0, crossings: [], bendsDeg: [], stub: s.stub };
  });
  const first = n.segments[0].pts[0];
  return {
    net: {
      units: n.units, frame: { originX: 631200, originY: 5402100, scale: 1 },
      nodes: segments.flatMap((s) => [
        { id: s.from, kind: 'end' as const, x: s.points[0], y: s.points[1] },
        { id: s.to, kind: 'end' as const, x: s.points[s.points.length - 2], y: s.points[s.points.length - 1] },
      ]),
      segments, quality: { cost: 1, lowerBound: 1, gap: 0 }, unreachable: [], warnings: [],
    },
    terminals: [{ id: n.id, role: 'service', utilities: n.utilities, given: { x: first[0], y: first[1] }, x: first[0], y: first[1], nx: 0, ny: 0, building: -1, snapDistance: 0 }],
    utilities: defaultSettings().utilities,
    segments: n.segments.map((s, i) => ({ segmentId: i, width: s.width, carries: Object.fromEntries(n.utilities.map((u, k) => [u, k + 1])) })),
    pullBoxes: [{ x: first[0], y: first[1], utilities: n.utilities }],
  };
}

describe('random networks', () => {
  it('always give audited, well-formed DXF with the centreline length kept', () => {
    rmSync(DIR, { recursive: true, force: true });
    mkdirSync(DIR, { recursive: true });
    execFileSync(PY, [TOOL, 'make', DIR]);
    const originals = ['site-r12-m.dxf', 'site-r2018-ft.dxf'].map((f) => readFileSync(join(DIR, f)));
    const cases = fc.sample(network, { numRuns: 16, seed: 20261202 });
    const files: string[] = [];
    const lengths: number[] = [];
    cases.forEach((c, i) => {
      const input = toInput(c);
      const merged = writeMergedDxf(originals[i % 2], input);
      if (!merged.ok) throw new Error(merged.error.message);
      files.push(join(DIR, `m${i}.dxf`), join(DIR, `l${i}.dxf`));
      writeFileSync(files[files.length - 2], merged.value.bytes);
      writeFileSync(files[files.length - 1], writeLayerOnlyDxf(input, { insUnits: 0 }));
      const len = input.net.segments.reduce((a, s) => a + s.length, 0);
      lengths.push(len, len);
    });
    const audits = JSON.parse(execFileSync(PY, [TOOL, 'audit-many', ...files], { encoding: 'utf8', maxBuffer: 1 << 26 })) as any[];
    audits.forEach((a, k) => {
      const where = `${files[k]}`;
      expect(a.errors, where).toBe(0);
      expect(a.raw.handlesUnique, where).toBe(true);
      expect(a.raw.handseed, where).toBeGreaterThan(a.raw.maxHandle);
      expect(a.raw.entitiesNotOwnedByModelSpace, where).toBe(0);
      const len = a.polylines.filter((p: any) => p.layer === 'TRENCH-CENTERLINE')
        .reduce((s: number, p: any) => s + p.points.slice(1).reduce((b: number, q: number[], i: number) => b + Math.hypot(q[0] - p.points[i][0], q[1] - p.points[i][1]), 0), 0);
      expect(Math.abs(len - lengths[k]), where).toBeLessThanOrEqual(1e-6 * Math.max(1, lengths[k]));
      expect(a.texts, where).toContain('PRELIMINARY LAYOUT — VERIFY BEFORE USE');
    });
  });
});
