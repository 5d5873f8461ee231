// Read a DXF file from disk: size checked before reading, then decoded and parsed by readDxfBytes.

import { readFile, stat } from 'node:fs/promises';
import type { Drawing, DxfReadErrorKind } from '../dxf/drawing';
import { DEFAULT_MAX_BYTES, readDxfBytes, tooLarge, type ReadDxfOptions } from '../dxf/readDxf';
import { err, type Result } from '../result';

export interface DrawingFileError {
  kind: DxfReadErrorKind | 'not-found' | 'unreadable';
  /** Names the file and what to do. */
  message: string;
  path: string;
}

export async function readDrawingFile(path: string, opts: ReadDxfOptions = {}): Promise<Result<Drawing, DrawingFileError>> {
  let size: number;
  try {
    const st = await stat(path);
    if (!st.isFile()) return err({ kind: 'unreadable', path, message: `${path}: not a file; give the path of a .dxf drawing` });
    size = st.size;
  } catch {
    return err({ kind: 'not-found', path, message: `${path}: no such file; check the path` });
  }
  const max = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  if (size > max) {
    return err({ kind: 'too-large', path, message: `${path}: ${tooLarge(size, max).message}` });
  }
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch (x) {
    return err({ kind: 'unreadable', path, message: `${path}: cannot read the file (${x instanceof Error ? x.message : String(x)})` });
  }
  const r = readDxfBytes(bytes, opts);
  if (!r.ok) return err({ kind: r.error.kind, path, message: `${path}: ${r.error.message}` });
  return r;
}
