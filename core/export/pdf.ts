// PDF report (pdfkit; its browser build is picked by bundlers through the package's exports, so
// this runs in Node and in the web app): the notice, a vector plan of the trench network with
// each utility drawn in its APWA colour, the summary, the line items and the per-utility table.
// Every page carries the notice title in its footer; page 1 carries the whole notice.

import PDFDocument from 'pdfkit';
import * as pdfkitModule from 'pdfkit';
import Helvetica from 'pdfkit/standard-fonts/Helvetica';
import HelveticaBold from 'pdfkit/standard-fonts/HelveticaBold';
import type { TakeOff } from '../takeoff/takeoff';
import type { TrenchNetwork } from '../network/trenchNetwork';
import type { Polygon, Site } from '../site/site';
import { NOTICE_LINES, NOTICE_TITLE } from '../notice';
import type { ScheduleMeta } from './scheduleTable';

// pdfkit's browser build needs the standard-font metrics registered; its Node build loads them
// itself and has no registerStdFonts export.
const registerStdFonts = (pdfkitModule as unknown as { registerStdFonts?: (...fonts: unknown[]) => void }).registerStdFonts;
if (typeof registerStdFonts === 'function') registerStdFonts(Helvetica, HelveticaBold);

const PAGE = { w: 612, h: 792, margin: 40 }; // US Letter, points
const FOOT = 30;

/** The standard PDF fonts use WinAnsi: map the few characters outside it. */
export function pdfText(s: string): string {
  return s.replace(/−/g, '-').replace(/≥/g, '>=').replace(/≤/g, '<=').replace(/·/g, '.').replace(/[^\x20-\x7E\u00A0-\u00FF\u2013\u2014\u2018\u2019\u201C\u201D\u2022\u2026]/g, '?');
}

const fmt = (v: number, d = 2): string => v.toLocaleString('en-US', { minimumFractionDigits: d, maximumFractionDigits: d });

export interface ReportOptions {
  /** Draw buildings, pavement and keep-outs under the network (same local frame as the network). */
  site?: Pick<Site, 'buildings' | 'pavements' | 'keepOuts'>;
}

