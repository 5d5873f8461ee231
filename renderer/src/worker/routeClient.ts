// Starts a pipeline run in a Web Worker and lets the interface follow or cancel it.

import type { PipelineInput, PipelineOutput } from '../../../core/pipeline';
import type { FromWorker, ToWorker } from './messages';

export type RunOutcome =
  | { kind: 'done'; output: PipelineOutput; elapsedMs: number }
  | { kind: 'failed'; stage: string; message: string }
  | { kind: 'cancelled' };

export interface RunHandle {
  readonly outcome: Promise<RunOutcome>;
  cancel(): void;
}

let nextId = 1;

export function startRun(input: PipelineInput, onProgress: (stage: string, fraction: number) => void): RunHandle {
  const worker = new Worker(new URL('./routeWorker.ts', import.meta.url), { type: 'module', name: 'furrow-route' });
  const id = nextId++;
  let settle!: (o: RunOutcome) => void;
  let settled = false;
  const outcome = new Promise<RunOutcome>((resolve) => { settle = resolve; });
  const finish = (o: RunOutcome): void => {
    if (settled) return;
    settled = true;
    worker.terminate();
    settle(o);
  };
  worker.onmessage = (ev: MessageEvent<FromWorker>) => {
    const m = ev.data;
    if (m.id !== id) return;
    if (m.type === 'progress') onProgress(m.stage, m.fraction);
    else if (m.type === 'done') finish({ kind: 'done', output: m.output, elapsedMs: m.elapsedMs });
    else finish({ kind: 'failed', stage: m.stage, message: m.message });
  };
  worker.onerror = (ev) => finish({ kind: 'failed', stage: 'start', message: ev.message || 'the routing worker failed to start' });
  const msg: ToWorker = { type: 'run', id, input };
  worker.postMessage(msg);
  return { outcome, cancel: () => finish({ kind: 'cancelled' }) };
}
