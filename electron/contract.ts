// The one contract for everything that crosses the Electron bridge: channel names, argument and
// result types, and the validators main runs on every argument (the renderer is never trusted).
// The preload exposes `FurrowBridge` as window.furrow; the renderer imports only these types.

import { err, ok, type Result } from '../core/result';

export const BRIDGE_VERSION = 1;

/** File kinds the shell may open or write, with their allowed extensions. */
export const FILE_KINDS = {
  drawing: ['dxf'],
  project: ['furrow', 'json'],
  points: ['csv'],
  dxf: ['dxf'],
  xlsx: ['xlsx'],
  csv: ['csv'],
  pdf: ['pdf'],
} as const;
export type FileKind = keyof typeof FILE_KINDS;

export const MAX_OPEN_BYTES = 200 * 1024 * 1024;
export const MAX_WRITE_BYTES = 200 * 1024 * 1024;

export interface OpenedFile {
  /** Full path (shown to the user, used for recent files). */
  path: string;
  name: string;
  /** File text (drawings, projects, CSV are text). */
  text: string;
}

export interface SavedFile {
  path: string;
  name: string;
  /** When an existing file was replaced: where its earlier content was copied first. */
  backupPath?: string | null;
}

export type BridgeErrorKind = 'invalid-argument' | 'io' | 'too-large' | 'not-found' | 'wrong-type';
export interface BridgeError { kind: BridgeErrorKind; message: string }
export type BridgeResult<T> = Result<T, BridgeError>;

/** Menu commands main sends to the renderer (menu item or its keyboard shortcut). */
export const MENU_COMMANDS = [
  'open-drawing', 'open-project', 'save-project', 'save-project-as', 'import-points',
  'export-dxf-merged', 'export-dxf-layers', 'export-xlsx', 'export-csv', 'export-pdf',
  'undo', 'redo', 'fit', 'run', 'cancel-run',
] as const;
export type MenuCommand = (typeof MENU_COMMANDS)[number];

export interface WriteRequest {
  kind: FileKind;
  suggestedName: string;
  /** Text (DXF, CSV, project) or bytes (XLSX, PDF). */
  data: string | Uint8Array;
}

/** The autosaved project found in the recovery slot, with the time it was written (ISO 8601). */
export interface RecoverySnapshot { savedAt: string; project: string }

/** What the renderer can call. Every function maps to exactly one channel below. */
export interface FurrowBridge {
  readonly version: number;
  /** Asks the user for a file of `kind` and returns its text (null when cancelled). */
  openFile(kind: 'drawing' | 'project' | 'points'): Promise<BridgeResult<OpenedFile | null>>;
  /** Opens a file from the recent list. */
  openRecent(path: string): Promise<BridgeResult<OpenedFile>>;
  /** The file given on the command line (or the demo site), once at start-up. */
  initialFile(): Promise<BridgeResult<OpenedFile | null>>;
  /** Asks where to save and writes (null when cancelled). */
  saveFile(req: WriteRequest): Promise<BridgeResult<SavedFile | null>>;
  recentFiles(): Promise<string[]>;
  /** Subscribes to menu commands; returns an unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
  /** Subscribes to "open this recent file" chosen from the menu; the renderer then calls openRecent. */
  onRecentChosen(listener: (path: string) => void): () => void;
  /** Tells main the document title and whether it has unsaved edits. */
  setDocumentState(title: string, edited: boolean): void;
  /** Writes the current project (serialized) to the recovery slot under the app's data folder. */
  writeRecovery(projectText: string, savedAtIso: string): Promise<BridgeResult<null>>;
  /** The recovery slot's content, or null when it is empty (a clean last exit). */
  readRecovery(): Promise<BridgeResult<RecoverySnapshot | null>>;
  /** Empties the recovery slot (after a clean save, a clean quit, or Discard). */
  clearRecovery(): Promise<BridgeResult<null>>;
  /**
   * Main asks before the window closes: the listener writes or clears the recovery slot and resolves;
   * main closes the window once it has (or after a short timeout). Returns an unsubscribe function.
   */
  onBeforeClose(listener: () => Promise<void>): () => void;
}

