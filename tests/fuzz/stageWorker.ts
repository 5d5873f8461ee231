// Runs one input through the import stages in a worker thread, so that the parent can bound its
// wall time (terminate) and its heap (resourceLimits): a hang or a runaway allocation then fails
// one case instead of the whole run.
import { readFileSync } from 'node:fs';
import { parentPort, workerData } from 'node:worker_threads';
import { runStages } from './stages';
import { hugePolyline, nestedBlocks } from './seedDrawings';
import type { ReadDxfOptions } from '../../core/dxf/readDxf';

export type WorkerInput =
  | { kind: 'file'; path: string; opts?: ReadDxfOptions }
  | { kind: 'text'; text: string; opts?: ReadDxfOptions }
  | { kind: 'hugePolyline'; vertices: number; layer?: string; closed?: boolean; opts?: ReadDxfOptions }
  | { kind: 'nested'; depth: number; opts?: ReadDxfOptions };

const input = workerData as WorkerInput;
let text: string;
switch (input.kind) {
  case 'file': text = readFileSync(input.path, 'latin1'); break;
  case 'text': text = input.text; break;
  case 'hugePolyline': {
    text = hugePolyline(input.vertices, input.layer);
    // flag 70 of the big polyline: the last 70 group before the first vertex
    if (input.closed) text = text.replace(/( 90\n\d+\n 70\n)0\n(?![\s\S]* 90\n)/, '$11\n');
    break;
  }
  case 'nested': text = nestedBlocks(input.depth); break;
}
try {
  const out = runStages(text, input.opts ?? {});
  parentPort!.postMessage({ type: 'done', label: out.label, ms: out.ms, heapMB: process.memoryUsage().heapUsed / 1048576 });
} catch (x) {
  parentPort!.postMessage({ type: 'threw', message: x instanceof Error ? (x.stack ?? x.message) : String(x) });
}
