// Writing a drawing back without ever losing the original: exports go to a new file beside the
// original by default, and when the user picks a file that already exists (the original included),
// that file is first copied to a backup that is never overwritten, then replaced atomically.

import { constants, promises as fs } from 'node:fs';
import path from 'node:path';
import { err, ok } from '../../core/result';
import type { BridgeResult, FileKind, SavedFile } from '../contract';
import { withExtension, writeFileAtomic, type AtomicWriteOptions } from './fileAccess';

/** The default name for a write-back beside the original drawing: "<folder>/<name>-trench.dxf". */
export function writeBackPath(originalPath: string, suffix = '-trench'): string {
  const ext = path.extname(originalPath);
  const stem = path.basename(originalPath, ext);
  return path.join(path.dirname(originalPath), `${stem}${suffix}${ext || '.dxf'}`);
}

/** "<name>.bak.dxf", or "<name>.bak2.dxf", "<name>.bak3.dxf" … when earlier backups exist (they are kept). */
export async function freeBackupPath(filePath: string): Promise<string> {
  const ext = path.extname(filePath);
  const stem = path.join(path.dirname(filePath), path.basename(filePath, ext));
  for (let i = 1; i < 10_000; i++) {
    const candidate = `${stem}.bak${i === 1 ? '' : i}${ext}`;
    try {
      await fs.access(candidate);
    } catch {
      return candidate;
    }
  }
  throw new Error(`too many backups of ${path.basename(filePath)}`);
}

export interface SavedWithBackup extends SavedFile {
  /** Where the file that was there before now lives (null when nothing was replaced). */
  backupPath: string | null;
}

/**
 * Write `data` to `filePath`; when a file is already there, copy it to a fresh backup first
 * (COPYFILE_EXCL: an existing backup is never overwritten). If the backup cannot be made,
 * nothing is written and the old file stays as it was.
 */
export interface BackupWriteOptions extends AtomicWriteOptions {
  /** Copies the old file to its backup (default fs.copyFile, refusing to overwrite). */
  copy?: (from: string, to: string) => Promise<void>;
}

export async function writeKeepingBackup(chosenPath: string, data: string | Uint8Array, kind: FileKind, options: BackupWriteOptions = {}): Promise<BridgeResult<SavedWithBackup>> {
  const filePath = withExtension(chosenPath, kind);
  let exists = false;
  try {
    exists = (await fs.stat(filePath)).isFile();
  } catch {
    exists = false;
  }
  let backupPath: string | null = null;
  if (exists) {
    try {
      backupPath = await freeBackupPath(filePath);
      await (options.copy ?? ((a, b) => fs.copyFile(a, b, constants.COPYFILE_EXCL)))(filePath, backupPath);
    } catch (e) {
      return err({ kind: 'io', message: `did not replace ${path.basename(filePath)}: its backup could not be made (${(e as Error).message})` });
    }
  }
  const saved = await writeFileAtomic(filePath, data, kind, options);
  if (!saved.ok) return saved;
  return ok({ ...saved.value, backupPath });
}
