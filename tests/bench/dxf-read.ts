// DXF read benchmark: generates a ~20 MB site plan (and a ~5 MB one) into tests/.tmp/ and reports,
// per case, one JSON line: parse-only time with dxf-parser (the peer, same process), readDxf
// (parse + conversion to a Drawing), buildSite, MB/s and the ratios.
//   node --expose-gc --import tsx tests/bench/dxf-read.ts [--mb 20]   (or npx tsx ..., without the GC between runs)
// Targets: the site stage adds at most 30 % to parsing; a 20 MB drawing is ready in <= 3 s.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { loadavg } from 'node:os';
import DxfParser from 'dxf-parser';
import { readDxfBytes } from '../../core/dxf/readDxf';
import { buildSite } from '../../core/site/buildSite';
import type { LayerRole } from '../../core/site/site';

const TMP = fileURLToPath(new URL('../.tmp/bench-dxf/', import.meta.url));
const args = process.argv.slice(2);
const mbArg = args.includes('--mb') ? Number(args[args.indexOf('--mb') + 1]) : 20;

/** Deterministic LCG (Numerical Recipes constants). */
function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

/** A subdivision in an invented town: lots with houses, driveways, lot lines, labels, trees, roads, curbs, a water main and contours. */
function makeSiteDxf(targetMB: number): string {
  const out: string[] = [];
  let handle = 0x100;
  const h = (): string => (handle++).toString(16).toUpperCase();
  const f = (v: number): string => v.toFixed(4);
  const lw = (layer: string, pts: number[], closed: boolean, bulges?: number[]): void => {
    out.push('0', 'LWPOLYLINE', '5', h(), '100', 'AcDbEntity', '8', layer, '100', 'AcDbPolyline', '90', String(pts.length / 2), '70', closed ? '1' : '0');
    for (let i = 0; i < pts.length; i += 2) {
      out.push('10', f(pts[i]), '20', f(pts[i + 1]));
      const b = bulges?.[i / 2];
      if (b) out.push('42', b.toFixed(6));
    }
  };
  const X0 = 612000, Y0 = 4871000; // large local-grid coordinates
  out.push('0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1015', '9', '$INSUNITS', '70', '6', '0', 'ENDSEC');
  const layers = ['BLDG', 'LOT-LINES', 'DRIVE-PAVE', 'ROAD-PAVE', 'CURB', 'EX-WATER', 'ANNO-TEXT', 'TREES', 'TOPO'];
  out.push('0', 'SECTION', '2', 'TABLES', '0', 'TABLE', '2', 'LAYER', '70', String(layers.length));
  for (const l of layers) out.push('0', 'LAYER', '2', l, '70', '0', '62', '7', '6', 'CONTINUOUS');
  out.push('0', 'ENDTAB', '0', 'ENDSEC');
  out.push('0', 'SECTION', '2', 'BLOCKS', '0', 'BLOCK', '8', '0', '2', 'TREE', '70', '0', '10', '0', '20', '0', '30', '0', '3', 'TREE');
  out.push('0', 'CIRCLE', '8', '0', '10', '0', '20', '0', '30', '0', '40', '2.5');
  out.push('0', 'LINE', '8', '0', '10', '-2.5', '20', '0', '30', '0', '11', '2.5', '21', '0', '31', '0');
  out.push('0', 'LINE', '8', '0', '10', '0', '20', '-2.5', '30', '0', '11', '0', '21', '2.5', '31', '0');
  out.push('0', 'ENDBLK', '8', '0', '0', 'ENDSEC');
  out.push('0', 'SECTION', '2', 'ENTITIES');
  const r = rng(42);
  // about 1.9 kB per lot: lots per side from the target size
  const side = Math.max(4, Math.round(Math.sqrt((targetMB * 1024 * 1024) / 1900)));
  const lotW = 30, lotD = 40, road = 16;
  for (let j = 0; j < side; j++) {
    const rowY = Y0 + j * (2 * lotD + road);
    // road strip below each double row: pavement, two curbs, a water main
    const rx1 = X0 + side * lotW;
    lw('ROAD-PAVE', [X0, rowY - road, rx1, rowY - road, rx1, rowY, X0, rowY], true);
    out.push('0', 'LINE', '5', h(), '8', 'CURB', '10', f(X0), '20', f(rowY - 0.3), '11', f(rx1), '21', f(rowY - 0.3));
    out.push('0', 'LINE', '5', h(), '8', 'CURB', '10', f(X0), '20', f(rowY - road + 0.3), '11', f(rx1), '21', f(rowY - road + 0.3));
    out.push('0', 'LINE', '5', h(), '8', 'EX-WATER', '10', f(X0), '20', f(rowY - road / 2), '11', f(rx1), '21', f(rowY - road / 2));
    for (let i = 0; i < side; i++) {
      for (let k = 0; k < 2; k++) {
        const x = X0 + i * lotW;
        const y = rowY + k * lotD;
        lw('LOT-LINES', [x, y, x + lotW, y, x + lotW, y + lotD, x, y + lotD], true);
        // house: an L with a bay (bulge) on the front, 8 to 11 m by 10 to 14 m
        const w = 8 + 3 * r(), d = 10 + 4 * r(), bx = x + 6 + 6 * r(), by = y + 8 + 4 * r();
        const notch = 2 + 2 * r();
        lw('BLDG', [bx, by, bx + w, by, bx + w, by + d - notch, bx + w - notch, by + d - notch, bx + w - notch, by + d, bx, by + d], true,
          [0, 0, 0, 0, 0, 0.2]);
        lw('DRIVE-PAVE', [bx + 1, y, bx + 4.5, y, bx + 4.5, by, bx + 1, by], true);
        out.push('0', 'TEXT', '5', h(), '8', 'ANNO-TEXT', '10', f(x + 2), '20', f(y + 2), '40', '1.5', '1', `LOT ${j * side * 2 + i * 2 + k + 1}`);
        for (let t = 0; t < 2; t++) {
          out.push('0', 'INSERT', '5', h(), '8', 'TREES', '2', 'TREE', '10', f(x + 3 + 24 * r()), '20', f(y + 30 + 8 * r()), '50', f(360 * r()));
        }
      }
    }
  }
  // contours: long open polylines across the site
  const span = side * lotW;
  for (let c = 0; c < side; c++) {
    const pts: number[] = [];
    for (let q = 0; q <= 200; q++) pts.push(X0 + (span * q) / 200, Y0 + c * 50 + 8 * Math.sin(q / 9 + c));
    lw('TOPO', pts, false);
  }
  out.push('0', 'ENDSEC', '0', 'EOF', '');
  return out.join('\n');
}

