// The whole job on the invented demo site (Brackenrise Business Park): outputs checked by
// independent readers (ezdxf audit and counts, the dxf npm package) and by our own reader;
// repeatable; stages reported in order; cancellation; each bad import input refused with its file.
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseString } from 'dxf';
import { beforeAll, describe, expect, it } from 'vitest';
import { readDxfBytes } from '../../../core/dxf/readDxf';
import { runPipeline, STAGES, type PipelineInput, type PipelineOutput } from '../../../core/pipeline';
import { Cancelled } from '../../../core/result';

const ROOT = join(__dirname, '..', '..', '..');
const DEMO = join(ROOT, 'assets', 'demo');
const FIX = join(ROOT, 'tests', 'fixtures', 'dxf', 'files');
const TMP = join(ROOT, 'tests', '.tmp', `pipeline-${process.pid}`);
const TOOL = join(ROOT, 'tests', 'core', 'dxf', 'dxf_check.py');

function demoInput(over: Partial<PipelineInput> = {}): PipelineInput {
  return {
    drawing: { name: 'site.dxf', bytes: new Uint8Array(readFileSync(join(DEMO, 'site.dxf'))) },
    services: { name: 'services.csv', text: readFileSync(join(DEMO, 'services.csv'), 'utf8') },
    roles: { name: 'roles.json', text: readFileSync(join(DEMO, 'roles.json'), 'utf8') },
    meta: { project: 'Test', site: 'Brackenrise', date: '2026-01-15' },
    ...over,
  };
}

const audit = (bytes: Uint8Array, name: string): any => {
  mkdirSync(TMP, { recursive: true });
  const p = join(TMP, name);
  writeFileSync(p, bytes);
  return JSON.parse(execFileSync('/usr/bin/python3', [TOOL, 'audit', p], { encoding: 'utf8' }));
};

describe('the demo site end to end', () => {
  let out: PipelineOutput;
  const stages: [string, number][] = [];
  beforeAll(async () => {
    const r = await runPipeline(demoInput(), { onProgress: (s, f) => { if (f === 0 || f === 1) stages.push([s, f]); } });
    if (!r.ok) throw new Error(r.error.message);
    out = r.value;
  });

  it('fills every summary key of the DESIGN.md contract', () => {
    const s = out.summary as any;
    for (const path of ['units', 'services.total', 'services.connected', 'trench.length', 'trench.lengthUnderPavement', 'trench.crossings',
      'trench.bends', 'cost.route', 'cost.lowerBound', 'runtimeMs', 'files.routedDxf', 'files.trenchDxf', 'files.takeoffXlsx',
      'files.takeoffCsv', 'files.reportPdf', 'layers.centerline', 'warnings']) {
      const v = path.split('.').reduce((o, k) => (o == null ? undefined : o[k]), s);
      expect(v, path).toBeDefined();
    }
    expect(s.units).toBe('m');
    expect(s.services.total).toBe(12);
    expect(s.services.connected).toBe(12);
    expect(s.status).toBe('done');
    expect(s.cost.lowerBound).toBeLessThanOrEqual(s.cost.route);
    for (const st of STAGES) expect(s.runtimeMs[st]).toBeGreaterThanOrEqual(0);
  });

  it('reports the stages in order, each started and finished', () => {
    expect(stages).toEqual(STAGES.flatMap((s) => [[s, 0], [s, 1]]));
  });

  it('writes a routed DXF that passes the ezdxf audit and keeps every original entity', () => {
    // ezdxf Auditor and model-space counts (independent library)
    const merged = audit(out.files.routedDxf, 'routed.dxf');
    const orig = JSON.parse(execFileSync('/usr/bin/python3', [TOOL, 'audit', join(DEMO, 'site.dxf')], { encoding: 'utf8' }));
    expect(merged.errors).toBe(0);
    const kept = Object.fromEntries(Object.entries(merged.counts).filter(([l]) => !l.startsWith('TRENCH-')));
    expect(kept).toEqual(orig.counts);
    expect(merged.counts['TRENCH-CENTERLINE']).toBe(out.net.segments.length);
    expect(merged.raw.handlesUnique).toBe(true);
    expect(merged.raw.entitiesNotOwnedByModelSpace).toBe(0);
    expect(merged.raw.handseed).toBeGreaterThan(merged.raw.maxHandle);
    const layersOnly = audit(out.files.trenchDxf, 'trench-layers.dxf');
    expect(layersOnly.errors).toBe(0);
    expect(layersOnly.insunits).toBe(6);
  });

  it('gives the network length back within 0.1 % through our reader and ezdxf', () => {
    const want = out.summary.trench.length;
    const d = readDxfBytes(out.files.routedDxf);
    if (!d.ok) throw new Error(d.error.message);
    let ours = 0;
    for (const e of d.value.entities) {
      if (e.kind !== 'polyline' || e.layer !== 'TRENCH-CENTERLINE') continue;
      for (let i = 2; i < e.points.length; i += 2) ours += Math.hypot(e.points[i] - e.points[i - 2], e.points[i + 1] - e.points[i - 1]);
    }
    expect(Math.abs(ours - want) / want).toBeLessThan(0.001);
    const ez = audit(out.files.trenchDxf, 'trench-layers-len.dxf').polylines
      .filter((p: any) => p.layer === 'TRENCH-CENTERLINE')
      .reduce((a: number, p: any) => a + p.points.slice(1).reduce((b: number, q: number[], i: number) => b + Math.hypot(q[0] - p.points[i][0], q[1] - p.points[i][1]), 0), 0);
    expect(Math.abs(ez - want) / want).toBeLessThan(0.001);
  });

  it('opens in the dxf npm package', () => {
    const parsed = parseString(Buffer.from(out.files.routedDxf).toString('latin1')) as any;
    expect((parsed.entities as any[]).filter((e) => e.layer === 'TRENCH-CENTERLINE')).toHaveLength(out.net.segments.length);
  });

  it('gives byte-identical files for the same input', async () => {
    const again = await runPipeline(demoInput());
    if (!again.ok) throw new Error(again.error.message);
    const same = (a: Uint8Array | string, b: Uint8Array | string): boolean => Buffer.from(a).equals(Buffer.from(b));
    const differ = (Object.keys(out.files) as (keyof PipelineOutput['files'])[]).filter((k) => !same(again.value.files[k], out.files[k]));
    expect(differ).toEqual([]);
    const strip = (s: any): string => JSON.stringify({ ...s, runtimeMs: null, routeStepsMs: null });
    expect(strip(again.value.summary)).toBe(strip(out.summary));
  });
});

