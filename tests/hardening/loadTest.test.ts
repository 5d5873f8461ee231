// Load test: 50 whole-pipeline runs back to back in one process (a child with --expose-gc) on a
// small generated site. After a full GC, the heap at run 50 may exceed the heap at run 10 by at
// most 8 MB, and the array buffers by at most 1 MB. Why these bounds: one run's router arrays
// alone are ~16 MB (a 20 000-node grid at ~800 bytes a node, core/limits.ts), so keeping any
// run's grid would break the array-buffer bound at once; keeping each run's drawing, network and
// exports (several hundred kB a run) would add well over 8 MB across the 40 runs. Warm-up (code
// compiled lazily, caches filled) happens before run 10.
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const child = fileURLToPath(new URL('./loadChild.ts', import.meta.url));
const root = fileURLToPath(new URL('../..', import.meta.url));

describe('memory under repeated runs', () => {
  it('50 pipeline runs back to back: heap growth from run 10 to run 50 under 8 MB, array buffers under 1 MB', () => {
    const out = execFileSync(process.execPath, ['--expose-gc', '--import', 'tsx', child, '50'], { cwd: root, encoding: 'utf8', timeout: 170_000 });
    const r = JSON.parse(out.trim().split('\n').pop()!);
    const growthMB = r.marks[50].heapUsedMB - r.marks[10].heapUsedMB;
    const abGrowthMB = r.marks[50].arrayBuffersMB - r.marks[10].arrayBuffersMB;
    console.log(JSON.stringify({ load: 'pipeline-x50', heapAt10MB: r.marks[10].heapUsedMB, heapAt50MB: r.marks[50].heapUsedMB, growthMB: +growthMB.toFixed(2), arrayBufferGrowthMB: +abGrowthMB.toFixed(2), wallMs: r.wallMs }));
    expect(r.runs).toBe(50);
    expect(r.trenchLengthM).toBeGreaterThan(0);
    expect(growthMB).toBeLessThan(8);
    expect(abGrowthMB).toBeLessThan(1);
  }, 180_000);
});
