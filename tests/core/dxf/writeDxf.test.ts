// DXF export checked by independent readers: ezdxf 0.18 (audit, entity counts, a raw tag-level
// check of handles/owners/$HANDSEED) and the `dxf` npm package (a second parser).
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseString } from 'dxf';
import { beforeAll, describe, expect, it } from 'vitest';
import { writeLayerOnlyDxf, writeMergedDxf } from '../../../core/dxf/writeDxf';
import { NOTICE_LINES, NOTICE_TITLE } from '../../../core/notice';
import type { LengthUnit } from '../../../core/units';
import { sampleInput, sampleLength } from './sampleNetwork';

const PY = '/usr/bin/python3';
const TOOL = join(__dirname, 'dxf_check.py');
const DIR = join(__dirname, '..', '..', '.tmp', `dxf-write-${process.pid}`);
const FURROW = ['TRENCH-CENTERLINE', 'TRENCH-OUTLINE', 'TRENCH-PULLBOX', 'TRENCH-SERVICE', 'TRENCH-LABEL', 'TRENCH-NOTES'];

interface Audit {
  version: string;
  insunits: number | null;
  errors: number;
  errorMessages: string[];
  counts: Record<string, number>;
  layers: string[];
  texts: string[];
  polylines: { layer: string; closed: boolean; points: [number, number][] }[];
  raw: { handles: number; handlesUnique: boolean; maxHandle: number; handseed: number | null; modelSpaceRecord: string | null; entitiesNotOwnedByModelSpace: number };
}

function audit(path: string): Audit {
  return JSON.parse(execFileSync(PY, [TOOL, 'audit', path], { encoding: 'utf8' })) as Audit;
}

const polyLength = (pts: [number, number][]): number => pts.slice(1).reduce((a, p, i) => a + Math.hypot(p[0] - pts[i][0], p[1] - pts[i][1]), 0);

beforeAll(() => {
  rmSync(DIR, { recursive: true, force: true });
  mkdirSync(DIR, { recursive: true });
  execFileSync(PY, [TOOL, 'make', DIR]);
});

const CASES: { ver: string; units: LengthUnit; insunits: number | null }[] = [
  { ver: 'r12', units: 'm', insunits: null }, { ver: 'r12', units: 'ft', insunits: null },
  { ver: 'r2000', units: 'm', insunits: 6 }, { ver: 'r2000', units: 'ft', insunits: 2 },
  { ver: 'r2018', units: 'm', insunits: 6 }, { ver: 'r2018', units: 'ft', insunits: 2 },
];

