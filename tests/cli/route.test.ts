// `furrow route` as a user runs it: the demo site end to end, exit codes 0 / 2 / 3 / 130, the
// notice on the output, and the files named in summary.json on disk.
import { execFile, spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { NOTICE_LINES, NOTICE_TITLE } from '../../core/notice';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const BIN = join(ROOT, 'core', 'cli', 'furrow.mjs');
const DEMO = join(ROOT, 'assets', 'demo');
const FIX = join(ROOT, 'tests', 'fixtures', 'dxf', 'files');
const TMP = join(ROOT, 'tests', '.tmp', `cli-route-${process.pid}`);

interface Run { code: number | null; stdout: string; stderr: string; ms: number }

function furrow(args: string[], onSpawn?: (kill: (s: NodeJS.Signals) => void) => void): Promise<Run> {
  return new Promise((resolve) => {
    const t0 = Date.now();
    const child = execFile(process.execPath, [BIN, 'route', ...args], { cwd: ROOT, maxBuffer: 1 << 24 }, (e, stdout, stderr) => {
      resolve({ code: e ? (typeof e.code === 'number' ? e.code : null) : 0, stdout, stderr, ms: Date.now() - t0 });
    });
    onSpawn?.((s) => child.kill(s));
  });
}

const demoArgs = (out: string, extra: string[] = []): string[] => [
  join(DEMO, 'site.dxf'), '--services', join(DEMO, 'services.csv'), '--roles', join(DEMO, 'roles.json'), '--out', out, ...extra,
];

beforeAll(() => {
  rmSync(TMP, { recursive: true, force: true });
  mkdirSync(TMP, { recursive: true });
});

describe('furrow route on the demo site', () => {
  let run: Run;
  const out = join(TMP, 'demo');
  beforeAll(async () => { run = await furrow(demoArgs(out, ['--json'])); });

  it('exits 0 and prints summary.json on stdout with --json', () => {
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const printed = JSON.parse(run.stdout);
    expect(printed).toEqual(JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')));
    expect(printed.services).toMatchObject({ total: 12, connected: 12 });
    expect(printed.notice).toEqual([NOTICE_TITLE, ...NOTICE_LINES]);
  });

  it('writes every file summary.json names, relative to the output folder', () => {
    const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(Object.keys(s.files).sort()).toEqual(['reportPdf', 'routedDxf', 'takeoffCsv', 'takeoffXlsx', 'trenchDxf']);
    for (const rel of Object.values<string>(s.files)) {
      expect(rel).not.toMatch(/^\//);
      expect(statSync(join(out, rel)).size).toBeGreaterThan(100);
    }
    // file signatures: PDF header (ISO 32000), XLSX is a ZIP (PK\x03\x04), DXF ends with 0/EOF
    expect(readFileSync(join(out, s.files.reportPdf)).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(readFileSync(join(out, s.files.takeoffXlsx)).subarray(0, 4).toString('latin1')).toBe('PK\x03\x04');
    expect(readFileSync(join(out, s.files.routedDxf), 'latin1').trimEnd()).toMatch(/\n\s*0\r?\nEOF$/);
  });

  it('prints the summary and the notice without --json', async () => {
    const r = await furrow(demoArgs(join(TMP, 'demo-text')));
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Routed 12 of 12 services/);
    for (const line of [NOTICE_TITLE, ...NOTICE_LINES]) expect(r.stdout).toContain(line);
  });
});

describe('furrow route without a roles file', () => {
  it('suggests the layer roles and prints the suggestion (DESIGN.md contract)', async () => {
    const out = join(TMP, 'suggested');
    const r = await furrow([join(DEMO, 'site.dxf'), '--services', join(DEMO, 'services.csv'), '--out', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Layer roles were suggested \(no --roles file\): .*BLDG-OUTLINE=building/);
    const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(s.rolesSuggested).toBe(true);
    expect(s.roles['BLDG-OUTLINE']).toBe('building');
  });
});

describe('furrow route refuses bad input with exit 2 and a message naming the file', () => {
  const cases: [string, string[], RegExp][] = [
    ['a binary drawing', [join(FIX, 'binary.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /binary\.dxf: this is a binary DXF/],
    ['a truncated drawing', [join(FIX, 'truncated.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /truncated\.dxf: .*truncated/],
    ['a unitless drawing without --units', [join(FIX, 'unitless.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /unitless\.dxf: .*--units m or --units ft/],
    ['an empty drawing', [join(FIX, 'empty.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /empty\.dxf: the file is empty/],
    ['a file that is not DXF', [join(FIX, 'garbage.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /garbage\.dxf: .*not an ASCII DXF/],
    ['recursive blocks', [join(FIX, 'cyclic_blocks.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /cyclic_blocks\.dxf: .*recursive/],
    ['blocks nested too deep', [join(FIX, 'deep_blocks.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /deep_blocks\.dxf: .*nest deeper/],
    ['a drawing only in paper space', [join(FIX, 'paper_only.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /paper_only\.dxf: .*export the model space/],
    ['open building outlines', [join(FIX, 'open_only.dxf'), '--services', join(DEMO, 'services.csv'), '--out', join(TMP, 'x')], /open_only\.dxf: no closed shapes on the building layer.*BLDG.*Close the outlines/],
    ['a missing services file', [join(DEMO, 'site.dxf'), '--services', join(TMP, 'nope.csv'), '--out', join(TMP, 'x')], /nope\.csv: no such file/],
    ['no --out', [join(DEMO, 'site.dxf'), '--services', join(DEMO, 'services.csv')], /--out <dir> is required/],
    ['a bad --units', [join(DEMO, 'site.dxf'), '--services', join(DEMO, 'services.csv'), '--units', 'yd', '--out', join(TMP, 'x')], /--units takes m or ft, not 'yd'/],
  ];
  it.each(cases)('%s', async (_what, args, msg) => {
    const r = await furrow(args);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(msg);
    expect(existsSync(join(TMP, 'x', 'summary.json'))).toBe(false);
  });

  it('a settings file with an out-of-range value names the key', async () => {
    const p = join(TMP, 'bad-settings.json');
    writeFileSync(p, JSON.stringify({ route: { cellM: -1 } }));
    const r = await furrow(demoArgs(join(TMP, 'x'), ['--settings', p]));
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('bad-settings.json: route.cellM: -1 is out of range: must be more than 0 and at most 10 m');
  });
});

describe('furrow route done in part', () => {
  it('exits 3 and lists the point it could not reach', async () => {
    // the demo services plus one point in open country beyond the property line
    const csv = readFileSync(join(DEMO, 'services.csv'), 'utf8').trimEnd() + '\nFAR1,513500.0,4181500.0,service,power\n';
    const p = join(TMP, 'services-far.csv');
    writeFileSync(p, csv);
    const out = join(TMP, 'partial');
    const r = await furrow([join(DEMO, 'site.dxf'), '--services', p, '--roles', join(DEMO, 'roles.json'), '--out', out]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/done in part; not connected: FAR1 \(/);
    const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(s.status).toBe('partial');
    expect(s.services.total).toBe(13);
    expect(s.services.connected).toBe(12);
    expect(s.services.unreachable.map((u: { id: string }) => u.id)).toEqual(['FAR1']);
  });
});

describe('Ctrl-C', () => {
  it('cancels a long route cleanly with exit 130 and writes nothing', async () => {
    const settings = join(TMP, 'long.json');
    writeFileSync(settings, JSON.stringify({ route: { timeBudgetMs: 60000 } }));
    const out = join(TMP, 'cancelled');
    let sentAt = 0;
    // FURROW_PROGRESS=lines prints each stage as it starts: interrupt one second into routing
    const child = spawn(process.execPath, [BIN, 'route', ...demoArgs(out, ['--settings', settings])], { cwd: ROOT, env: { ...process.env, FURROW_PROGRESS: 'lines' } });
    let stderr = '';
    let timer: NodeJS.Timeout | undefined;
    child.stderr.on('data', (d) => {
      stderr += String(d);
      if (!timer && /furrow route: route\n/.test(stderr)) timer = setTimeout(() => { sentAt = Date.now(); child.kill('SIGINT'); }, 1000);
    });
    const code = await new Promise<number | null>((resolve) => child.on('exit', (c) => resolve(c)));
    expect(sentAt).toBeGreaterThan(0);
    expect(stderr).toMatch(/furrow route: read\nfurrow route: site\nfurrow route: place\nfurrow route: route\n/);
    expect(code).toBe(130);
    expect(stderr).toMatch(/cancelling \(Ctrl-C again to stop at once\)[\s\S]*cancelled by Ctrl-C; nothing was written/);
    // with a 60 s budget the route would run most of a minute; the cancel must be prompt
    expect(Date.now() - sentAt).toBeLessThan(5000);
    expect(stderr).not.toMatch(/furrow route: takeoff/);
    expect(existsSync(join(out, 'summary.json'))).toBe(false);
  });
});

describe('progress', () => {
  it('draws a bar with the stage names on stderr when it is a terminal', async () => {
    // util-linux `script` gives the command a pseudo-terminal; its output is the terminal's
    const out = join(TMP, 'tty');
    const cmd = [process.execPath, BIN, 'route', ...demoArgs(out, ['--json'])].map((a) => `'${a}'`).join(' ') + ' >/dev/null';
    const r = await new Promise<string>((resolve, reject) => execFile('script', ['-qec', cmd, '/dev/null'], { cwd: ROOT, maxBuffer: 1 << 24 }, (e, stdout) => (e ? reject(e) : resolve(stdout))));
    const frames = r.split('\r').map((f) => f.replace(/\x1b\[K/g, '').trim()).filter((f) => f.startsWith('['));
    for (const [i, st] of ['read', 'site', 'place', 'route', 'takeoff', 'write'].entries()) {
      expect(frames.some((f) => f.endsWith(`${st} (${i + 1}/6)`))).toBe(true);
    }
    const pct = frames.map((f) => Number(/\]\s+(\d+)%/.exec(f)![1]));
    expect(pct.every((p, i) => i === 0 || p >= pct[i - 1])).toBe(true);
  });
});
