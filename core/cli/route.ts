// `furrow route <drawing.dxf> --services <services.csv> [--roles roles.json] [--settings settings.json]
// [--units m|ft] --out <dir> [--json]`: the whole job. Exit 0 done; 2 bad input; 3 done in part
// (some points unreachable); 130 cancelled (Ctrl-C). Progress: a bar on a terminal; with
// FURROW_PROGRESS=lines, one stderr line per stage otherwise.

import { Worker } from 'node:worker_threads';
import { registerCommand } from './main';
import { readRouteInputs, writeRouteOutputs, type RouteArgs } from '../io/routeFiles';
import { noticeText } from '../notice';
import { STAGES, type Summary } from '../pipeline';
import type { WorkerMessage } from './routeWorker';

const USAGE = 'usage: furrow route <drawing.dxf> --services <services.csv> [--roles roles.json] [--settings settings.json] [--units m|ft] --out <dir> [--json]';

function fail(msg: string, code = 2): number {
  process.stderr.write(`furrow route: ${msg}\n`);
  return code;
}

export function parseRouteArgs(args: string[]): { ok: true; value: RouteArgs & { json: boolean } } | { ok: false; message: string } {
  const a: Partial<RouteArgs> & { json: boolean } = { json: false };
  const value = (i: number): string | null => {
    const v = args[i];
    return v === undefined || v.startsWith('--') ? null : v;
  };
  for (let i = 0; i < args.length; i++) {
    const x = args[i];
    switch (x) {
      case '--json': a.json = true; break;
      case '--services': case '--roles': case '--settings': case '--out': case '--units': {
        const v = value(i + 1);
        if (v === null) return { ok: false, message: `${x} needs a value\n${USAGE}` };
        i++;
        if (x === '--units') {
          if (v !== 'm' && v !== 'ft') return { ok: false, message: `--units takes m or ft, not '${v}'\n${USAGE}` };
          a.units = v;
        } else a[x.slice(2) as 'services' | 'roles' | 'settings' | 'out'] = v;
        break;
      }
      default:
        if (x.startsWith('--')) return { ok: false, message: `unknown option ${x}\n${USAGE}` };
        if (a.drawing) return { ok: false, message: `one drawing at a time (got ${a.drawing} and ${x})\n${USAGE}` };
        a.drawing = x;
    }
  }
  if (!a.drawing) return { ok: false, message: `no drawing given\n${USAGE}` };
  if (!a.services) return { ok: false, message: `--services <services.csv> is required (header id,x,y,role,utilities)\n${USAGE}` };
  if (!a.out) return { ok: false, message: `--out <dir> is required: the folder for the outputs\n${USAGE}` };
  return { ok: true, value: a as RouteArgs & { json: boolean } };
}

/** A one-line progress bar on stderr (TTY only). */
function progressBar(enabled: boolean): { update(stage: string, f: number): void; clear(): void } {
  let last = '';
  return {
    update(stage, f) {
      if (!enabled) return;
      const i = Math.max(0, STAGES.indexOf(stage as (typeof STAGES)[number]));
      const overall = (i + Math.min(1, Math.max(0, f))) / STAGES.length;
      const width = 30;
      const filled = Math.round(overall * width);
      const line = `[${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${String(Math.round(overall * 100)).padStart(3)}%  ${stage} (${i + 1}/${STAGES.length})`;
      if (line !== last) { process.stderr.write(`\r${line}\x1b[K`); last = line; }
    },
    clear() { if (enabled && last) process.stderr.write('\r\x1b[K'); },
  };
}

