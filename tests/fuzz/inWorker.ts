// Parent side of stageWorker: one input, a wall-clock bound and a heap bound.
import { Worker } from 'node:worker_threads';
import type { WorkerInput } from './stageWorker';

export type WorkerOutcome =
  | { type: 'done'; label: string; ms: number; heapMB: number; wallMs: number }
  | { type: 'threw'; message: string; wallMs: number }
  | { type: 'timeout'; wallMs: number }
  | { type: 'died'; message: string; wallMs: number };

export function runInWorker(input: WorkerInput, timeoutMs: number, maxOldGenerationSizeMb = 1024): Promise<WorkerOutcome> {
  const t0 = performance.now();
  const w = new Worker(new URL('./stageWorker.mjs', import.meta.url), { workerData: input, resourceLimits: { maxOldGenerationSizeMb } });
  return new Promise((resolve) => {
    let settled = false;
    const finish = (o: WorkerOutcome): void => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void w.terminate();
      resolve(o);
    };
    const timer = setTimeout(() => finish({ type: 'timeout', wallMs: performance.now() - t0 }), timeoutMs);
    w.on('message', (m) => finish({ ...m, wallMs: performance.now() - t0 }));
    w.on('error', (e) => finish({ type: 'died', message: `${(e as { code?: string }).code ?? ''} ${e.message}`, wallMs: performance.now() - t0 }));
    w.on('exit', (code) => finish({ type: 'died', message: `worker exited with code ${code}`, wallMs: performance.now() - t0 }));
  });
}
