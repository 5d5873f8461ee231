// Where files come from and go to: the Electron bridge (native dialogs) or the plain browser
// (a file input and downloads). The rest of the renderer only sees this interface.

import type { BridgeResult, FurrowBridge, MenuCommand, OpenedFile, SavedFile, WriteRequest } from '../../../electron/contract';
import { localStorageRecovery, type RecoveryApi } from '../state/recovery';

export type { MenuCommand, OpenedFile, SavedFile, WriteRequest };

export interface Platform {
  readonly kind: 'electron' | 'browser';
  openFile(kind: 'drawing' | 'project' | 'points'): Promise<BridgeResult<OpenedFile | null>>;
  saveFile(req: WriteRequest): Promise<BridgeResult<SavedFile | null>>;
  initialFile(): Promise<BridgeResult<OpenedFile | null>>;
  openRecent(path: string): Promise<BridgeResult<OpenedFile>>;
  onMenuCommand(listener: (c: MenuCommand) => void): () => void;
  onRecentChosen(listener: (path: string) => void): () => void;
  setDocumentState(title: string, edited: boolean): void;
  /** The recovery slot autosaves go to. */
  readonly recovery: RecoveryApi;
  /** Runs `listener` when the app is about to close (window close or quit; page hide in the browser). */
  onBeforeClose(listener: () => Promise<void>): () => void;
}

declare global {
  interface Window { furrow?: FurrowBridge }
}

export function electronPlatform(bridge: FurrowBridge): Platform {
  return {
    kind: 'electron',
    openFile: (k) => bridge.openFile(k),
    saveFile: (r) => bridge.saveFile(r),
    initialFile: () => bridge.initialFile(),
    openRecent: (p) => bridge.openRecent(p),
    onMenuCommand: (l) => bridge.onMenuCommand(l),
    onRecentChosen: (l) => bridge.onRecentChosen(l),
    setDocumentState: (t, e) => bridge.setDocumentState(t, e),
    recovery: {
      read: () => bridge.readRecovery(),
      write: (text, at) => bridge.writeRecovery(text, at),
      clear: () => bridge.clearRecovery(),
    },
    onBeforeClose: (l) => bridge.onBeforeClose(l),
  };
}

const ACCEPT: Record<'drawing' | 'project' | 'points', string> = {
  drawing: '.dxf', project: '.furrow,.json', points: '.csv',
};

export function browserPlatform(): Platform {
  return {
    kind: 'browser',
    openFile(kind) {
      return new Promise((resolve) => {
        const input = document.createElement('input');
        input.type = 'file';
        input.accept = ACCEPT[kind];
        input.setAttribute('data-open-kind', kind);
        input.style.display = 'none';
        document.body.append(input);
        let settled = false;
        const done = (v: BridgeResult<OpenedFile | null>): void => {
          if (settled) return;
          settled = true;
          input.remove();
          resolve(v);
        };
        input.addEventListener('change', async () => {
          const f = input.files?.[0];
          if (!f) { done({ ok: true, value: null }); return; }
          try {
            done({ ok: true, value: { path: f.name, name: f.name, text: await f.text() } });
          } catch (e) {
            done({ ok: false, error: { kind: 'io', message: `could not read ${f.name}: ${(e as Error).message}` } });
          }
        });
        input.addEventListener('cancel', () => done({ ok: true, value: null }));
        input.click();
      });
    },
    async saveFile(req) {
      const blob = new Blob([req.data as BlobPart], { type: 'application/octet-stream' });
      const url = URL.createObjectURL(blob);
      const a = document.createElement('a');
      a.href = url;
      a.download = req.suggestedName;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      return { ok: true, value: { path: req.suggestedName, name: req.suggestedName } };
    },
    initialFile: async () => ({ ok: true, value: null }),
    openRecent: async (p) => ({ ok: false, error: { kind: 'not-found', message: `recent files are not available in the browser (${p})` } }),
    onMenuCommand: () => () => undefined,
    onRecentChosen: () => () => undefined,
    setDocumentState(title, edited) {
      document.title = `${edited ? '• ' : ''}${title ? `${title} — ` : ''}Furrow`;
    },
    recovery: localStorageRecovery(window.localStorage),
    onBeforeClose(listener) {
      // pagehide also fires where beforeunload does not (mobile, bfcache); the slot write is synchronous
      const handler = (): void => { void listener(); };
      window.addEventListener('pagehide', handler);
      return () => window.removeEventListener('pagehide', handler);
    },
  };
}

export function currentPlatform(): Platform {
  return window.furrow ? electronPlatform(window.furrow) : browserPlatform();
}
