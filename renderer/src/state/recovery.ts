// Autosave to the recovery slot: while there are unsaved edits, the project is written there every
// few minutes and when the app closes; a clean save or a clean close empties it. A slot found at
// start-up means the last session ended without either, and the user is offered to restore it.

import type { BridgeResult, RecoverySnapshot } from '../../../electron/contract';

export type { RecoverySnapshot };

/** Where the slot lives: the shell's data folder (Electron) or localStorage (plain browser). */
export interface RecoveryApi {
  read(): Promise<BridgeResult<RecoverySnapshot | null>>;
  write(projectText: string, savedAtIso: string): Promise<BridgeResult<null>>;
  clear(): Promise<BridgeResult<null>>;
}

export const DEFAULT_AUTOSAVE_MINUTES = 3;
export const AUTOSAVE_PREF_KEY = 'furrow.autosaveMinutes';

/**
 * The autosave interval in milliseconds: `?autosaveSeconds=N` in the address (used by tests), else the
 * stored preference in minutes, else the default. Values out of range fall back to the default.
 */
export function autosaveIntervalMs(search: string, storedMinutes: string | null): number {
  const q = Number(new URLSearchParams(search).get('autosaveSeconds'));
  if (Number.isFinite(q) && q >= 0.2 && q <= 3600) return q * 1000;
  const m = storedMinutes === null ? NaN : Number(storedMinutes);
  if (Number.isFinite(m) && m >= 0.5 && m <= 120) return m * 60_000;
  return DEFAULT_AUTOSAVE_MINUTES * 60_000;
}

/** What to autosave right now: `key` is the state's identity (unchanged state is not written twice). */
export interface Snapshot { key: unknown; text(): string }

export interface AutosaveDeps {
  slot: RecoveryApi;
  /** The current project when it has unsaved edits, else null. */
  unsaved(): Snapshot | null;
  now(): Date;
}

export interface Autosave {
  /** One autosave: writes when there are unsaved edits not yet in the slot. Resolves true when written. */
  tick(): Promise<boolean>;
  /** The app is closing: write unsaved edits, or clear the slot when there are none (a clean close). */
  closing(): Promise<void>;
  /** After a clean save (or Discard): empty the slot. */
  cleared(): Promise<void>;
  /** While an offer to restore is open the slot is left alone (it holds the older work). */
  hold(on: boolean): void;
  start(intervalMs: number): void;
  stop(): void;
}

export function createAutosave(deps: AutosaveDeps): Autosave {
  let written: unknown = undefined;
  let held = false;
  let timer: ReturnType<typeof setInterval> | null = null;
  const write = async (s: Snapshot): Promise<boolean> => {
    const r = await deps.slot.write(s.text(), deps.now().toISOString());
    if (r.ok) written = s.key;
    return r.ok;
  };
  const self: Autosave = {
    async tick() {
      if (held) return false;
      const s = deps.unsaved();
      if (!s || s.key === written) return false;
      return write(s);
    },
    async closing() {
      if (held) return;
      const s = deps.unsaved();
      if (s) await write(s);
      else await self.cleared();
    },
    async cleared() {
      written = undefined;
      if (!held) await deps.slot.clear();
    },
    hold(on) { held = on; },
    start(intervalMs) {
      self.stop();
      timer = setInterval(() => { void self.tick(); }, intervalMs);
    },
    stop() {
      if (timer !== null) clearInterval(timer);
      timer = null;
    },
  };
  return self;
}

/** "14:05 on 2 December 2026" in the user's locale, from the slot's ISO time. */
export function describeSavedAt(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return 'an unknown time';
  const time = d.toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit', second: '2-digit' });
  const day = d.toLocaleDateString(undefined, { day: 'numeric', month: 'long', year: 'numeric' });
  return `${time} on ${day}`;
}

export const BROWSER_RECOVERY_KEY = 'furrow.recovery';

/** The browser's slot in localStorage. Writes are synchronous, so they also complete during pagehide. */
export function localStorageRecovery(storage: Storage): RecoveryApi {
  return {
    async read() {
      const raw = storage.getItem(BROWSER_RECOVERY_KEY);
      if (raw === null) return { ok: true, value: null };
      try {
        const v = JSON.parse(raw) as Record<string, unknown>;
        if (typeof v?.savedAt === 'string' && typeof v.project === 'string') return { ok: true, value: { savedAt: v.savedAt, project: v.project } };
      } catch { /* damaged: not offered */ }
      return { ok: true, value: null };
    },
    write(projectText, savedAtIso) {
      try {
        storage.setItem(BROWSER_RECOVERY_KEY, JSON.stringify({ savedAt: savedAtIso, project: projectText }));
        return Promise.resolve({ ok: true, value: null });
      } catch (e) {
        return Promise.resolve({ ok: false, error: { kind: 'io', message: `the browser refused the autosave: ${(e as Error).message}` } });
      }
    },
    clear() {
      storage.removeItem(BROWSER_RECOVERY_KEY);
      return Promise.resolve({ ok: true, value: null });
    },
  };
}
