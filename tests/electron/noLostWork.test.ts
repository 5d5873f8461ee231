// No lost work, in Node without Electron: atomic saves that flush before and after the rename and
// leave the old file intact on any failure, write-back of drawings beside the original with backups,
// and the recovery slot that autosaves land in.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { syncDirectory, writeFileAtomic, type WriteStep } from '../../electron/handlers/fileAccess';
import { createRecoverySlot, RECOVERY_FILE } from '../../electron/handlers/recovery';
import { freeBackupPath, writeBackPath, writeKeepingBackup } from '../../electron/handlers/writeBack';
import { validateRecovery } from '../../electron/contract';

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'furrow-nolost-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

const partsIn = (dir: string): string[] => fs.readdirSync(dir).filter((n) => n.endsWith('.part'));

describe('atomic save', () => {
  it('writes, flushes the file, renames, then flushes the folder — in that order', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'order-'));
    const steps: WriteStep[] = [];
    const seenAtRename: string[] = [];
    const r = await writeFileAtomic(path.join(dir, 'job.furrow'), '{"a":1}', 'project', {
      onStep: (s) => {
        steps.push(s);
        // before the rename only the temporary file exists; afterwards only the target
        if (s === 'synced' || s === 'renamed') seenAtRename.push(fs.readdirSync(dir).sort().join(','));
      },
      platform: 'linux',
    });
    expect(r.ok).toBe(true);
    expect(steps).toEqual(['opened', 'written', 'synced', 'renamed', 'dir-synced']);
    expect(seenAtRename[0]).toMatch(/^job\.furrow\.\d+\.\d+\.part$/);
    expect(seenAtRename[1]).toBe('job.furrow');
    expect(fs.readFileSync(path.join(dir, 'job.furrow'), 'utf8')).toBe('{"a":1}');
  });

  it('flushes a folder on POSIX systems and skips it where the platform does not allow it', async () => {
    expect(await syncDirectory(tmp, 'linux')).toBe(true);
    expect(await syncDirectory(tmp, 'win32')).toBe(false);
    expect(await syncDirectory(path.join(tmp, 'no-such-folder'), 'linux')).toBe(false);
    const steps: WriteStep[] = [];
    const r = await writeFileAtomic(path.join(tmp, 'w.csv'), 'x', 'csv', { onStep: (s) => { steps.push(s); }, platform: 'win32' });
    expect(r.ok).toBe(true);
    expect(steps).toEqual(['opened', 'written', 'synced', 'renamed']);
  });

  it('keeps the old file intact when the writer fails half-way', async () => {
    const target = path.join(tmp, 'keep.furrow');
    fs.writeFileSync(target, 'OLD CONTENT');
    const r = await writeFileAtomic(target, 'NEW CONTENT THAT IS LONGER', 'project', {
      writer: async (fh, data) => {
        await fh.write(String(data).slice(0, 5));
        throw new Error('disk full (simulated)');
      },
    });
    expect(!r.ok && r.error.kind).toBe('io');
    expect(!r.ok && r.error.message).toMatch(/disk full/);
    expect(fs.readFileSync(target, 'utf8')).toBe('OLD CONTENT');
    expect(partsIn(tmp)).toEqual([]);
  });

  it('keeps the old file intact when the failure comes at the flush, before the rename', async () => {
    const target = path.join(tmp, 'flush.dxf');
    fs.writeFileSync(target, 'OLD');
    for (const failAt of ['opened', 'written', 'synced'] as WriteStep[]) {
      const r = await writeFileAtomic(target, 'NEW', 'dxf', { onStep: (s) => { if (s === failAt) throw new Error(`fail at ${s}`); } });
      expect(r.ok, failAt).toBe(false);
      expect(fs.readFileSync(target, 'utf8'), failAt).toBe('OLD');
    }
    expect(partsIn(tmp)).toEqual([]);
  });

  it('keeps the old file intact in a folder that cannot be written to', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'ro-'));
    const target = path.join(dir, 'site.dxf');
    fs.writeFileSync(target, 'ORIGINAL');
    fs.chmodSync(dir, 0o555);
    try {
      // root ignores folder permissions, so there the refusal to create the temporary file is simulated
      const r = await writeFileAtomic(target, 'NEW', 'dxf', {
        onStep: (s) => { if (s === 'opened' && process.getuid?.() === 0) throw new Error('EACCES (simulated for root)'); },
      });
      expect(r.ok).toBe(false);
      expect(fs.readFileSync(target, 'utf8')).toBe('ORIGINAL');
    } finally {
      fs.chmodSync(dir, 0o755);
    }
    expect(partsIn(dir)).toEqual([]);
  });
});