function summaryText(s: Summary, out: string): string {
  const u = s.units;
  const lines = [
    `Routed ${s.services.connected} of ${s.services.total} services from ${s.connections} point(s) of connection.`,
    `Trench ${s.trench.length.toFixed(1)} ${u} (${s.trench.lengthUnderPavement.toFixed(1)} ${u} under pavement), ${s.trench.segments} segments, ${s.trench.bends} bends, ${s.trench.crossings} crossings, ${s.pullBoxes} pull boxes.`,
    `Route cost ${s.cost.route.toFixed(1)}, lower bound ${s.cost.lowerBound.toFixed(1)} (gap ${(s.cost.gap * 100).toFixed(1)} %); take-off total ${s.cost.takeoffTotal.toFixed(2)} ${s.cost.currency} (placeholder prices unless you set your own).`,
    `Wrote to ${out}: ${Object.values(s.files).join(', ')}, summary.json`,
  ];
  if (s.rolesSuggested) lines.push(`Layer roles were suggested (no --roles file): ${Object.entries(s.roles).filter(([, r]) => r !== 'ignore').map(([l, r]) => `${l}=${r}`).join(', ') || 'none'}`);
  if (s.services.unreachable.length) lines.push('Not connected:', ...s.services.unreachable.map((x) => `  ${x.id}: ${x.reason}`));
  if (s.warnings.length) lines.push('Warnings:', ...s.warnings.map((w) => `  ${w}`));
  lines.push('', noticeText('\n'));
  return lines.join('\n') + '\n';
}

export async function routeCommand(args: string[]): Promise<number> {
  const parsed = parseRouteArgs(args);
  if (!parsed.ok) return fail(parsed.message);
  const a = parsed.value;

  // Ctrl-C: the first asks the pipeline to stop (it polls a shared flag), the second stops at once.
  const abort = new SharedArrayBuffer(4);
  const flag = new Int32Array(abort);
  const mode = process.stderr.isTTY ? 'bar' : process.env.FURROW_PROGRESS === 'lines' ? 'lines' : 'off';
  const bar = progressBar(mode === 'bar');
  let phase: 'run' | 'write' = 'run';
  const onSigint = (): void => {
    if (Atomics.load(flag, 0) !== 0) process.exit(130);
    Atomics.store(flag, 0, 1);
    bar.clear();
    process.stderr.write(phase === 'write' ? 'furrow route: finishing the files being written...\n' : 'furrow route: cancelling (Ctrl-C again to stop at once)...\n');
  };
  process.on('SIGINT', onSigint);
  try {
    const input = await readRouteInputs(a, new Date().toISOString().slice(0, 10));
    if (!input.ok) return fail(input.error.message);
    if (Atomics.load(flag, 0) !== 0) return fail('cancelled by Ctrl-C; nothing was written', 130);

    const worker = new Worker(new URL('./routeWorker.mjs', import.meta.url), { workerData: { input: input.value, abort } });
    let lastStage = '';
    let outcome: Exclude<WorkerMessage, { type: 'progress' }>;
    try {
      outcome = await new Promise((resolve) => {
        worker.on('message', (m: WorkerMessage) => {
          if (m.type !== 'progress') { resolve(m); return; }
          bar.update(m.stage, m.fraction);
          // FURROW_PROGRESS=lines: one line per stage, for logs and scripts
          if (mode === 'lines' && m.stage !== lastStage) process.stderr.write(`furrow route: ${m.stage}\n`);
          lastStage = m.stage;
        });
        worker.on('error', (e) => resolve({ type: 'crash', message: e.stack ?? e.message }));
        worker.on('exit', (code) => resolve({ type: 'crash', message: `the routing worker stopped (exit ${code})` }));
      });
    } finally {
      bar.clear();
      await worker.terminate();
    }
    if (outcome.type === 'cancelled' || Atomics.load(flag, 0) !== 0) return fail('cancelled by Ctrl-C; nothing was written', 130);
    if (outcome.type === 'crash') return fail(`internal error, please report it:\n${outcome.message}`, 1);
    const r = outcome.result;
    if (!r.ok) return fail(r.error.message);
    const { summary, files } = r.value;
    phase = 'write';
    const w = await writeRouteOutputs(a.out, files, summary);
    if (!w.ok) return fail(w.error.message);
    return report(summary, a.out, a.json);
  } finally {
    process.off('SIGINT', onSigint);
    // A Ctrl-C while the process winds down still ends it as cancelled (130), not killed by the signal.
    process.on('SIGINT', () => process.exit(130));
  }
}

function report(summary: Summary, out: string, json: boolean): number {
  if (json) process.stdout.write(JSON.stringify(summary, null, 2) + '\n');
  else process.stdout.write(summaryText(summary, out));
  if (summary.status === 'partial') {
    process.stderr.write(`furrow route: done in part; not connected: ${summary.services.unreachable.map((x) => `${x.id} (${x.reason})`).join('; ')}\n`);
    return 3;
  }
  return 0;
}

registerCommand('route', routeCommand);