const ROLES: Record<string, LayerRole> = {
  BLDG: 'building', 'DRIVE-PAVE': 'pavement', 'ROAD-PAVE': 'pavement', CURB: 'crossing', 'EX-WATER': 'crossing',
  'LOT-LINES': 'ignore', 'ANNO-TEXT': 'ignore', TREES: 'ignore', TOPO: 'ignore',
};

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

mkdirSync(TMP, { recursive: true });
for (const mb of [Math.max(1, Math.round(mbArg / 4)), mbArg]) {
  const file = join(TMP, `site-${mb}mb.dxf`);
  writeFileSync(file, makeSiteDxf(mb));
  const bytes = readFileSync(file);
  const sizeMB = bytes.length / (1024 * 1024);
  const runs = mb >= 10 ? 3 : 5;
  const parseMs: number[] = [], readMs: number[] = [], siteMs: number[] = [];
  const parseCpu: number[] = [], readCpu: number[] = [], siteCpu: number[] = [];
  let buildings = 0, entities = 0;
  const gc = (globalThis as { gc?: () => void }).gc;
  // CPU time (user + system) as well as wall time: the machine may be shared, CPU time is steadier
  const cpuMs = (c: NodeJS.CpuUsage): number => (c.user + c.system) / 1000;
  for (let k = 0; k < runs; k++) {
    gc?.();
    // peer: dxf-parser alone on the decoded text (decoding included, as in readDxfBytes)
    let c = process.cpuUsage();
    let t = performance.now();
    const text = new TextDecoder('utf-8').decode(bytes);
    new DxfParser().parseSync(text);
    parseMs.push(performance.now() - t);
    parseCpu.push(cpuMs(process.cpuUsage(c)));
    gc?.();
    c = process.cpuUsage();
    t = performance.now();
    const d = readDxfBytes(bytes);
    readMs.push(performance.now() - t);
    readCpu.push(cpuMs(process.cpuUsage(c)));
    if (!d.ok) throw new Error(d.error.message);
    c = process.cpuUsage();
    t = performance.now();
    const s = buildSite(d.value, { roles: ROLES });
    siteMs.push(performance.now() - t);
    siteCpu.push(cpuMs(process.cpuUsage(c)));
    if (!s.ok) throw new Error(s.error.message);
    buildings = s.value.buildings.length;
    entities = d.value.entities.length;
  }
  const p = median(parseMs), rd = median(readMs), st = median(siteMs);
  const pc = median(parseCpu), rc = median(readCpu), sc = median(siteCpu);
  console.log(JSON.stringify({
    case: `site-${mb}mb`, sizeMB: +sizeMB.toFixed(2), entities, buildings, runs,
    parseOnlyMs: Math.round(p), readDxfMs: Math.round(rd), buildSiteMs: Math.round(st), readyMs: Math.round(rd + st),
    parseMBps: +(sizeMB / (p / 1000)).toFixed(1), readyMBps: +(sizeMB / ((rd + st) / 1000)).toFixed(1),
    readOverParse: +(rd / p).toFixed(3), siteOverParse: +(st / p).toFixed(3), siteOverRead: +(st / rd).toFixed(3), readyOverParse: +((rd + st) / p).toFixed(3),
    cpuMs: { parseOnly: Math.round(pc), readDxf: Math.round(rc), buildSite: Math.round(sc) },
    cpuSiteOverParse: +(sc / pc).toFixed(3), cpuSiteOverRead: +(sc / rc).toFixed(3),
    loadAverage1m: +(loadavg()[0]).toFixed(1),
    targets: { siteAddsAtMost: 0.3, readyMsAtMost20MB: 3000 },
  }));
}
