// Reading and writing the files the bridge deals in. Plain Node (no Electron) so it is tested directly.

import { promises as fs } from 'node:fs';
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

/** Write through a temporary file and rename, so a failed write never leaves half a file. */
export async function writeFileAtomic(filePath: string, data: string | Uint8Array, kind: FileKind): Promise<BridgeResult<SavedFile>> {
  const target = withExtension(filePath, kind);
  const tmp = `${target}.${process.pid}.${Date.now()}.part`;
  try {
    await fs.writeFile(tmp, data);
    await fs.rename(tmp, target);
    return ok({ path: target, name: path.basename(target) });
  } catch (e) {
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