describe.each(CASES)('merged into the $ver original in $units', ({ ver, units, insunits }) => {
  let orig: Audit;
  let merged: Audit;
  let out: Uint8Array;
  let original: Uint8Array;
  beforeAll(() => {
    const src = join(DIR, `site-${ver}-${units}.dxf`);
    original = readFileSync(src);
    const r = writeMergedDxf(original, sampleInput(units));
    if (!r.ok) throw new Error(r.error.message);
    out = r.value.bytes;
    writeFileSync(join(DIR, `merged-${ver}-${units}.dxf`), out);
    orig = audit(src);
    merged = audit(join(DIR, `merged-${ver}-${units}.dxf`));
  });

  it('passes the ezdxf audit with no errors', () => {
    // ezdxf Auditor (independent library)
    expect(merged.errorMessages).toEqual([]);
    expect(merged.errors).toBe(0);
  });

  it('keeps every original entity: same count per layer', () => {
    // counts from ezdxf's model space, original vs merged
    const kept = Object.fromEntries(Object.entries(merged.counts).filter(([l]) => !FURROW.includes(l)));
    expect(kept).toEqual(orig.counts);
    for (const l of FURROW) expect(merged.counts[l]).toBeGreaterThan(0);
  });

  it('has unique handles, entities owned by *Model_Space and $HANDSEED above every handle', () => {
    // DXF reference: handles unique; owner 330 = block record; $HANDSEED > all handles (ezdxf tagger, raw)
    expect(merged.raw.handlesUnique).toBe(true);
    expect(merged.raw.handles).toBeGreaterThan(orig.raw.handles);
    expect(merged.raw.handseed).not.toBeNull();
    expect(merged.raw.handseed!).toBeGreaterThan(merged.raw.maxHandle);
    if (ver !== 'r12') {
      expect(merged.raw.modelSpaceRecord).toBe(orig.raw.modelSpaceRecord);
      expect(merged.raw.entitiesNotOwnedByModelSpace).toBe(0);
    }
  });

  it('leaves the original text untouched outside the insertion points and $HANDSEED', () => {
    // every original line appears, in order, in the output; the only changed line is $HANDSEED's value
    const a = Buffer.from(original).toString('latin1').split('\n');
    const b = Buffer.from(out).toString('latin1').split('\n');
    const seedAt = a.findIndex((l) => l.trim() === '$HANDSEED') + 2;
    let j = 0;
    const missing: number[] = [];
    for (let i = 0; i < a.length; i++) {
      if (i === seedAt) { j++; continue; }
      while (j < b.length && b[j] !== a[i]) j++;
      if (j >= b.length) { missing.push(i); break; }
      j++;
    }
    expect(missing).toEqual([]);
    expect(b.length).toBeGreaterThan(a.length);
  });

  it('keeps the units header and writes the centreline length back within 0.1 %', () => {
    expect(merged.insunits).toBe(insunits);
    const len = merged.polylines.filter((p) => p.layer === 'TRENCH-CENTERLINE').reduce((a, p) => a + polyLength(p.points), 0);
    const want = sampleLength(sampleInput(units)); // frame scale 1: drawing units = routing units
    expect(Math.abs(len - want) / want).toBeLessThan(0.001);
  });

  it('shows the verification notice from core/notice.ts on the notes layer', () => {
    // ezdxf decodes the text values (cp1252 or UTF-8 by version)
    for (const line of [NOTICE_TITLE, ...NOTICE_LINES]) expect(merged.texts).toContain(line);
  });

  it('opens in the dxf npm package with the Furrow layers and APWA colours', () => {
    // second independent reader
    const text = Buffer.from(out).toString(ver === 'r2018' ? 'utf8' : 'latin1');
    const parsed = parseString(text) as any;
    for (const l of FURROW) expect(Object.keys(parsed.tables.layers)).toContain(l);
    const ents = parsed.entities as any[];
    const centre = ents.filter((e) => e.layer === 'TRENCH-CENTERLINE');
    expect(centre.length).toBe(3);
    expect(centre.every((e) => e.type === (ver === 'r12' ? 'POLYLINE' : 'LWPOLYLINE'))).toBe(true);
    // B1 carries power then telecom: APWA red (ACI 1), orange (ACI 30); B2 power, water (blue 5), gas (yellow 2)
    const circles = ents.filter((e) => e.layer === 'TRENCH-SERVICE' && e.type === 'CIRCLE').map((e) => e.colorNumber);
    expect(circles.slice(0, 5)).toEqual([1, 30, 1, 5, 2]);
  });

  it('is byte-identical when written twice', () => {
    const again = writeMergedDxf(original, sampleInput(units));
    expect(again.ok && Buffer.from(again.value.bytes).equals(Buffer.from(out))).toBe(true);
  });
});

describe.each(CASES)('layer-only DXF for the $ver drawing in $units', ({ ver, units, insunits }) => {
  let a: Audit;
  let bytes: Uint8Array;
  beforeAll(() => {
    bytes = writeLayerOnlyDxf(sampleInput(units), { insUnits: insunits ?? 0 });
    writeFileSync(join(DIR, `layers-${ver}-${units}.dxf`), bytes);
    a = audit(join(DIR, `layers-${ver}-${units}.dxf`));
  });
  it('passes the ezdxf audit and holds only Furrow layers, in the drawing units', () => {
    expect(a.errorMessages).toEqual([]);
    expect(a.errors).toBe(0);
    expect(Object.keys(a.counts).sort()).toEqual([...FURROW].sort());
    // unitless R12 input with frame scale 1: the chosen routing unit (DXF $INSUNITS 6 = m, 2 = ft)
    expect(a.insunits).toBe(insunits ?? (units === 'm' ? 6 : 2));
    expect(a.raw.handlesUnique).toBe(true);
    expect(a.raw.handseed!).toBeGreaterThan(a.raw.maxHandle);
    expect(a.raw.entitiesNotOwnedByModelSpace).toBe(0);
  });
  it('lies in the original frame: centreline length and first vertex', () => {
    const inp = sampleInput(units);
    const cl = a.polylines.filter((p) => p.layer === 'TRENCH-CENTERLINE');
    const len = cl.reduce((s, p) => s + polyLength(p.points), 0);
    expect(Math.abs(len - sampleLength(inp)) / sampleLength(inp)).toBeLessThan(0.001);
    const s0 = inp.net.segments[0].points;
    expect(cl[0].points[0][0]).toBeCloseTo(s0[0] / inp.net.frame.scale + inp.net.frame.originX, 6);
    expect(cl[0].points[0][1]).toBeCloseTo(s0[1] / inp.net.frame.scale + inp.net.frame.originY, 6);
  });
  it('opens in the dxf npm package', () => {
    const parsed = parseString(Buffer.from(bytes).toString('latin1')) as any;
    expect((parsed.entities as any[]).filter((e) => e.layer === 'TRENCH-CENTERLINE').length).toBe(3);
  });
});

