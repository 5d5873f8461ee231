// Steiner suite over the published PACE 2018 track 1 instances with known optima
// (../shared/steiner-bench beside the checkout; see its README).
//   npx tsx tests/bench/steiner-suite.ts [--filter REGEX] [--budget MS] [--no-nx]
//        [--nx-max-nodes N] [--nx-timeout-s S]
// Prints one JSON line per instance, then a table and a summary with the targets.
// Peers in the same run: our plain shortest-path heuristic (one root, MST + prune) and
// networkx's steiner_tree (Debian python3-networkx 2.8.8, metric-closure MST), the latter only
// on instances up to --nx-max-nodes with a timeout, as it builds the full metric closure.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { edgeCost } from '../../core/route/graph';
import { shortestPathHeuristic, SphWorkspace } from '../../core/route/sph';
import { parseStp } from '../../core/route/stp';
import { solveSteiner } from '../../core/route/steiner';
import { mstPrune, TreeScratch, treeVertices } from '../../core/route/tree';

const here = path.dirname(fileURLToPath(import.meta.url));
const repoRoot = path.resolve(here, '../..');
const benchDir = path.resolve(repoRoot, '../shared/steiner-bench');
const args = process.argv.slice(2);
const flag = (name: string) => args.includes(name);
const value = (name: string, dflt: string) => {
  const i = args.indexOf(name);
  return i >= 0 && i + 1 < args.length ? args[i + 1] : dflt;
};
const filter = new RegExp(value('--filter', '.'));
const budget = args.includes('--budget') ? Number(value('--budget', '0')) : undefined;
const runNx = !flag('--no-nx');
const nxMaxNodes = Number(value('--nx-max-nodes', '1400'));
const nxTimeoutS = Number(value('--nx-timeout-s', '15'));

if (!existsSync(path.join(benchDir, 'track1'))) {
  console.error(`steiner-suite: ${benchDir}/track1 not found; the suite needs the published instances there`);
  process.exit(2);
}
const optimum = new Map<string, number>();
for (const line of readFileSync(path.join(benchDir, 'track1-optimum.csv'), 'utf8').trim().split(/\r?\n/).slice(1)) {
  const [name, opt] = line.split(',');
  optimum.set(name, Number(opt));
}

interface Row {
  instance: string; n: number; m: number; t: number; opt: number;
  cost: number; lowerBound: number; gapPct: number; lbGapPct: number; ms: number;
  sphCost: number; sphGapPct: number; sphMs: number;
  nxCost: number | null; nxGapPct: number | null; nxMs: number | null; nxNote: string;
}
const rows: Row[] = [];
const files = readdirSync(path.join(benchDir, 'track1')).filter((f) => f.endsWith('.gr') && filter.test(f)).sort();
for (const f of files) {
  const file = path.join(benchDir, 'track1', f);
  const parsed = parseStp(readFileSync(file, 'utf8'));
  if (!parsed.ok) throw new Error(`${f}:${parsed.error.line}: ${parsed.error.message}`);
  const { graph: g, terminals } = parsed.value;
  const opt = optimum.get(f);
  if (opt === undefined) throw new Error(`no published optimum for ${f}`);
  let t0 = performance.now();
  const r = solveSteiner(g, terminals, budget !== undefined ? { timeBudgetMs: budget } : {});
  const ms = performance.now() - t0;
  // baseline: plain SPH from the first terminal, MST + prune
  t0 = performance.now();
  const isT = new Uint8Array(g.n);
  for (const t of terminals) isT[t] = 1;
  const scratch = new TreeScratch(g);
  const raw = shortestPathHeuristic(g, terminals, isT, terminals[0], new SphWorkspace(g.n));
  if (!raw) throw new Error(`${f}: disconnected`);
  const sphCost = edgeCost(g, mstPrune(g, treeVertices(g, raw, scratch), isT, scratch));
  const sphMs = performance.now() - t0;
  let nxCost: number | null = null;
  let nxMs: number | null = null;
  let nxNote = '';
  if (!runNx) nxNote = 'off';
  else if (g.n > nxMaxNodes) nxNote = `n>${nxMaxNodes}`;
  else {
    const p = spawnSync('/usr/bin/python3', [path.join(here, 'steiner_networkx_peer.py'), file], { encoding: 'utf8', timeout: nxTimeoutS * 1000 });
    if (p.status === 0) {
      const j = JSON.parse(p.stdout.trim().split('\n').pop()!);
      if (!j.spans) throw new Error(`${f}: networkx tree does not span the terminals`);
      nxCost = j.cost;
      nxMs = j.ms;
    } else nxNote = p.error ? `timeout ${nxTimeoutS}s` : `failed: ${p.stderr.trim().split('\n').pop()}`;
  }
  const row: Row = {
    instance: f, n: g.n, m: g.m, t: terminals.length, opt,
    cost: r.cost, lowerBound: r.lowerBound, gapPct: ((r.cost - opt) / opt) * 100, lbGapPct: ((opt - r.lowerBound) / opt) * 100, ms,
    sphCost, sphGapPct: ((sphCost - opt) / opt) * 100, sphMs,
    nxCost, nxGapPct: nxCost === null ? null : ((nxCost - opt) / opt) * 100, nxMs, nxNote,
  };
  rows.push(row);
  if (r.cost < opt - 1e-6 || r.lowerBound > opt + 1e-6) throw new Error(`${f}: cost ${r.cost} / bound ${r.lowerBound} contradict the published optimum ${opt}`);
  console.log(JSON.stringify({ ...row, ms: round(ms), sphMs: round(sphMs) }));
}

