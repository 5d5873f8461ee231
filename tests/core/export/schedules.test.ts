// The schedules read back by independent readers: openpyxl (XLSX) and Python's csv module,
// poppler's pdftoppm / pdftotext (PDF). Files go to tests/.tmp (git-ignored).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { computeTakeOff } from '../../../core/takeoff/takeoff';
import type { TakeOff } from '../../../core/takeoff/takeoff';
import { writeTakeOffXlsx } from '../../../core/export/xlsx';
import { writeTakeOffCsv } from '../../../core/export/csv';
import { writeReportPdf } from '../../../core/export/pdf';
import { defaultSettings } from '../../../core/settings';
import { NOTICE_LINES, NOTICE_TITLE } from '../../../core/notice';
import { handNetwork, terminal } from '../takeoff/handNetwork';

const OUT = path.resolve(__dirname, '../../.tmp/export-schedules');
const U = ['power', 'telecom', 'water', 'gas'];
const net = handNetwork(
  [
    { id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'C' },
    { id: 1, kind: 'junction', x: 40, y: 0 },
    { id: 2, kind: 'service', x: 40, y: 30, terminalId: 'S1' },
    { id: 3, kind: 'service', x: 70, y: 10, terminalId: 'S2' },
  ],
  [
    { from: 0, to: 1, pts: [0, 0, 40, 0], pave: 10, crossings: [{ x: 15, y: 0, layer: 'PAVE', kind: 'pavement-edge' }, { x: 30, y: 0, layer: 'OLD "FENCE", EAST', kind: 'line' }] },
    { from: 1, to: 2, pts: [40, 0, 40, 30] },
    { from: 1, to: 3, pts: [40, 0, 60, 0, 70, 10] },
  ],
);
const terms = [terminal('C', 'connection', U, 0, 0), terminal('S1', 'service', U, 40, 30), terminal('S2', 'service', ['power', 'telecom'], 70, 10)];
const meta = { project: 'Demo take-off', site: 'Test yard', date: '2026-01-15' };