export async function writeReportPdf(t: TakeOff, net: TrenchNetwork, meta: ScheduleMeta, options: ReportOptions = {}): Promise<Uint8Array> {
  const when = new Date(meta.date);
  const fixed = Number.isNaN(when.getTime()) ? new Date(0) : when;
  const doc = new PDFDocument({
    size: [PAGE.w, PAGE.h],
    margins: { top: PAGE.margin, bottom: PAGE.margin + FOOT, left: PAGE.margin, right: PAGE.margin },
    bufferPages: true,
    compress: true,
    info: { Title: pdfText(`Trench take-off - ${meta.project}`), Author: 'Furrow', Creator: 'Furrow', Producer: 'Furrow', CreationDate: fixed, ModDate: fixed },
  });
  const chunks: Uint8Array[] = [];
  const done = new Promise<void>((resolve, reject) => {
    doc.on('data', (c: Uint8Array) => chunks.push(c));
    doc.on('end', () => resolve());
    doc.on('error', reject);
  });
  const left = PAGE.margin;
  const width = PAGE.w - 2 * PAGE.margin;

  // --- title and notice --------------------------------------------------------------------
  doc.font('Helvetica-Bold').fontSize(16).fillColor('black').text(pdfText(`Trench take-off - ${meta.project}`), left, PAGE.margin);
  doc.font('Helvetica').fontSize(9).text(pdfText(`${meta.site}   |   ${meta.date}   |   units: ${t.units === 'm' ? 'metric (m, m², m³)' : 'US customary (ft, yd², yd³)'}`));
  doc.moveDown(0.5);
  const noticeTop = doc.y;
  doc.font('Helvetica-Bold').fontSize(9).fillColor('#B00020').text(pdfText(NOTICE_TITLE), left + 6, noticeTop + 5, { width: width - 12 });
  doc.font('Helvetica').fontSize(8).fillColor('black');
  for (const line of NOTICE_LINES) doc.text(pdfText(`- ${line}`), left + 6, doc.y, { width: width - 12 });
  const noticeBottom = doc.y + 4;
  doc.lineWidth(1).strokeColor('#B00020').rect(left, noticeTop, width, noticeBottom - noticeTop).stroke();

  // --- plan --------------------------------------------------------------------------------
  const planTop = noticeBottom + 10;
  const planH = 300;
  drawPlan(doc, t, net, options.site, left, planTop, width, planH);
  doc.y = planTop + planH + 8;
  doc.x = left;

  // --- summary -----------------------------------------------------------------------------
  const L = t.labels;
  heading(doc, 'Summary');
  const summary: [string, string][] = [
    ['Trench length', `${fmt(t.totals.trenchLength)} ${L.length}  (soft ${fmt(t.totals.lengthSoft)}, under pavement ${fmt(t.totals.lengthPavement)})`],
    ['Excavation (bank) / bedding / backfill', `${fmt(t.totals.excavation)} / ${fmt(t.totals.bedding)} / ${fmt(t.totals.backfill)} ${L.volume}`],
    ['Spoil to haul (loose)', `${fmt(t.totals.haul)} ${L.volume}`],
    ['Saw-cut / pavement restoration', `${fmt(t.totals.sawCut)} ${L.length} / ${fmt(t.totals.restoration)} ${L.area}`],
    ['Crossings / pull boxes', `${t.totals.crossings} / ${t.totals.pullBoxes}`],
    ['Total cost', `${fmt(t.totals.cost)} ${t.currency} (unit prices are PLACEHOLDERS unless replaced)`],
  ];
  doc.fontSize(9);
  for (const [k, v] of summary) row(doc, [k, v], [200, width - 200], ['left', 'left']);

  // --- line items ----------------------------------------------------------------------------
  doc.moveDown(0.6);
  heading(doc, 'Line items');
  const cols = [70, 210, 70, 40, 60, 70];
  const align: ('left' | 'right')[] = ['left', 'left', 'right', 'left', 'right', 'right'];
  doc.font('Helvetica-Bold').fontSize(8);
  row(doc, ['Group', 'Description', 'Quantity', 'Unit', `Price (${t.currency})`, `Cost (${t.currency})`], cols, align);
  doc.font('Helvetica').fontSize(8);
  for (const l of t.lines) {
    row(doc, [l.group, l.description, fmt(l.quantity, 3), l.unit, fmt(l.unitPrice), fmt(l.cost)], cols, align);
  }
  doc.font('Helvetica-Bold');
  row(doc, ['Total', '', '', '', '', fmt(t.totals.cost)], cols, align);

  // --- per utility -----------------------------------------------------------------------------
  doc.moveDown(0.6);
  heading(doc, 'Per utility');
  const ucols = [90, 45, 70, 70, 60, 40, 45, 50];
  const ualign: ('left' | 'right')[] = ['left', 'right', 'right', 'right', 'right', 'right', 'right', 'right'];
  doc.font('Helvetica-Bold').fontSize(8);
  row(doc, ['Utility', 'Services', `Trench (${L.length})`, `Conduit (${L.length})`, 'Elbows 90/45/22.5', 'Tees', 'Pull boxes', `Tracer (${L.length})`], ucols, ualign);
  doc.font('Helvetica');
  for (const u of t.utilities) {
    row(doc, [u.label, String(u.services), fmt(u.trenchLength), fmt(u.conduitLength), `${u.elbows90}/${u.elbows45}/${u.elbows22}`, String(u.tees), String(u.pullBoxes), fmt(u.tracer)], ucols, ualign);
  }
  doc.moveDown(0.6);
  heading(doc, 'Per segment');
  const scols = [28, 50, 50, 150, 46, 46, 60, 60, 42];
  const salign: ('left' | 'right')[] = ['right', 'right', 'left', 'left', 'right', 'right', 'left', 'right', 'right'];
  doc.font('Helvetica-Bold').fontSize(7.5);
  row(doc, ['#', `Length (${L.length})`, 'Surface', 'Carries (conduits)', `Width (${L.length})`, `Depth (${L.length})`, 'Protection', `Excav. (${L.volume})`, 'Crossings'], scols, salign);
  doc.font('Helvetica');
  for (const sg of t.segments) {
    row(doc, [String(sg.segmentId), fmt(sg.length), sg.surface, sg.carriesText, fmt(sg.width), fmt(sg.depth), sg.protection, fmt(sg.excavation), String(sg.crossings)], scols, salign);
  }
  if (t.pullBoxes.length) {
    doc.moveDown(0.6);
    heading(doc, 'Pull boxes (numbered on the plan)');
    const bcols = [30, 90, 90, 90, 232];
    const balign: ('left' | 'right')[] = ['right', 'right', 'right', 'left', 'left'];
    doc.font('Helvetica-Bold').fontSize(8);
    row(doc, ['#', 'x (drawing)', 'y (drawing)', 'Utilities', 'Reason'], bcols, balign);
    doc.font('Helvetica');
    const f = t.frame;
    t.pullBoxes.forEach((b, i) => {
      row(doc, [String(i + 1), fmt(b.x / f.scale + f.originX, 2), fmt(b.y / f.scale + f.originY, 2), b.utilities.join(', '), b.reason], bcols, balign);
    });
  }
  if (t.warnings.length) {
    doc.moveDown(0.6);
    heading(doc, 'Warnings');
    doc.font('Helvetica').fontSize(8);
    for (const w of t.warnings) doc.text(pdfText(`- ${w}`), left, doc.y, { width });
  }

  // --- footer on every page ----------------------------------------------------------------------
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const keep = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('Helvetica-Bold').fontSize(7).fillColor('#B00020')
      .text(pdfText(`${NOTICE_TITLE} - see page 1`), left, PAGE.h - PAGE.margin - 10, { width: width - 60, lineBreak: false });
    doc.font('Helvetica').fillColor('black').text(`page ${i + 1} of ${range.count}`, left + width - 60, PAGE.h - PAGE.margin - 10, { width: 60, align: 'right', lineBreak: false });
    doc.page.margins.bottom = keep;
  }
  doc.end();
  await done;
  let n = 0;
  for (const c of chunks) n += c.length;
  const out = new Uint8Array(n);
  let o = 0;
  for (const c of chunks) {
    out.set(c, o);
    o += c.length;
  }
  return out;
}

