// The recovery slot: the project as it was at the last autosave, kept under the app's data folder
// until a clean save or a clean quit clears it. Found at start-up, it means the app did not close
// cleanly and the user is offered to restore it.

import { promises as fs } from 'node:fs';
import path from 'node:path';
import { err, ok } from '../../core/result';
import type { BridgeResult, RecoverySnapshot } from '../contract';
import { writeFileAtomic } from './fileAccess';

export const RECOVERY_FILE = 'autosave.furrow';

export interface RecoverySlot {
  write(projectText: string, savedAtIso: string): Promise<BridgeResult<null>>;
  read(): Promise<RecoverySnapshot | null>;
  clear(): Promise<void>;
}

/** A slot in `dir` (e.g. <userData>/recovery). The file holds the autosave time and the project text. */
export function createRecoverySlot(dir: string): RecoverySlot {
  const file = path.join(dir, RECOVERY_FILE);
  return {
    async write(projectText, savedAtIso) {
      try {
        await fs.mkdir(dir, { recursive: true });
      } catch (e) {
        return err({ kind: 'io', message: `could not create ${dir}: ${(e as Error).message}` });
      }
      const saved = await writeFileAtomic(file, JSON.stringify({ savedAt: savedAtIso, project: projectText }), 'project');
      return saved.ok ? ok(null) : saved;
    },
    async read() {
      let text: string;
      try {
        text = await fs.readFile(file, 'utf8');
      } catch {
        return null;
      }
      try {
        const v = JSON.parse(text) as unknown;
        if (typeof v !== 'object' || v === null) return null;
        const r = v as Record<string, unknown>;
        if (typeof r.savedAt !== 'string' || typeof r.project !== 'string') return null;
        return { savedAt: r.savedAt, project: r.project };
      } catch {
        return null; // a damaged slot is not offered; the project parser validates the rest on restore
      }
    },
    async clear() {
      await fs.rm(file, { force: true });
    },
  };
}
