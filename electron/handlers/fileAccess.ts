// Reading and writing the files the bridge deals in. Plain Node (no Electron) so it is tested directly.

import { promises as fs } from 'node:fs';
import type { FileHandle } from 'node:fs/promises';
import path from 'node:path';
import { err, ok } from '../../core/result';
import { FILE_KINDS, MAX_OPEN_BYTES, hasAllowedExtension, type BridgeResult, type FileKind, type OpenedFile, type SavedFile } from '../contract';

/** Decode as UTF-8, falling back to Latin-1 for older drawings written in a legacy code page. */
export function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder('latin1').decode(bytes);
  }
}

export async function readTextFile(filePath: string, kind: FileKind, maxBytes = MAX_OPEN_BYTES): Promise<BridgeResult<OpenedFile>> {
  const name = path.basename(filePath);
  if (!hasAllowedExtension(name, kind)) {
    return err({ kind: 'wrong-type', message: `${name} is not a ${kind} file (expected .${FILE_KINDS[kind].join(' or .')})` });
  }
  let size: number;
  try {
    const st = await fs.stat(filePath);
    if (!st.isFile()) return err({ kind: 'not-found', message: `${filePath} is not a file` });
    size = st.size;
  } catch {
    return err({ kind: 'not-found', message: `${filePath} does not exist or cannot be read` });
  }
  if (size > maxBytes) return err({ kind: 'too-large', message: `${name} is ${size} bytes; the limit is ${maxBytes}` });
  try {
    const bytes = await fs.readFile(filePath);
    return ok({ path: filePath, name, text: decodeText(bytes) });
  } catch (e) {
    return err({ kind: 'io', message: `could not read ${name}: ${(e as Error).message}` });
  }
}

/** Add the kind's first extension when the chosen name has none of its extensions. */
export function withExtension(filePath: string, kind: FileKind): string {
  return hasAllowedExtension(path.basename(filePath), kind) ? filePath : `${filePath}.${FILE_KINDS[kind][0]}`;
}

/** Steps of an atomic write, in order; a hook may throw at any of them (tests simulate failures). */
export type WriteStep = 'opened' | 'written' | 'synced' | 'renamed' | 'dir-synced';

export interface AtomicWriteOptions {
  /** Writes the data into the open temporary file (default: the whole buffer at once). */
  writer?: (handle: FileHandle, data: string | Uint8Array) => Promise<void>;
  /** Called after each step. */
  onStep?: (step: WriteStep) => void | Promise<void>;
  /** Platform name, for whether a folder can be flushed (default process.platform). */
  platform?: string;
}

/**
 * Flush a folder's entry list so a rename survives a power cut. POSIX systems allow opening a
 * folder and fsync'ing it; Windows does not (the rename is journalled by NTFS), so it is skipped there.
 * Returns whether the folder was flushed.
 */
export async function syncDirectory(dir: string, platform: string = process.platform): Promise<boolean> {
  if (platform === 'win32') return false;
  let handle: FileHandle | null = null;
  try {
    handle = await fs.open(dir, 'r');
    await handle.sync();
    return true;
  } catch {
    return false; // some file systems refuse fsync on a folder; the data itself is already flushed
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/**
 * Write through a temporary file beside the target: write, fsync the file, rename over the target,
 * then fsync the folder. A failure at any step removes the temporary file and leaves the old target
 * untouched, so a failed save never leaves half a file.
 */
export async function writeFileAtomic(filePath: string, data: string | Uint8Array, kind: FileKind, options: AtomicWriteOptions = {}): Promise<BridgeResult<SavedFile>> {
  const target = withExtension(filePath, kind);
  const tmp = `${target}.${process.pid}.${Date.now()}.part`;
  const step = options.onStep ?? (() => undefined);
  let handle: FileHandle | null = null;
  try {
    handle = await fs.open(tmp, 'wx');
    await step('opened');
    if (options.writer) await options.writer(handle, data);
    else await handle.writeFile(data);
    await step('written');
    await handle.sync();
    await step('synced');
    await handle.close();
    handle = null;
    await fs.rename(tmp, target);
    await step('renamed');
    if (await syncDirectory(path.dirname(target), options.platform)) await step('dir-synced');
    return ok({ path: target, name: path.basename(target) });
  } catch (e) {
    await handle?.close().catch(() => undefined);
    await fs.rm(tmp, { force: true }).catch(() => undefined);
    return err({ kind: 'io', message: `could not write ${path.basename(target)}: ${(e as Error).message}` });
  }
}

/** File-dialog filters for a kind (Electron's { name, extensions } shape). */
export function dialogFilters(kind: FileKind): { name: string; extensions: string[] }[] {
  const names: Record<FileKind, string> = {
    drawing: 'DXF drawing', project: 'Furrow project', points: 'Points (CSV)', dxf: 'DXF drawing',
    xlsx: 'Excel workbook', csv: 'CSV table', pdf: 'PDF report',
  };
  return [{ name: names[kind], extensions: [...FILE_KINDS[kind]] }];
}
