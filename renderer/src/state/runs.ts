// Finished runs: the latest one is shown; the one before it is kept beside it for comparison.

import type { RunRecord } from '../results/runRecord';

export interface RunProgress { stage: string; fraction: number; startedAt: number }

export interface RunsState {
  readonly current: RunRecord | null;
  readonly previous: RunRecord | null;
  readonly running: RunProgress | null;
  readonly lastError: string | null;
  /** True when the project changed after the current run (its results are out of date). */
  readonly stale: boolean;
}

export interface RunsStore {
  get(): RunsState;
  set(patch: Partial<RunsState>): void;
  /** A new finished run becomes current; the old current becomes previous. */
  push(run: RunRecord): void;
  subscribe(l: (s: RunsState) => void): () => void;
}

export function createRunsStore(): RunsStore {
  let state: RunsState = { current: null, previous: null, running: null, lastError: null, stale: false };
  const listeners = new Set<(s: RunsState) => void>();
  const emit = (): void => { for (const l of listeners) l(state); };
  return {
    get: () => state,
    set(patch) { state = { ...state, ...patch }; emit(); },
    push(run) { state = { ...state, previous: state.current, current: run, running: null, lastError: null, stale: false }; emit(); },
    subscribe(l) { listeners.add(l); return () => listeners.delete(l); },
  };
}
