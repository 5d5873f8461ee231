// Web Worker: runs the core pipeline off the interface thread. Cancelling terminates the worker
// (the search is synchronous, so a message could not interrupt it).

import { runPipeline } from '../../../core/pipeline';
import type { FromWorker, ToWorker } from './messages';

const post = (m: FromWorker, transfer: Transferable[] = []): void => (self as unknown as Worker).postMessage(m, transfer);

self.onmessage = async (ev: MessageEvent<ToWorker>) => {
  const { id, input } = ev.data;
  const t0 = performance.now();
  let lastPost = 0;
  let lastStage = 'read';
  try {
    const r = await runPipeline(input, {
      onProgress: (stage, fraction) => {
        const t = performance.now();
        if (stage !== lastStage || fraction >= 1 || t - lastPost > 60) {
          lastStage = stage;
          lastPost = t;
          post({ type: 'progress', id, stage, fraction });
        }
      },
    });
    if (!r.ok) { post({ type: 'failed', id, stage: r.error.stage, message: r.error.message }); return; }
    const f = r.value.files;
    post({ type: 'done', id, output: r.value, elapsedMs: performance.now() - t0 },
      [f.routedDxf.buffer, f.trenchDxf.buffer, f.takeoffXlsx.buffer, f.reportPdf.buffer].filter((b, i, a) => a.indexOf(b) === i) as ArrayBuffer[]);
  } catch (e) {
    post({ type: 'failed', id, stage: lastStage, message: e instanceof Error ? `${e.name}: ${e.message}` : String(e) });
  }
};
