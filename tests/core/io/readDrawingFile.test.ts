// Reading a drawing from disk: the size limit is checked before the file is read, and every error
// names the file.
import { describe, expect, it } from 'vitest';
import { readDrawingFile } from '../../../core/io/readDrawingFile';
import { fixturePath } from '../dxf/fixtures';

describe('readDrawingFile', () => {
  it('reads a drawing', async () => {
    const r = await readDrawingFile(fixturePath('good_small.dxf'));
    expect(r.ok && r.value.entities.length).toBe(1);
  });

  it('refuses a file over the size limit with its size and the limit, naming the file', async () => {
    const r = await readDrawingFile(fixturePath('good_small.dxf'), { maxBytes: 4096 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.kind).toBe('too-large');
      expect(r.error.message).toContain('good_small.dxf');
      expect(r.error.message).toMatch(/the file is 1\d\.\d kB, over the 4\.0 kB limit/);
    }
  });

  it('names a missing file and a directory', async () => {
    const a = await readDrawingFile(fixturePath('missing.dxf'));
    expect(!a.ok && a.error.kind).toBe('not-found');
    const b = await readDrawingFile(fixturePath(''));
    expect(!b.ok && b.error.kind).toBe('unreadable');
  });

  it('passes reader errors on with the file name', async () => {
    const r = await readDrawingFile(fixturePath('binary.dxf'));
    expect(!r.ok && r.error.kind).toBe('binary');
    expect(!r.ok && r.error.message.startsWith(fixturePath('binary.dxf'))).toBe(true);
  });
});
