// Runs the pipeline off the main thread so that Ctrl-C stays responsive while the router works:
// the main thread sets a shared flag, the pipeline's signal reads it.
import { parentPort, workerData } from 'node:worker_threads';
import { runPipeline, type PipelineError, type PipelineInput, type PipelineOutput } from '../pipeline';
import { Cancelled, type Result } from '../result';

export type WorkerMessage =
  | { type: 'progress'; stage: string; fraction: number }
  | { type: 'result'; result: Result<Pick<PipelineOutput, 'summary' | 'files'>, PipelineError> }
  | { type: 'cancelled' }
  | { type: 'crash'; message: string };

const { input, abort } = workerData as { input: PipelineInput; abort: SharedArrayBuffer };
const flag = new Int32Array(abort);
const signal = { get aborted(): boolean { return Atomics.load(flag, 0) !== 0; } };
const post = (m: WorkerMessage): void => parentPort!.postMessage(m);

try {
  const r = await runPipeline(input, { signal, onProgress: (stage, fraction) => post({ type: 'progress', stage, fraction }) });
  if (r.ok) {
    // only what the command writes and prints crosses back
    const { summary, files } = r.value;
    post({ type: 'result', result: { ok: true, value: { summary, files } } });
  } else {
    post({ type: 'result', result: r });
  }
} catch (x) {
  if (x instanceof Cancelled) post({ type: 'cancelled' });
  else post({ type: 'crash', message: x instanceof Error ? (x.stack ?? x.message) : String(x) });
}
