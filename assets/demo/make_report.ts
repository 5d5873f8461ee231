// Routes the demo site and writes its take-off report; renders page 1 to report-page1.png.
// Run: npx tsx assets/demo/make_report.ts [outDir]   (outDir default tests/.tmp/demo-report)
// Needs poppler's pdftoppm for the PNG. Uses the stages directly (read → site → place → route → take-off → write).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { readDxfBytes } from '../../core/dxf/readDxf';
import { buildSite } from '../../core/site/buildSite';
import { parsePointsCsv } from '../../core/site/pointsCsv';
import { parseRolesFile } from '../../core/site/rolesFile';
import { placeTerminals } from '../../core/site/placeTerminals';
import { routeSite } from '../../core/route/site/routeSite';
import { computeTakeOff } from '../../core/takeoff/takeoff';
import { writeReportPdf } from '../../core/export/pdf';
import { writeTakeOffXlsx } from '../../core/export/xlsx';
import { writeTakeOffCsv } from '../../core/export/csv';
import { defaultSettings } from '../../core/settings';
import { fromMetres } from '../../core/units';

const here = path.dirname(fileURLToPath(import.meta.url));
const out = path.resolve(process.argv[2] ?? path.join(here, '../../tests/.tmp/demo-report'));
fs.mkdirSync(out, { recursive: true });

function must<T>(r: { ok: true; value: T } | { ok: false; error: { message: string } }): T {
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

const settings = defaultSettings();
const drawing = must(readDxfBytes(new Uint8Array(fs.readFileSync(path.join(here, 'site.dxf')))));
const roles = must(parseRolesFile(fs.readFileSync(path.join(here, 'roles.json'), 'utf8'), 'roles.json', drawing.layers.map((l) => l.name))).roles;
const points = must(parsePointsCsv(fs.readFileSync(path.join(here, 'services.csv'), 'utf8'), settings.utilities.map((u) => u.key)));
const site = must(buildSite(drawing, { roles }));
const placed = placeTerminals(site, points, { snapTolerance: fromMetres(settings.route.snapToleranceM, site.units) });
const t0 = performance.now();
const net = routeSite(site, placed.terminals, settings.route);
const t1 = performance.now();
const takeOff = computeTakeOff(net, placed.terminals, settings);
const t2 = performance.now();
const meta = { project: 'Brackenrise Business Park - shared utility trench', site: 'Brackenrise Business Park, Ostrey County (demo)', date: '2026-01-15' };
fs.writeFileSync(path.join(out, 'report.pdf'), await writeReportPdf(takeOff, net, meta, { site }));
fs.writeFileSync(path.join(out, 'takeoff.xlsx'), await writeTakeOffXlsx(takeOff, meta));
fs.writeFileSync(path.join(out, 'takeoff.csv'), writeTakeOffCsv(takeOff));
const png = spawnSync('pdftoppm', ['-png', '-r', '72', '-f', '1', '-l', '1', '-singlefile', path.join(out, 'report.pdf'), path.join(here, 'report-page1')]);
process.stdout.write(JSON.stringify({
  services: placed.terminals.length, problems: placed.problems.length, segments: net.segments.length,
  unreachable: net.unreachable.length, trench: takeOff.totals.trenchLength, underPavement: takeOff.totals.lengthPavement,
  excavation: takeOff.totals.excavation, pullBoxes: takeOff.totals.pullBoxes, cost: takeOff.totals.cost,
  routeMs: Math.round(t1 - t0), takeoffMs: Math.round(t2 - t1), png: png.status === 0, warnings: takeOff.warnings,
}) + '\n');
