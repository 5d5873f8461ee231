// Ctrl-C latency of `furrow route`: the demo site with a 60 s solver budget and a 0.25 m grid (a
// run of most of a minute), interrupted 0.5 s, 1 s and 2 s into the route stage. From SIGINT to
// process exit must take under 2 s each time (bound: the router polls the shared abort flag
// between and inside its searches; 2 s is what a user still reads as "stopped at once"), with
// exit 130 and no output written. A second Ctrl-C stops at once (under 1 s).
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const BIN = join(ROOT, 'core', 'cli', 'furrow.mjs');
const DEMO = join(ROOT, 'assets', 'demo');
const TMP = join(ROOT, 'tests', '.tmp', `hardening-cancel-${process.pid}`);
mkdirSync(TMP, { recursive: true });
afterAll(() => rmSync(TMP, { recursive: true, force: true }));

const settings = join(TMP, 'slow.json');
writeFileSync(settings, JSON.stringify({ route: { timeBudgetMs: 60_000, cellM: 0.25 } }));

interface Cancel { code: number | null; latencyMs: number; stderr: string; out: string }

/** Starts a slow route, sends SIGINT `delayMs` after the route stage starts (twice when `twice`), times the exit. */
function cancelRun(delayMs: number, twice = false): Promise<Cancel> {
  const out = join(TMP, `out-${delayMs}-${twice ? 2 : 1}`);
  const child = spawn(process.execPath, [BIN, 'route', join(DEMO, 'site.dxf'), '--services', join(DEMO, 'services.csv'), '--roles', join(DEMO, 'roles.json'), '--settings', settings, '--out', out],
    { cwd: ROOT, env: { ...process.env, FURROW_PROGRESS: 'lines' } });
  let stderr = '';
  let sentAt = 0;
  let timer: NodeJS.Timeout | undefined;
  child.stderr.on('data', (d) => {
    stderr += String(d);
    if (!timer && /furrow route: route\n/.test(stderr)) {
      timer = setTimeout(() => {
        sentAt = performance.now();
        child.kill('SIGINT');
        if (twice) setTimeout(() => { sentAt = performance.now(); child.kill('SIGINT'); }, 50);
      }, delayMs);
    }
  });
  return new Promise((resolve) => child.on('exit', (code) => resolve({ code, latencyMs: sentAt ? performance.now() - sentAt : NaN, stderr, out })));
}

describe('furrow route: Ctrl-C latency', () => {
  const figures: Record<string, number> = {};
  afterAll(() => console.log(JSON.stringify({ cancelLatencyMs: figures })));

  for (const delay of [500, 1000, 2000]) {
    it(`interrupted ${delay} ms into routing: exit 130 within 2 s, nothing written`, async () => {
      const r = await cancelRun(delay);
      figures[`at${delay}ms`] = Math.round(r.latencyMs);
      expect(r.stderr).toMatch(/furrow route: route\n/);
      expect(r.stderr).not.toMatch(/furrow route: takeoff/);
      expect(r.code).toBe(130);
      expect(r.latencyMs).toBeLessThan(2000);
      expect(existsSync(join(r.out, 'summary.json'))).toBe(false);
    }, 60_000);
  }

  it('a second Ctrl-C stops at once (under 1 s after it)', async () => {
    const r = await cancelRun(500, true);
    figures.secondCtrlC = Math.round(r.latencyMs);
    expect(r.code).toBe(130);
    expect(r.latencyMs).toBeLessThan(1000);
  }, 60_000);
});
