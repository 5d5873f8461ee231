// The undoable project store: a current ProjectState plus past and future diffs.
// Subscribers get the new state and the diff that produced it (for minimal redraws).

import { applyDiff, diffFor, invertDiff, isEmptyDiff, type Diff, type Edit, type ProjectState } from './edits';

export type Listener = (state: ProjectState, diff: Diff | null) => void;

export interface ProjectStore {
  get(): ProjectState;
  /** Apply an edit; returns false when it changed nothing. */
  edit(e: Edit): boolean;
  undo(): boolean;
  redo(): boolean;
  canUndo(): boolean;
  canRedo(): boolean;
  undoLabel(): string | null;
  redoLabel(): string | null;
  /** Replace everything (new drawing, project load): clears history. */
  reset(state: ProjectState): void;
  subscribe(l: Listener): () => void;
}

export const HISTORY_LIMIT = 500;

export function createProjectStore(initial: ProjectState): ProjectStore {
  let state = initial;
  let past: Diff[] = [];
  let future: Diff[] = [];
  const listeners = new Set<Listener>();
  const emit = (d: Diff | null): void => { for (const l of listeners) l(state, d); };

  return {
    get: () => state,
    edit(e) {
      const d = diffFor(state, e);
      if (isEmptyDiff(d)) return false;
      state = applyDiff(state, d);
      past.push(d);
      if (past.length > HISTORY_LIMIT) past = past.slice(past.length - HISTORY_LIMIT);
      future = [];
      emit(d);
      return true;
    },
    undo() {
      const d = past.pop();
      if (!d) return false;
      const inv = invertDiff(d);
      state = applyDiff(state, inv);
      future.push(d);
      emit(inv);
      return true;
    },
    redo() {
      const d = future.pop();
      if (!d) return false;
      state = applyDiff(state, d);
      past.push(d);
      emit(d);
      return true;
    },
    canUndo: () => past.length > 0,
    canRedo: () => future.length > 0,
    undoLabel: () => past[past.length - 1]?.label ?? null,
    redoLabel: () => future[future.length - 1]?.label ?? null,
    reset(next) {
      state = next;
      past = [];
      future = [];
      emit(null);
    },
    subscribe(l) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}