function heading(doc: PDFKit.PDFDocument, s: string): void {
  ensureRoom(doc, 40);
  doc.font('Helvetica-Bold').fontSize(11).fillColor('black').text(s, PAGE.margin, doc.y);
  doc.moveDown(0.2);
}

function ensureRoom(doc: PDFKit.PDFDocument, h: number): void {
  if (doc.y + h > PAGE.h - PAGE.margin - FOOT) doc.addPage();
}

/** One table row: cells in fixed-width columns, the row as tall as its tallest cell. */
function row(doc: PDFKit.PDFDocument, cells: string[], widths: number[], align: ('left' | 'right')[]): void {
  const heights = cells.map((c, i) => doc.heightOfString(pdfText(c), { width: widths[i] - 4 }));
  const h = Math.max(...heights) + 2;
  ensureRoom(doc, h);
  const y = doc.y;
  let x = PAGE.margin;
  cells.forEach((c, i) => {
    doc.text(pdfText(c), x, y, { width: widths[i] - 4, align: align[i] });
    x += widths[i];
  });
  doc.x = PAGE.margin;
  doc.y = y + h;
}

/** The network as vector lines: a grey trench band, one thin offset line per utility carried. */
function drawPlan(doc: PDFKit.PDFDocument, t: TakeOff, net: TrenchNetwork, site: ReportOptions['site'], x0: number, y0: number, w: number, h: number): void {
  doc.lineWidth(0.5).strokeColor('#888888').rect(x0, y0, w, h).stroke();
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const s of net.segments) {
    for (let i = 0; i < s.points.length; i += 2) {
      minX = Math.min(minX, s.points[i]); maxX = Math.max(maxX, s.points[i]);
      minY = Math.min(minY, s.points[i + 1]); maxY = Math.max(maxY, s.points[i + 1]);
    }
  }
  const context: { poly: Polygon; fill: string; stroke: string }[] = [
    ...(site?.pavements ?? []).map((poly) => ({ poly, fill: '#EFEFEF', stroke: '#B0B0B0' })),
    ...(site?.keepOuts ?? []).map((poly) => ({ poly, fill: '#E3F1E3', stroke: '#7FAF7F' })),
    ...(site?.buildings ?? []).map((poly) => ({ poly, fill: '#D9D9D9', stroke: '#606060' })),
  ];
  for (const c of context) {
    const r = c.poly.outer;
    for (let i = 0; i < r.length; i += 2) {
      minX = Math.min(minX, r[i]); maxX = Math.max(maxX, r[i]);
      minY = Math.min(minY, r[i + 1]); maxY = Math.max(maxY, r[i + 1]);
    }
  }
  const legendH = 16;
  if (!Number.isFinite(minX)) {
    doc.font('Helvetica').fontSize(9).fillColor('black').text('No trench was routed.', x0 + 10, y0 + 10);
    return;
  }
  const pad = 14;
  const scale = Math.min((w - 2 * pad) / Math.max(maxX - minX, 1e-9), (h - 2 * pad - legendH) / Math.max(maxY - minY, 1e-9));
  const ox = x0 + pad + ((w - 2 * pad) - (maxX - minX) * scale) / 2;
  const oy = y0 + pad + ((h - 2 * pad - legendH) - (maxY - minY) * scale) / 2;
  const px = (x: number): number => ox + (x - minX) * scale;
  const py = (y: number): number => oy + (maxY - y) * scale;
  const colour = new Map(t.utilities.map((u) => [u.utility, u.color]));
  doc.save();
  doc.rect(x0, y0, w, h).clip();
  for (const c of context) {
    for (const ring of [c.poly.outer, ...c.poly.holes]) {
      for (let i = 0; i < ring.length; i += 2) {
        if (i === 0) doc.moveTo(px(ring[i]), py(ring[i + 1]));
        else doc.lineTo(px(ring[i]), py(ring[i + 1]));
      }
      doc.closePath();
    }
    doc.lineWidth(0.4).fillAndStroke(c.fill, c.stroke, 'even-odd');
  }
  doc.restore();
  doc.lineCap('round').lineJoin('round');
  for (const s of net.segments) {
    polyline(doc, s.points, px, py, 0);
    doc.lineWidth(5).strokeColor('#C8C8C8').stroke();
  }
  net.segments.forEach((s, si) => {
    const loads = t.contents[si]?.loads ?? [];
    loads.forEach((l, k) => {
      polyline(doc, s.points, px, py, (k - (loads.length - 1) / 2) * 1.3);
      doc.lineWidth(1).strokeColor(colour.get(l.utility) ?? '#000000').stroke();
    });
  });
  for (const n of net.nodes) {
    if (n.kind === 'connection') {
      doc.polygon([px(n.x), py(n.y) - 5], [px(n.x) - 4.5, py(n.y) + 3.5], [px(n.x) + 4.5, py(n.y) + 3.5]).fillColor('black').fill();
    } else if (n.kind === 'service') {
      doc.lineWidth(0.8).circle(px(n.x), py(n.y), 2.5).fillAndStroke('white', 'black');
    }
  }
  t.pullBoxes.forEach((b, i) => {
    doc.lineWidth(0.8).rect(px(b.x) - 3, py(b.y) - 3, 6, 6).fillAndStroke('white', '#202020');
    doc.font('Helvetica').fontSize(5.5).fillColor('#202020').text(String(i + 1), px(b.x) + 4, py(b.y) - 9, { lineBreak: false });
  });
  // Legend and scale bar along the bottom of the frame.
  let lx = x0 + 8;
  const ly = y0 + h - 10;
  doc.font('Helvetica').fontSize(7);
  for (const u of t.utilities) {
    doc.moveTo(lx, ly).lineTo(lx + 14, ly).lineWidth(2).strokeColor('#C8C8C8').stroke();
    doc.moveTo(lx, ly).lineTo(lx + 14, ly).lineWidth(1).strokeColor(u.color).stroke();
    doc.fillColor('black').text(pdfText(u.label), lx + 17, ly - 3, { lineBreak: false });
    lx += 22 + doc.widthOfString(pdfText(u.label)) + 8;
  }
  doc.lineWidth(0.8).rect(lx, ly - 3, 6, 6).fillAndStroke('white', '#202020');
  doc.fillColor('black').text('pull box', lx + 9, ly - 3, { lineBreak: false });
  lx += 50;
  doc.polygon([lx + 3, ly - 4], [lx, ly + 3], [lx + 6, ly + 3]).fillColor('black').fill();
  doc.text('connection', lx + 9, ly - 3, { lineBreak: false });
  const unitsPerPt = 1 / scale;
  const target = 80 * unitsPerPt;
  const pow = 10 ** Math.floor(Math.log10(target));
  const nice = [1, 2, 5, 10].map((m) => m * pow).filter((v) => v <= target).pop() ?? pow;
  const barW = nice * scale;
  const bx = x0 + w - 10 - barW;
  doc.moveTo(bx, ly).lineTo(bx + barW, ly).lineWidth(1.5).strokeColor('black').stroke();
  doc.fillColor('black').text(`${nice} ${net.units}`, bx, ly - 10, { width: barW, align: 'center', lineBreak: false });
}

/** Move along a polyline, offset sideways by `off` points (per piece; joints are small). */
function polyline(doc: PDFKit.PDFDocument, p: Float64Array, px: (x: number) => number, py: (y: number) => number, off: number): void {
  const n = p.length / 2;
  for (let i = 0; i + 1 < n; i++) {
    const ax = px(p[2 * i]), ay = py(p[2 * i + 1]);
    const bx = px(p[2 * i + 2]), by = py(p[2 * i + 3]);
    const len = Math.hypot(bx - ax, by - ay) || 1;
    const nx = (-(by - ay) / len) * off, ny = ((bx - ax) / len) * off;
    if (i === 0) doc.moveTo(ax + nx, ay + ny);
    else doc.lineTo(ax + nx, ay + ny);
    doc.lineTo(bx + nx, by + ny);
  }
}
