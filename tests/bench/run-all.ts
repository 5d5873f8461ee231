// `npm run bench`: runs every benchmark in turn, each printing its own JSON lines (with its peer).
// Pass names to run a subset: npm run bench -- steiner-suite site-route
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const BENCHES = ['steiner-suite', 'site-route', 'dxf-read', 'dxf-write', 'takeoff', 'render'];
const chosen = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const unknown = chosen.filter((c) => !BENCHES.includes(c));
if (unknown.length) {
  console.error(`unknown benchmark(s): ${unknown.join(', ')}; known: ${BENCHES.join(', ')}`);
  process.exit(2);
}
let failed = 0;
for (const name of chosen.length ? chosen : BENCHES) {
  const file = fileURLToPath(new URL(`./${name}.ts`, import.meta.url));
  console.error(`== ${name}`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', file], { stdio: 'inherit' });
  if (r.status !== 0) {
    failed++;
    console.error(`${name} exited with ${r.status}`);
  }
}
process.exit(failed ? 1 : 0);