describe('cancellation', () => {
  it('throws Cancelled soon after the signal is raised in the middle of routing', async () => {
    // the signal turns on 1 s into the route stage (the router is synchronous: it must poll it)
    let routeStart = 0;
    const signal = { get aborted(): boolean { return routeStart > 0 && performance.now() - routeStart > 1000; } };
    const settings = { name: 'long.json', text: JSON.stringify({ route: { timeBudgetMs: 60000 } }) };
    const run = runPipeline(demoInput({ settings }), { signal, onProgress: (s, f) => { if (s === 'route' && f === 0) routeStart = performance.now(); } });
    await expect(run).rejects.toBeInstanceOf(Cancelled);
    // with this budget the route alone runs for most of a minute; cancelling must not wait for it
    const late = performance.now() - routeStart - 1000;
    expect(late).toBeGreaterThanOrEqual(0);
    expect(late).toBeLessThan(3000);
  });
});

describe('bad input of the import stage is refused with the file and what to do', () => {
  const cases: [string, RegExp][] = [
    ['binary.dxf', /binary DXF.*save it again as ASCII/],
    ['empty.dxf', /empty/],
    ['garbage.dxf', /not an ASCII DXF/],
    ['truncated.dxf', /truncated/],
    ['unitless.dxf', /--units m or --units ft/],
    ['cyclic_blocks.dxf', /recursive/],
    ['deep_blocks.dxf', /nest deeper/],
    ['paper_only.dxf', /paper space/],
    ['open_only.dxf', /Close the outlines/],
  ];
  it.each(cases)('%s', async (name, why) => {
    const r = await runPipeline(demoInput({ drawing: { name, bytes: new Uint8Array(readFileSync(join(FIX, name))) }, roles: undefined }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.kind).toBe('input');
    expect(r.error.message).toContain(name);
    expect(r.error.message).toMatch(why);
  });

  it('a settings file with an unknown key', async () => {
    const r = await runPipeline(demoInput({ settings: { name: 'job.json', text: '{"route":{"cell":1}}' } }));
    expect(r.ok ? '' : r.error.message).toMatch(/^job\.json: route\.cell: unknown key/);
  });

  it('a services file with a bad line, and points away from the drawing', async () => {
    const bad = await runPipeline(demoInput({ services: { name: 'pts.csv', text: 'id,x,y,role,utilities\nP,1,1,connection,power\nS,x,2,service,power\n' } }));
    expect(bad.ok ? '' : bad.error.message).toMatch(/^pts\.csv, line 3: x 'x' is not a number/);
    const far = await runPipeline(demoInput({ services: { name: 'far.csv', text: 'id,x,y,role,utilities\nP,1,1,connection,power\nS,2,2,service,power\n' } }));
    expect(far.ok ? '' : far.error.message).toMatch(/^far\.csv: no point of connection lies on the site/);
  });

  it('a roles file with an unknown role', async () => {
    const r = await runPipeline(demoInput({ roles: { name: 'r.json', text: '{"BLDG-OUTLINE":"house"}' } }));
    expect(r.ok ? '' : r.error.message).toMatch(/^r\.json: layer 'BLDG-OUTLINE' has role "house"/);
  });
});

describe('R12 and R2000+ drawings in metres and feet, end to end', () => {
  // Quillby Yard fixtures written by ezdxf (tests/core/dxf/dxf_check.py make); frame origin 631200, 5402100
  const DIR = join(TMP, 'quillby');
  const roles = JSON.stringify({ BLDG: 'building', 'ROAD-EDGE': 'crossing', FENCE: 'crossing', TREES: 'ignore', NOTES: 'ignore' });
  beforeAll(() => {
    mkdirSync(DIR, { recursive: true });
    execFileSync('/usr/bin/python3', [TOOL, 'make', DIR]);
  });
  const cases = [['r12', 'm'], ['r12', 'ft'], ['r2000', 'ft'], ['r2018', 'm']] as const;
  it.each(cases)('%s in %s', async (ver, units) => {
    const k = units === 'm' ? 1 : 1 / 0.3048;
    const P = (x: number, y: number): string => `${(631200 + x * k).toFixed(3)},${(5402100 + y * k).toFixed(3)}`;
    const services = ['id,x,y,role,utilities', `POC,${P(50, 5)},connection,power;telecom`, `B1,${P(25, 30)},service,power;telecom`, `B2,${P(72, 12)},service,power`].join('\n');
    const name = `site-${ver}-${units}.dxf`;
    const r = await runPipeline({
      drawing: { name, bytes: new Uint8Array(readFileSync(join(DIR, name))) },
      services: { name: 'q.csv', text: services },
      roles: { name: 'q.json', text: roles },
      units: ver === 'r12' ? units : undefined,
      meta: { project: 'Test', site: 'Quillby Yard', date: '2026-01-15' },
    });
    if (!r.ok) throw new Error(r.error.message);
    const s = r.value.summary;
    expect(s.units).toBe(units);
    expect(s.services.connected).toBe(2);
    const merged = audit(r.value.files.routedDxf, `q-${ver}-${units}.dxf`);
    const orig = JSON.parse(execFileSync('/usr/bin/python3', [TOOL, 'audit', join(DIR, name)], { encoding: 'utf8' }));
    expect(merged.errors).toBe(0);
    expect(merged.version).toBe(orig.version);
    expect(Object.fromEntries(Object.entries(merged.counts).filter(([l]) => !l.startsWith('TRENCH-')))).toEqual(orig.counts);
    expect(merged.raw.handlesUnique).toBe(true);
    const len = merged.polylines.filter((p: any) => p.layer === 'TRENCH-CENTERLINE')
      .reduce((a: number, p: any) => a + p.points.slice(1).reduce((b: number, q: number[], i: number) => b + Math.hypot(q[0] - p.points[i][0], q[1] - p.points[i][1]), 0), 0);
    expect(Math.abs(len - s.trench.length) / s.trench.length).toBeLessThan(0.001);
    // our own reader (core/dxf/readDxf.ts) on the merged file
    const d = readDxfBytes(r.value.files.routedDxf);
    if (!d.ok) throw new Error(d.error.message);
    let ours = 0;
    for (const e of d.value.entities) {
      if (e.kind !== 'polyline' || e.layer !== 'TRENCH-CENTERLINE') continue;
      for (let i = 2; i < e.points.length; i += 2) ours += Math.hypot(e.points[i] - e.points[i - 2], e.points[i + 1] - e.points[i - 1]);
    }
    expect(Math.abs(ours - s.trench.length) / s.trench.length).toBeLessThan(0.001);
    const layersOnly = audit(r.value.files.trenchDxf, `ql-${ver}-${units}.dxf`);
    expect(layersOnly.errors).toBe(0);
    expect(layersOnly.insunits).toBe(units === 'm' ? 6 : 2);
  });
});