describe('drawing write-back', () => {
  it('offers a new file beside the original by default', () => {
    expect(writeBackPath('/jobs/brackenrise/site.dxf')).toBe(path.join('/jobs/brackenrise', 'site-trench.dxf'));
    expect(writeBackPath('/jobs/plan.DXF', '-routed')).toBe(path.join('/jobs', 'plan-routed.DXF'));
  });

  it('writes a new file without making a backup', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'wb-new-'));
    const r = await writeKeepingBackup(path.join(dir, 'site-trench.dxf'), 'NEW', 'dxf');
    expect(r.ok && r.value.backupPath).toBeNull();
    expect(fs.readdirSync(dir)).toEqual(['site-trench.dxf']);
  });

  it('copies the original to a backup before replacing it, and never overwrites an earlier backup', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'wb-orig-'));
    const original = path.join(dir, 'site.dxf');
    fs.writeFileSync(original, 'SURVEYOR ORIGINAL');
    const first = await writeKeepingBackup(original, 'ROUTED 1', 'dxf');
    expect(first.ok && first.value.backupPath).toBe(path.join(dir, 'site.bak.dxf'));
    expect(fs.readFileSync(path.join(dir, 'site.bak.dxf'), 'utf8')).toBe('SURVEYOR ORIGINAL');
    expect(fs.readFileSync(original, 'utf8')).toBe('ROUTED 1');
    const second = await writeKeepingBackup(original, 'ROUTED 2', 'dxf');
    expect(second.ok && second.value.backupPath).toBe(path.join(dir, 'site.bak2.dxf'));
    expect(fs.readFileSync(path.join(dir, 'site.bak.dxf'), 'utf8')).toBe('SURVEYOR ORIGINAL');
    expect(fs.readFileSync(path.join(dir, 'site.bak2.dxf'), 'utf8')).toBe('ROUTED 1');
    expect(fs.readFileSync(original, 'utf8')).toBe('ROUTED 2');
    expect(await freeBackupPath(original)).toBe(path.join(dir, 'site.bak3.dxf'));
  });

  it('keeps the original and its backup when the replacing write fails', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'wb-fail-'));
    const original = path.join(dir, 'site.dxf');
    fs.writeFileSync(original, 'SURVEYOR ORIGINAL');
    const r = await writeKeepingBackup(original, 'ROUTED', 'dxf', { writer: async () => { throw new Error('write failed (simulated)'); } });
    expect(r.ok).toBe(false);
    expect(fs.readFileSync(original, 'utf8')).toBe('SURVEYOR ORIGINAL');
    expect(fs.readFileSync(path.join(dir, 'site.bak.dxf'), 'utf8')).toBe('SURVEYOR ORIGINAL');
    expect(partsIn(dir)).toEqual([]);
  });

  it('does not replace the file when its backup cannot be made', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'wb-nobak-'));
    const original = path.join(dir, 'site.dxf');
    fs.writeFileSync(original, 'SURVEYOR ORIGINAL');
    let started = false;
    const r = await writeKeepingBackup(original, 'ROUTED', 'dxf', {
      copy: async () => { throw new Error('no space for the backup (simulated)'); },
      onStep: () => { started = true; },
    });
    expect(!r.ok && r.error.message).toMatch(/backup could not be made/);
    expect(started).toBe(false);
    expect(fs.readFileSync(original, 'utf8')).toBe('SURVEYOR ORIGINAL');
    expect(fs.readdirSync(dir)).toEqual(['site.dxf']);
  });

  it('skips past a backup name that is taken by a folder', async () => {
    const dir = fs.mkdtempSync(path.join(tmp, 'wb-taken-'));
    const original = path.join(dir, 'site.dxf');
    fs.writeFileSync(original, 'SURVEYOR ORIGINAL');
    fs.mkdirSync(path.join(dir, 'site.bak.dxf'));
    const r = await writeKeepingBackup(original, 'ROUTED', 'dxf');
    expect(r.ok && r.value.backupPath).toBe(path.join(dir, 'site.bak2.dxf'));
    expect(fs.readFileSync(path.join(dir, 'site.bak2.dxf'), 'utf8')).toBe('SURVEYOR ORIGINAL');
  });
});

describe('recovery slot', () => {
  it('is empty at first, holds the last autosave with its time, and is cleared', async () => {
    const dir = path.join(tmp, 'userData', 'recovery');
    const slot = createRecoverySlot(dir);
    expect(await slot.read()).toBeNull();
    expect((await slot.write('{"format":"furrow-project"}', '2026-12-02T16:20:00.000Z')).ok).toBe(true);
    expect((await slot.write('{"format":"furrow-project","v":2}', '2026-12-02T16:23:00.000Z')).ok).toBe(true);
    expect(await slot.read()).toEqual({ savedAt: '2026-12-02T16:23:00.000Z', project: '{"format":"furrow-project","v":2}' });
    expect(fs.readdirSync(dir)).toEqual([RECOVERY_FILE]);
    await slot.clear();
    expect(await slot.read()).toBeNull();
    await slot.clear(); // clearing an empty slot is fine
  });

  it('ignores a damaged slot instead of offering it', async () => {
    const dir = path.join(tmp, 'damaged');
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(path.join(dir, RECOVERY_FILE), '{"savedAt": 3');
    expect(await createRecoverySlot(dir).read()).toBeNull();
    fs.writeFileSync(path.join(dir, RECOVERY_FILE), '{"savedAt": 3, "project": "x"}');
    expect(await createRecoverySlot(dir).read()).toBeNull();
  });

  it('validates what the renderer sends for the slot', () => {
    expect(validateRecovery('{"x":1}', '2026-12-02T16:20:00.000Z').ok).toBe(true);
    for (const [t, at] of [['', '2026-12-02T16:20:00Z'], [42, '2026-12-02T16:20:00Z'], ['{}', 'yesterday'], ['{}', 7], ['{}', 'x'.repeat(100)]] as [unknown, unknown][]) {
      expect(validateRecovery(t, at).ok, JSON.stringify([t, at])).toBe(false);
    }
  });
});