function py(script: string, ...args: string[]): string {
  const r = spawnSync('/usr/bin/python3', ['-c', script, ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python failed: ${r.stderr}`);
  return r.stdout;
}

let t: TakeOff;
let csvPath: string, xlsxPath: string, pdfPath: string;
beforeAll(async () => {
  fs.mkdirSync(OUT, { recursive: true });
  t = computeTakeOff(net, terms, defaultSettings());
  csvPath = path.join(OUT, 'takeoff.csv');
  xlsxPath = path.join(OUT, 'takeoff.xlsx');
  pdfPath = path.join(OUT, 'report.pdf');
  fs.writeFileSync(csvPath, writeTakeOffCsv(t));
  fs.writeFileSync(xlsxPath, await writeTakeOffXlsx(t, meta));
  fs.writeFileSync(pdfPath, await writeReportPdf(t, net, meta));
});

// Reads both files independently of our code and reports how they compare.
const COMPARE = `
import csv, json, sys, openpyxl
rows = list(csv.reader(open(sys.argv[1], newline='', encoding='utf-8')))
wb = openpyxl.load_workbook(sys.argv[2], data_only=True)
out = {"sheets": wb.sheetnames, "first": {n: wb[n].cell(1, 1).value for n in wb.sheetnames}, "mismatch": [], "types": []}
ws = wb["Line items"]
xl = [[c for c in r] for r in ws.iter_rows(values_only=True)]
start = next(i for i, r in enumerate(xl) if r[0] == "Group")
xl = xl[start:]
out["nrows"] = [len(rows), len(xl)]
for i, (a, b) in enumerate(zip(rows, xl)):
    for j, (ca, cb) in enumerate(zip(a, b)):
        if cb is None: cb = ""
        if isinstance(cb, (int, float)) and not isinstance(cb, bool):
            out["types"].append("n")
            if ca == "" or abs(float(ca) - cb) > 1e-9: out["mismatch"].append([i, j, ca, cb])
        elif str(cb) != ca:
            out["mismatch"].append([i, j, ca, str(cb)])
print(json.dumps(out))
`;

describe('schedules', () => {
  it('the XLSX read back by openpyxl equals the CSV read by Python csv, row by row', () => {
    const r = JSON.parse(py(COMPARE, csvPath, xlsxPath));
    expect(r.sheets).toEqual(['Summary', 'Line items', 'Segments', 'Utilities', 'Pull boxes']);
    expect(r.nrows[0]).toBe(t.lines.length + 2 + 1 + NOTICE_LINES.length);
    expect(r.nrows[1]).toBe(r.nrows[0]);
    expect(r.mismatch).toEqual([]);
    // quantities, prices and costs are stored as numbers, not text
    expect(r.types.length).toBeGreaterThanOrEqual(3 * t.lines.length);
  });

  it('every XLSX sheet opens with the notice (core/notice.ts)', () => {
    const r = JSON.parse(py(COMPARE, csvPath, xlsxPath));
    for (const name of r.sheets) expect(r.first[name]).toBe(NOTICE_TITLE);
  });

  it('the CSV has one row per line item, quotes awkward layer names, and ends with the notice', () => {
    const rows = JSON.parse(py('import csv,json,sys; print(json.dumps(list(csv.reader(open(sys.argv[1], newline="", encoding="utf-8")))))', csvPath)) as string[][];
    const keys = rows.slice(1).map((r) => r[1]);
    expect(keys.slice(0, t.lines.length)).toEqual(t.lines.map((l) => l.key));
    expect(rows.find((r) => r[1] === 'crossing.OLD "FENCE", EAST')?.[2]).toBe('Crossing — OLD "FENCE", EAST');
    expect(rows.filter((r) => r[0] === 'Notice').map((r) => r[2])).toEqual([NOTICE_TITLE, ...NOTICE_LINES]);
  });

  it('the PDF opens: pdftoppm renders page 1 with the APWA colours, pdftotext finds the notice', () => {
    const png = path.join(OUT, 'page');
    const r = spawnSync('pdftoppm', ['-png', '-r', '50', '-f', '1', '-l', '1', pdfPath, png]);
    expect(r.status).toBe(0);
    const file = fs.readdirSync(OUT).find((f) => f.startsWith('page') && f.endsWith('.png')) as string;
    const img = PNG.sync.read(fs.readFileSync(path.join(OUT, file)));
    let red = 0, blue = 0;
    for (let i = 0; i < img.data.length; i += 4) {
      const [R, G, B] = [img.data[i], img.data[i + 1], img.data[i + 2]];
      if (R > 200 && G < 80 && B < 80) red++; // APWA red (electric)
      if (B > 200 && R < 80 && G < 80) blue++; // APWA blue (potable water)
    }
    expect(red).toBeGreaterThan(20);
    expect(blue).toBeGreaterThan(20);
    const text = spawnSync('pdftotext', ['-layout', pdfPath, '-'], { encoding: 'utf8' }).stdout;
    expect(text).toContain(NOTICE_TITLE);
    for (const line of NOTICE_LINES) expect(text.replace(/\s+/g, ' ')).toContain(line.slice(0, 40));
  });

  it('the PDF is byte-identical for the same input and date', async () => {
    const a = await writeReportPdf(t, net, meta);
    const b = await writeReportPdf(t, net, meta);
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
  });

  it('the XLSX is byte-identical whatever the clock says, its entries dated by the date passed in (read by Python zipfile)', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      vi.setSystemTime(new Date('2031-07-04T10:11:12Z'));
      const a = await writeTakeOffXlsx(t, meta);
      vi.setSystemTime(new Date('2033-02-01T23:59:58Z'));
      const b = await writeTakeOffXlsx(t, meta);
      expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
      const file = path.join(OUT, 'pinned.xlsx');
      fs.writeFileSync(file, a);
      const dates = JSON.parse(py('import json,sys,zipfile; print(json.dumps(sorted({z.date_time for z in zipfile.ZipFile(sys.argv[1]).infolist()})))', file));
      expect(dates).toEqual([[2026, 1, 15, 0, 0, 0]]);
    } finally {
      vi.useRealTimers();
    }
  });
});
