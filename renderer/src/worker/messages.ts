// Messages between the interface and the routing worker.

import type { PipelineInput, PipelineOutput } from '../../../core/pipeline';

export type ToWorker = { type: 'run'; id: number; input: PipelineInput };

export type FromWorker =
  | { type: 'progress'; id: number; stage: string; fraction: number }
  | { type: 'done'; id: number; output: PipelineOutput; elapsedMs: number }
  | { type: 'failed'; id: number; stage: string; message: string };
