import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const run = promisify(execFile);
const repo = fileURLToPath(new URL('../..', import.meta.url));
const bin = join(repo, 'core/cli/furrow.mjs');

describe('furrow route refuses a grid too big for memory', () => {
  it('exits 2 naming the memory it would need and a coarser cell instead of running out of memory', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-limit-'));
    const settings = join(dir, 'settings.json');
    // 5 cm cells on the ~300 × 200 m demo: ~24 M cells × 8 directions, far over the 2 GB default limit.
    writeFileSync(settings, JSON.stringify({ route: { cellM: 0.05 } }));
    const out = join(dir, 'out');
    const p = run(process.execPath, [bin, 'route', join(repo, 'assets/demo/site.dxf'), '--services', join(repo, 'assets/demo/services.csv'),
      '--roles', join(repo, 'assets/demo/roles.json'), '--settings', settings, '--out', out]);
    const e = await p.then(() => null, (x: { code: number; stderr: string }) => x);
    expect(e?.code).toBe(2);
    expect(e?.stderr).toMatch(/GB of memory/);
    expect(e?.stderr).toMatch(/coarser grid cell: route\.cellM [\d.]+ m/);
    expect(existsSync(join(out, 'summary.json'))).toBe(false);
  });
});