function round(x: number, d = 1) {
  const k = 10 ** d;
  return Math.round(x * k) / k;
}
const pad = (s: string | number, w: number) => String(s).padStart(w);
console.log('');
console.log(['instance', 'n', 't', 'opt', 'cost', 'gap%', 'lbgap%', 'ms', 'sph', 'sph%', 'sphms', 'nx', 'nx%', 'nxms'].map((h, i) => pad(h, i === 0 ? 15 : 9)).join(' '));
for (const r of rows) {
  console.log([
    r.instance.padStart(15), pad(r.n, 9), pad(r.t, 9), pad(r.opt, 9), pad(r.cost, 9), pad(r.gapPct.toFixed(2), 9), pad(r.lbGapPct.toFixed(2), 9), pad(r.ms.toFixed(0), 9),
    pad(r.sphCost, 9), pad(r.sphGapPct.toFixed(2), 9), pad(r.sphMs.toFixed(0), 9),
    pad(r.nxCost ?? r.nxNote, 9), pad(r.nxGapPct === null ? '-' : r.nxGapPct.toFixed(2), 9), pad(r.nxMs === null ? '-' : r.nxMs.toFixed(0), 9),
  ].join(' '));
}
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length === 0 ? NaN : s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const gaps = rows.map((r) => r.gapPct);
const times = rows.map((r) => r.ms);
const hit = rows.filter((r) => r.cost <= r.opt + 1e-6).length;
const nxRows = rows.filter((r) => r.nxCost !== null);
const nxLonger = nxRows.filter((r) => r.cost > (r.nxCost as number) + 1e-6);
const ourNxMs = nxRows.reduce((a, r) => a + r.ms, 0);
const nxMsTotal = nxRows.reduce((a, r) => a + (r.nxMs as number), 0);
const mark = (ok: boolean) => (ok ? 'reached' : 'NOT reached');
const summary = {
  instances: rows.length,
  meanGapPct: round(mean(gaps), 3), worstGapPct: round(Math.max(...gaps), 2), optimumReached: `${hit}/${rows.length}`,
  medianMs: round(median(times)), worstMs: round(Math.max(...times)), totalMs: round(times.reduce((a, b) => a + b, 0)),
  meanLowerBoundGapPct: round(mean(rows.map((r) => r.lbGapPct)), 3),
  sphMeanGapPct: round(mean(rows.map((r) => r.sphGapPct)), 3), sphTotalMs: round(rows.reduce((a, r) => a + r.sphMs, 0)),
  nxInstances: nxRows.length, nxMeanGapPct: round(mean(nxRows.map((r) => r.nxGapPct as number)), 3),
  oursLongerThanNx: nxLonger.map((r) => r.instance), nxTotalMs: round(nxMsTotal), oursTotalMsOnNxSet: round(ourNxMs),
  speedupVsNx: round(nxMsTotal / Math.max(ourNxMs, 1e-9), 2),
};
console.log('');
console.log(JSON.stringify(summary));
console.log(`target mean gap <= 0.5 %: ${summary.meanGapPct} % -> ${mark(summary.meanGapPct <= 0.5)}`);
console.log(`target worst gap <= 2 %: ${summary.worstGapPct} % -> ${mark(summary.worstGapPct <= 2)}`);
console.log(`target optimum on >= 60 %: ${hit}/${rows.length} -> ${mark(hit >= 0.6 * rows.length)}`);
console.log(`target median time <= 0.2 s: ${summary.medianMs} ms -> ${mark(summary.medianMs <= 200)}`);
console.log(`target worst time <= 3 s: ${summary.worstMs} ms -> ${mark(summary.worstMs <= 3000)}`);
console.log(`target lower-bound mean gap <= 3 %: ${summary.meanLowerBoundGapPct} % -> ${mark(summary.meanLowerBoundGapPct <= 3)}`);
console.log(`target never longer than networkx (${nxRows.length} instances): ${nxLonger.length} longer -> ${mark(nxLonger.length === 0)}`);
console.log(`target >= 20x faster than networkx in total: ${summary.speedupVsNx}x -> ${mark(summary.speedupVsNx >= 20)}`);
