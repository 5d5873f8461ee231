// Interface state that is not part of the project (not undoable): current step, tool, selection,
// the message line. A tiny observable record.

export type Step = 'layers' | 'points' | 'settings' | 'results' | 'takeoff';
export type Tool = 'pan' | 'select' | 'add-service' | 'add-connection';

export interface Message { text: string; kind: 'info' | 'warn' | 'error' }

export interface UiState {
  readonly step: Step;
  readonly tool: Tool;
  readonly selectedPoint: string | null;
  readonly message: Message | null;
  /** Layers switched off in the view (display only). */
  readonly hiddenLayers: ReadonlySet<string>;
}

export interface UiStore {
  get(): UiState;
  set(patch: Partial<UiState>): void;
  subscribe(l: (s: UiState, prev: UiState) => void): () => void;
}

export function createUiStore(initial: UiState): UiStore {
  let state = Object.freeze({ ...initial });
  const listeners = new Set<(s: UiState, prev: UiState) => void>();
  return {
    get: () => state,
    set(patch) {
      const prev = state;
      state = Object.freeze({ ...state, ...patch });
      for (const l of listeners) l(state, prev);
    },
    subscribe(l) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}
