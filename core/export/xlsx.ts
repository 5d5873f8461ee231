// XLSX schedule (exceljs; runs in Node and in the browser, returns bytes, no file I/O).
// Sheets: Summary, Line items, Segments, Utilities, Pull boxes — each opens with the notice
// (core/notice.ts). Numbers are stored as numbers; units sit in the column headers.

import ExcelJS from 'exceljs';
import type { TakeOff } from '../takeoff/takeoff';
import { NOTICE_LINES, NOTICE_TITLE } from '../notice';
import type { Cell, ScheduleMeta } from './scheduleTable';
import { lineItemHeader, lineItemRows } from './scheduleTable';
import { pinZipTimes } from './zipTimes';

const QTY = '#,##0.000';
const MONEY = '#,##0.00';

/** Notice rows at the top of a sheet; returns the next free row number. */
function noticeBlock(ws: ExcelJS.Worksheet): number {
  const title = ws.addRow([NOTICE_TITLE]);
  title.font = { bold: true, color: { argb: 'FFB00020' } };
  for (const line of NOTICE_LINES) ws.addRow([line]);
  ws.addRow([]);
  return ws.rowCount + 1;
}

function table(ws: ExcelJS.Worksheet, header: string[], rows: Cell[][], formats: Record<number, string> = {}): void {
  const h = ws.addRow(header);
  h.font = { bold: true };
  for (const r of rows) {
    const row = ws.addRow(r);
    for (const [col, fmt] of Object.entries(formats)) {
      const cell = row.getCell(Number(col));
      if (typeof cell.value === 'number') cell.numFmt = fmt;
    }
  }
  header.forEach((name, i) => {
    ws.getColumn(i + 1).width = Math.min(60, Math.max(10, name.length + 2));
  });
}

export async function writeTakeOffXlsx(t: TakeOff, meta: ScheduleMeta): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Furrow';
  wb.title = `Trench take-off — ${meta.project}`;
  const when = new Date(meta.date);
  if (!Number.isNaN(when.getTime())) {
    wb.created = when;
    wb.modified = when;
  }
  const L = t.labels;

  const sum = wb.addWorksheet('Summary');
  noticeBlock(sum);
  table(sum, ['Item', 'Value', 'Unit'], [
    ['Project', meta.project, ''],
    ['Site', meta.site, ''],
    ['Date', meta.date, ''],
    ['Units', t.units === 'm' ? 'metric' : 'US customary', ''],
    ['Trench length', t.totals.trenchLength, L.length],
    ['  in soft ground', t.totals.lengthSoft, L.length],
    ['  under pavement', t.totals.lengthPavement, L.length],
    ['Excavation (bank)', t.totals.excavation, L.volume],
    ['Bedding', t.totals.bedding, L.volume],
    ['Backfill', t.totals.backfill, L.volume],
    ['Spoil to haul (loose)', t.totals.haul, L.volume],
    ['Pavement saw-cut', t.totals.sawCut, L.length],
    ['Pavement restoration', t.totals.restoration, L.area],
    ['Crossings', t.totals.crossings, 'ea'],
    ['Pull boxes', t.totals.pullBoxes, 'ea'],
    [`Total cost (${t.currency}, placeholder prices unless replaced)`, t.totals.cost, t.currency],
  ], { 2: QTY });
  sum.getColumn(1).width = 52;
  sum.getColumn(2).width = 22;
  if (t.warnings.length) {
    sum.addRow([]);
    sum.addRow(['Warnings']).font = { bold: true };
    for (const w of t.warnings) sum.addRow([w]);
  }

  const items = wb.addWorksheet('Line items');
  noticeBlock(items);
  table(items, lineItemHeader(t), lineItemRows(t), { 5: QTY, 7: MONEY, 8: MONEY });
  items.getColumn(3).width = 60;

  const segs = wb.addWorksheet('Segments');
  noticeBlock(segs);
  table(segs, [
    'Segment', 'From node', 'To node', 'Stub', 'Surface', `Length (${L.length})`, `Soft (${L.length})`, `Pavement (${L.length})`,
    'Carries (utility conduits)', `Width (${L.length})`, `Depth (${L.length})`, 'Depth set by', 'Protective system',
    `Excavation (${L.volume})`, `Bedding (${L.volume})`, `Backfill (${L.volume})`, `Haul, loose (${L.volume})`,
    `Saw-cut (${L.length})`, `Restoration (${L.area})`, 'Crossings', 'Crossed',
  ], t.segments.map((s) => [
    s.segmentId, s.from, s.to, s.stub ? 'yes' : 'no', s.surface, s.length, s.lengthSoft, s.lengthPavement, s.carriesText,
    s.width, s.depth, s.governing, s.protection, s.excavation, s.bedding, s.backfill, s.haul, s.sawCut, s.restoration,
    s.crossings, s.crossingsText,
  ]), Object.fromEntries([6, 7, 8, 10, 11, 14, 15, 16, 17, 18, 19].map((c) => [c, QTY])));

  const utils = wb.addWorksheet('Utilities');
  noticeBlock(utils);
  table(utils, [
    'Utility', 'Label', 'APWA colour', 'Kind', 'Size (in OD)', 'Services', `Trench carrying it (${L.length})`,
    `Conduit / pipe incl. stub-ups (${L.length})`, 'Elbows 90°', 'Elbows 45°', 'Elbows 22.5°', 'Tees', 'Pull boxes',
    `Tracer wire (${L.length})`, `Warning tape (${L.length})`,
  ], t.utilities.map((u) => [
    u.utility, u.label, u.color, u.kind, u.sizeIn, u.services, u.trenchLength, u.conduitLength, u.elbows90, u.elbows45,
    u.elbows22, u.tees, u.pullBoxes, u.tracer, u.tape,
  ]), { 7: QTY, 8: QTY, 14: QTY, 15: QTY });

  const boxes = wb.addWorksheet('Pull boxes');
  noticeBlock(boxes);
  const f = t.frame;
  table(boxes, ['Box', 'x (drawing units)', 'y (drawing units)', 'Node', 'Segment', 'Utilities', 'Reason'],
    t.pullBoxes.map((b, i) => [i + 1, b.x / f.scale + f.originX, b.y / f.scale + f.originY, b.nodeId, b.segmentId, b.utilities.join(', '), b.reason]),
    { 2: QTY, 3: QTY });
  boxes.getColumn(7).width = 60;

  const buf = await wb.xlsx.writeBuffer();
  return pinZipTimes(new Uint8Array(buf as ArrayBuffer), meta.date);
}