export const CHANNELS = {
  openFile: 'furrow:open-file',
  openRecent: 'furrow:open-recent',
  initialFile: 'furrow:initial-file',
  saveFile: 'furrow:save-file',
  recentFiles: 'furrow:recent-files',
  menuCommand: 'furrow:menu-command',
  recentChosen: 'furrow:recent-chosen',
  setDocumentState: 'furrow:set-document-state',
  writeRecovery: 'furrow:write-recovery',
  readRecovery: 'furrow:read-recovery',
  clearRecovery: 'furrow:clear-recovery',
  beforeClose: 'furrow:before-close',
  closeReady: 'furrow:close-ready',
} as const satisfies Record<keyof Omit<FurrowBridge, 'version' | 'onMenuCommand' | 'onRecentChosen' | 'onBeforeClose'> | 'menuCommand' | 'recentChosen' | 'beforeClose' | 'closeReady', string>;

// ---- validators (run in main on every incoming argument) ----

const bad = (message: string): BridgeResult<never> => err({ kind: 'invalid-argument', message });

export function validateOpenKind(v: unknown): BridgeResult<'drawing' | 'project' | 'points'> {
  return v === 'drawing' || v === 'project' || v === 'points' ? ok(v) : bad(`unknown file kind ${JSON.stringify(v)}`);
}

export function validatePath(v: unknown): BridgeResult<string> {
  if (typeof v !== 'string' || v.length === 0 || v.length > 4096) return bad('path must be a non-empty string');
  if (v.includes('\0')) return bad('path contains a NUL character');
  return ok(v);
}

export function validateWriteRequest(v: unknown): BridgeResult<WriteRequest> {
  if (typeof v !== 'object' || v === null) return bad('write request must be an object');
  const r = v as Record<string, unknown>;
  if (typeof r.kind !== 'string' || !(r.kind in FILE_KINDS)) return bad(`unknown file kind ${JSON.stringify(r.kind)}`);
  if (typeof r.suggestedName !== 'string' || r.suggestedName.length === 0 || r.suggestedName.length > 255 ||
      /[\\/\0]/.test(r.suggestedName)) {
    return bad('suggestedName must be a plain file name (no folders)');
  }
  const isBytes = r.data instanceof Uint8Array;
  if (typeof r.data !== 'string' && !isBytes) return bad('data must be text or bytes');
  const size = isBytes ? (r.data as Uint8Array).byteLength : (r.data as string).length;
  if (size > MAX_WRITE_BYTES) return err({ kind: 'too-large', message: `refusing to write ${size} bytes (limit ${MAX_WRITE_BYTES})` });
  return ok({ kind: r.kind as FileKind, suggestedName: r.suggestedName, data: r.data as string | Uint8Array });
}

export function validateDocumentState(title: unknown, edited: unknown): BridgeResult<{ title: string; edited: boolean }> {
  if (typeof title !== 'string' || title.length > 512) return bad('title must be a string of at most 512 characters');
  if (typeof edited !== 'boolean') return bad('edited must be a boolean');
  return ok({ title, edited });
}

/** Largest recovery snapshot accepted (a project embeds its drawing). */
export const MAX_RECOVERY_CHARS = MAX_WRITE_BYTES;

export function validateRecovery(projectText: unknown, savedAtIso: unknown): BridgeResult<RecoverySnapshot> {
  if (typeof projectText !== 'string' || projectText.length === 0) return bad('recovery project must be non-empty text');
  if (projectText.length > MAX_RECOVERY_CHARS) return err({ kind: 'too-large', message: `refusing a recovery snapshot of ${projectText.length} characters` });
  if (typeof savedAtIso !== 'string' || savedAtIso.length > 40 || Number.isNaN(Date.parse(savedAtIso))) return bad('savedAt must be an ISO date-time');
  return ok({ project: projectText, savedAt: savedAtIso });
}

export function isMenuCommand(v: unknown): v is MenuCommand {
  return typeof v === 'string' && (MENU_COMMANDS as readonly string[]).includes(v);
}

/** True when `fileName` has one of the extensions allowed for `kind`. */
export function hasAllowedExtension(fileName: string, kind: FileKind): boolean {
  const dot = fileName.lastIndexOf('.');
  if (dot < 0) return false;
  const ext = fileName.slice(dot + 1).toLowerCase();
  return (FILE_KINDS[kind] as readonly string[]).includes(ext);
}
