// The autosave controller: writes only unsaved, changed state; a clean close or save empties the
// slot; an open restore offer protects the older work; the interval comes from the address, the
// preference or the 3-minute default.
import { describe, expect, it } from 'vitest';
import { autosaveIntervalMs, createAutosave, describeSavedAt, localStorageRecovery, BROWSER_RECOVERY_KEY, type RecoveryApi } from '../../../renderer/src/state/recovery';

function memorySlot(): RecoveryApi & { content: { text: string; at: string } | null; writes: number } {
  const s = {
    content: null as { text: string; at: string } | null,
    writes: 0,
    read: async () => ({ ok: true as const, value: s.content ? { savedAt: s.content.at, project: s.content.text } : null }),
    write: async (text: string, at: string) => { s.writes++; s.content = { text, at }; return { ok: true as const, value: null }; },
    clear: async () => { s.content = null; return { ok: true as const, value: null }; },
  };
  return s;
}

describe('autosave', () => {
  it('writes unsaved state once per change and empties the slot on a clean close or save', async () => {
    const slot = memorySlot();
    let state: { v: number } | null = null;
    const a = createAutosave({ slot, unsaved: () => (state ? { key: state, text: () => JSON.stringify(state) } : null), now: () => new Date('2026-12-02T16:30:00Z') });
    expect(await a.tick()).toBe(false);
    expect(slot.writes).toBe(0);
    state = { v: 1 };
    expect(await a.tick()).toBe(true);
    expect(slot.content).toEqual({ text: '{"v":1}', at: '2026-12-02T16:30:00.000Z' });
    expect(await a.tick()).toBe(false); // unchanged: not written again
    state = { v: 2 };
    await a.closing(); // closing with unsaved edits keeps them
    expect(slot.content?.text).toBe('{"v":2}');
    state = null;
    await a.closing(); // a clean close
    expect(slot.content).toBeNull();
    state = { v: 3 };
    await a.tick();
    await a.cleared(); // a clean save
    expect(slot.content).toBeNull();
    expect(await a.tick()).toBe(true); // the same state is written again after a clear
  });

  it('leaves the slot alone while a restore offer is open', async () => {
    const slot = memorySlot();
    slot.content = { text: 'older work', at: '2026-12-01T09:00:00Z' };
    let state: object | null = null;
    const a = createAutosave({ slot, unsaved: () => (state ? { key: state, text: () => 'newer' } : null), now: () => new Date() });
    a.hold(true);
    await a.closing();
    state = {};
    expect(await a.tick()).toBe(false);
    await a.cleared();
    expect(slot.content?.text).toBe('older work');
    a.hold(false);
    expect(await a.tick()).toBe(true);
    expect(slot.content?.text).toBe('newer');
  });

  it('takes the interval from the address, else the preference, else 3 minutes', () => {
    expect(autosaveIntervalMs('', null)).toBe(180_000);
    expect(autosaveIntervalMs('?autosaveSeconds=2', '10')).toBe(2_000);
    expect(autosaveIntervalMs('', '10')).toBe(600_000);
    expect(autosaveIntervalMs('?autosaveSeconds=-1', 'x')).toBe(180_000);
    expect(autosaveIntervalMs('', '0')).toBe(180_000);
    expect(autosaveIntervalMs('', '1000')).toBe(180_000);
  });

  it('describes the autosave time and survives a bad one', () => {
    expect(describeSavedAt('2026-12-02T16:30:00Z')).toMatch(/2026/);
    expect(describeSavedAt('garbage')).toBe('an unknown time');
  });

  it('keeps the browser slot in storage and ignores a damaged entry', async () => {
    const map = new Map<string, string>();
    const storage = { getItem: (k: string) => map.get(k) ?? null, setItem: (k: string, v: string) => { map.set(k, v); }, removeItem: (k: string) => { map.delete(k); } } as unknown as Storage;
    const slot = localStorageRecovery(storage);
    expect(await slot.read()).toEqual({ ok: true, value: null });
    await slot.write('{"p":1}', '2026-12-02T16:30:00.000Z');
    expect(await slot.read()).toEqual({ ok: true, value: { savedAt: '2026-12-02T16:30:00.000Z', project: '{"p":1}' } });
    map.set(BROWSER_RECOVERY_KEY, '{oops');
    expect(await slot.read()).toEqual({ ok: true, value: null });
    await slot.clear();
    expect(map.has(BROWSER_RECOVERY_KEY)).toBe(false);
    const full = localStorageRecovery({ ...storage, setItem: () => { throw new Error('quota exceeded'); } } as unknown as Storage);
    const r = await full.write('x', '2026-12-02T16:30:00.000Z');
    expect(!r.ok && r.error.message).toMatch(/quota/);
  });
});
