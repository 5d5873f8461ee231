// Child process for loadTest.test.ts (needs --expose-gc): runs the whole pipeline RUNS times back
// to back on one small generated drawing and prints heap figures after a full GC at chosen runs.
import { runPipeline } from '../../core/pipeline';
import { dxfLines, pairsOf, type Pair } from '../fuzz/seedDrawings';

const RUNS = Number(process.argv[2] ?? 50);
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with --expose-gc');

/** 2 × 3 buildings of 12 m × 8 m on a 30 m pitch, a paved strip and a curb; metres. */
function drawing(): { dxf: string; services: string } {
  const ents: Pair[] = [];
  const rows = ['id,x,y,role,utilities', 'POC,2,2,connection,power;telecom'];
  for (let r = 0; r < 2; r++) {
    for (let c = 0; c < 3; c++) {
      const x = 10 + c * 30, y = 10 + r * 30;
      ents.push(...pairsOf.lw('BLDG', [x, y, x + 12, y, x + 12, y + 8, x, y + 8], true));
      rows.push(`S${r}${c},${x + 6},${y},service,power;telecom`);
    }
  }
  ents.push(...pairsOf.lw('PAVE', [0, 25, 100, 25, 100, 32, 0, 32], true));
  const dxf = dxfLines([
    [0, 'SECTION'], [2, 'HEADER'], [9, '$ACADVER'], [1, 'AC1015'], [9, '$INSUNITS'], [70, 6], [0, 'ENDSEC'],
    [0, 'SECTION'], [2, 'ENTITIES'], ...ents, [0, 'ENDSEC'], [0, 'EOF'],
  ]);
  return { dxf, services: rows.join('\n') + '\n' };
}

const { dxf, services } = drawing();
const bytes = new TextEncoder().encode(dxf);
const settings = JSON.stringify({ route: { timeBudgetMs: 150 } });
const marks: Record<number, { heapUsedMB: number; arrayBuffersMB: number; rssMB: number }> = {};
const mb = (b: number): number => Math.round((b / 1048576) * 100) / 100;
let lengthM = 0;
const t0 = performance.now();
for (let run = 1; run <= RUNS; run++) {
  const r = await runPipeline({
    drawing: { name: 'harrowmere.dxf', bytes }, services: { name: 'services.csv', text: services },
    roles: { name: 'roles.json', text: JSON.stringify({ BLDG: 'building', PAVE: 'pavement' }) },
    settings: { name: 'settings.json', text: settings },
    meta: { project: 'Load test', site: 'Harrowmere', date: '2026-12-02' },
  });
  if (!r.ok) throw new Error(r.error.message);
  if (run === 1) lengthM = r.value.summary.trench.length;
  else if (r.value.summary.trench.length <= 0) throw new Error(`run ${run}: no trench`);
  if (run === 1 || run === 10 || run === 30 || run === RUNS) {
    gc(); gc();
    const m = process.memoryUsage();
    marks[run] = { heapUsedMB: mb(m.heapUsed), arrayBuffersMB: mb(m.arrayBuffers), rssMB: mb(m.rss) };
  }
}
process.stdout.write(JSON.stringify({ runs: RUNS, trenchLengthM: lengthM, wallMs: Math.round(performance.now() - t0), marks }) + '\n');
