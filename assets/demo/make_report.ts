// Routes the demo site through the same pipeline as `furrow route` and writes its schedules;
// renders the report's page 1 to assets/demo/report-page1.png (needs poppler's pdftoppm).
// Run: npx tsx assets/demo/make_report.ts [outDir]   (outDir default tests/.tmp/demo-report)
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { runPipeline } from '../../core/pipeline';

const here = path.dirname(fileURLToPath(import.meta.url));
const out = path.resolve(process.argv[2] ?? path.join(here, '../../tests/.tmp/demo-report'));
fs.mkdirSync(out, { recursive: true });
const text = (name: string): { name: string; text: string } => ({ name, text: fs.readFileSync(path.join(here, name), 'utf8') });

const r = await runPipeline({
  drawing: { name: 'site.dxf', bytes: new Uint8Array(fs.readFileSync(path.join(here, 'site.dxf'))) },
  services: text('services.csv'),
  roles: text('roles.json'),
  meta: { project: 'Brackenrise Business Park - shared utility trench', site: 'Brackenrise Business Park, Ostrey County (demo)', date: '2026-01-15' },
});
if (!r.ok) throw new Error(r.error.message);
const { files, summary } = r.value;
fs.writeFileSync(path.join(out, 'report.pdf'), files.reportPdf);
fs.writeFileSync(path.join(out, 'takeoff.xlsx'), files.takeoffXlsx);
fs.writeFileSync(path.join(out, 'takeoff.csv'), files.takeoffCsv);
const png = spawnSync('pdftoppm', ['-png', '-r', '72', '-f', '1', '-l', '1', '-singlefile', path.join(out, 'report.pdf'), path.join(here, 'report-page1')]);
process.stdout.write(JSON.stringify({ trench: summary.trench, cost: summary.cost, pullBoxes: summary.pullBoxes, runtimeMs: summary.runtimeMs, png: png.status === 0, warnings: summary.warnings }) + '\n');