describe('layer-only DXF for a millimetre drawing', () => {
  it('writes back through the frame: drawing = local / scale + origin, $INSUNITS 4', () => {
    // routing in metres over a drawing in millimetres: scale = 0.001 m per drawing unit
    const inp = sampleInput('m');
    const frame = { originX: 631200000, originY: 5402100000, scale: 0.001 };
    const mmInput = { ...inp, net: { ...inp.net, frame }, extents: undefined };
    const path = join(DIR, 'layers-mm.dxf');
    writeFileSync(path, writeLayerOnlyDxf(mmInput, { insUnits: 4 }));
    const a = audit(path);
    expect(a.errors).toBe(0);
    expect(a.insunits).toBe(4); // DXF reference: $INSUNITS 4 = millimetres
    const cl = a.polylines.filter((p) => p.layer === 'TRENCH-CENTERLINE');
    const lenMm = cl.reduce((s, p) => s + polyLength(p.points), 0);
    expect(Math.abs(lenMm / 1000 - sampleLength(inp)) / sampleLength(inp)).toBeLessThan(0.001);
    expect(cl[0].points[0][0]).toBeCloseTo(631200000 + 50 * 1000, 3);
  });
});

describe('merging into unusual originals', () => {
  // A minimal R12 file as some site tools write it: no TABLES, no handles.
  const MINIMAL_R12 = ['0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1009', '0', 'ENDSEC',
    '0', 'SECTION', '2', 'ENTITIES', '0', 'LINE', '8', 'EDGE', '10', '631200', '20', '5402100', '30', '0', '11', '631300', '21', '5402100', '31', '0',
    '0', 'ENDSEC', '0', 'EOF', ''].join('\r\n');

  it('adds a LAYER table to an R12 file without one and writes no handles', () => {
    const r = writeMergedDxf(Buffer.from(MINIMAL_R12, 'latin1'), sampleInput('m'));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const path = join(DIR, 'merged-minimal-r12.dxf');
    writeFileSync(path, r.value.bytes);
    const a = audit(path);
    expect(a.errors).toBe(0);
    expect(a.counts.EDGE).toBe(1);
    expect(a.layers).toEqual(expect.arrayContaining(FURROW));
    expect(a.raw.handles).toBe(0);
    // CRLF line ends kept throughout
    expect(Buffer.from(r.value.bytes).toString('latin1').split('\r\n').length).toBe(Buffer.from(r.value.bytes).toString('latin1').split('\n').length);
  });

  it('does not duplicate a layer that already exists, and says so', () => {
    const once = writeMergedDxf(readFileSync(join(DIR, 'site-r2000-m.dxf')), sampleInput('m'));
    if (!once.ok) throw new Error(once.error.message);
    const twice = writeMergedDxf(once.value.bytes, sampleInput('m'));
    if (!twice.ok) throw new Error(twice.error.message);
    expect(twice.value.warnings.length).toBe(6);
    const path = join(DIR, 'merged-twice.dxf');
    writeFileSync(path, twice.value.bytes);
    const a = audit(path);
    expect(a.errors).toBe(0);
    expect(a.layers.filter((l) => l === 'TRENCH-CENTERLINE').length).toBe(1);
    expect(a.raw.handlesUnique).toBe(true);
  });

  it('uses configured layer names', () => {
    const inp = { ...sampleInput('m'), layers: { centerline: 'JT-CL', notes: 'JT-NOTE' } };
    const r = writeMergedDxf(readFileSync(join(DIR, 'site-r2000-m.dxf')), inp);
    if (!r.ok) throw new Error(r.error.message);
    const path = join(DIR, 'merged-names.dxf');
    writeFileSync(path, r.value.bytes);
    const a = audit(path);
    expect(a.counts['JT-CL']).toBe(3);
    expect(a.counts['JT-NOTE']).toBe(NOTICE_LINES.length + 1);
    expect(a.counts['TRENCH-CENTERLINE']).toBeUndefined();
  });

  it('writes POLYLINE/VERTEX/SEQEND owned by their polyline into an R13 (AC1012) file, which has no LWPOLYLINE', () => {
    // an R13 header on the R2000 fixture (ezdxf writes no R13): ezdxf reads and audits it
    const text = readFileSync(join(DIR, 'site-r2000-m.dxf'), 'latin1').replace(/\$ACADVER(\r?\n\s*1\r?\n)AC1015/, '$ACADVER$1AC1012');
    expect(text).toContain('AC1012');
    const r = writeMergedDxf(Buffer.from(text, 'latin1'), sampleInput('m'));
    if (!r.ok) throw new Error(r.error.message);
    const out = Buffer.from(r.value.bytes).toString('latin1');
    const count = (t: string): number => t.split(/\r?\n/).filter((l) => l === 'LWPOLYLINE').length;
    expect(count(out)).toBe(count(text)); // only the original's own
    const path = join(DIR, 'merged-r13.dxf');
    writeFileSync(path, r.value.bytes);
    const a = audit(path);
    expect(a.errors).toBe(0);
    expect(a.raw.handlesUnique).toBe(true);
    expect(a.raw.entitiesNotOwnedByModelSpace).toBe(0);
    const len = a.polylines.filter((p) => p.layer === 'TRENCH-CENTERLINE').reduce((s, p) => s + polyLength(p.points), 0);
    expect(Math.abs(len - sampleLength(sampleInput('m'))) / sampleLength(sampleInput('m'))).toBeLessThan(0.001);
  });

  it('adds $HANDSEED when an R2000 header lacks it, above every handle', () => {
    const text = readFileSync(join(DIR, 'site-r2000-m.dxf'), 'latin1').replace(/ {2}9\r?\n\$HANDSEED\r?\n {2}5\r?\n[0-9A-Fa-f]+\r?\n/, '');
    expect(text).not.toContain('$HANDSEED');
    const r = writeMergedDxf(Buffer.from(text, 'latin1'), sampleInput('m'));
    if (!r.ok) throw new Error(r.error.message);
    const path = join(DIR, 'merged-noseed.dxf');
    writeFileSync(path, r.value.bytes);
    const a = audit(path);
    // DXF reference: $HANDSEED must exceed every handle (raw tag check with ezdxf's tagger)
    expect(a.errors).toBe(0);
    expect(a.raw.handseed!).toBeGreaterThan(a.raw.maxHandle);
    expect(a.raw.handlesUnique).toBe(true);
  });

  it.each([['r2000', 'cp1252'], ['r2018', 'utf-8']])('writes non-ASCII layer names into %s in its encoding (%s)', (ver) => {
    const inp = { ...sampleInput('m'), layers: { centerline: 'TRANCHÉE-AXE', notes: 'TRANCHÉE-NOTES' } };
    const r = writeMergedDxf(readFileSync(join(DIR, `site-${ver}-m.dxf`)), inp);
    if (!r.ok) throw new Error(r.error.message);
    const path = join(DIR, `merged-accents-${ver}.dxf`);
    writeFileSync(path, r.value.bytes);
    const a = audit(path); // ezdxf decodes by $DWGCODEPAGE (R2000) or UTF-8 (R2007 and later)
    expect(a.errors).toBe(0);
    expect(a.layers).toEqual(expect.arrayContaining(['TRANCHÉE-AXE', 'TRANCHÉE-NOTES']));
    expect(a.counts['TRANCHÉE-AXE']).toBe(3);
  });

  it('refuses a binary DXF and a file without an ENTITIES section, naming what to do', () => {
    const bin = writeMergedDxf(Buffer.from('AutoCAD Binary DXF\r\n\x1a\x00', 'latin1'), sampleInput('m'));
    expect(bin.ok ? '' : bin.error.kind).toBe('binary');
    const noEnt = writeMergedDxf(Buffer.from('0\nSECTION\n2\nHEADER\n0\nENDSEC\n0\nEOF\n', 'latin1'), sampleInput('m'));
    expect(noEnt.ok ? '' : noEnt.error.message).toMatch(/ENTITIES.*layer-only/);
  });
});
