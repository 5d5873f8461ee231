// Undo/redo over immutable project states with change diffs.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_ROUTE } from '../../../core/settings';
import type { PointInput } from '../../../core/site/site';
import { applyDiff, diffFor, invertDiff, type Edit, type ProjectState } from '../../../renderer/src/state/edits';
import { createProjectStore } from '../../../renderer/src/state/history';

const base = (): ProjectState => Object.freeze({
  roles: Object.freeze({ BLDG: 'building', ROAD: 'pavement' }),
  points: Object.freeze([{ id: 'POC1', x: 0, y: 0, role: 'connection', utilities: ['power'] } as PointInput]),
  route: Object.freeze({ ...DEFAULT_ROUTE }),
  utilitiesOn: Object.freeze(['power', 'telecom']),
  units: null,
});

describe('project edits', () => {
  it('records each kind of edit as a diff and undo restores the exact earlier state', () => {
    const s = createProjectStore(base());
    const states = [s.get()];
    const edits: Edit[] = [
      { kind: 'set-role', layer: 'BLDG', role: 'ignore' },
      { kind: 'add-point', point: { id: 'S1', x: 5, y: 5, role: 'service', utilities: ['power'] } },
      { kind: 'update-point', id: 'S1', patch: { x: 6, utilities: ['power', 'telecom'] } },
      { kind: 'set-route', key: 'cellM', value: 0.25 },
      { kind: 'set-utilities-on', keys: ['power'] },
      { kind: 'set-units', units: 'ft' },
      { kind: 'remove-point', id: 'POC1' },
      { kind: 'replace-points', points: [{ id: 'A', x: 1, y: 2, role: 'service', utilities: ['power'] }] },
    ];
    for (const e of edits) { expect(s.edit(e)).toBe(true); states.push(s.get()); }
    expect(s.get().points.map((p) => p.id)).toEqual(['A']);
    for (let i = edits.length; i > 0; i--) { expect(s.undo()).toBe(true); expect(s.get()).toEqual(states[i - 1]); }
    expect(s.undo()).toBe(false);
    for (let i = 1; i <= edits.length; i++) { expect(s.redo()).toBe(true); expect(s.get()).toEqual(states[i]); }
    expect(s.redo()).toBe(false);
  });

  it('does not record edits that change nothing, and a new edit clears redo', () => {
    const s = createProjectStore(base());
    expect(s.edit({ kind: 'set-role', layer: 'BLDG', role: 'building' })).toBe(false);
    expect(s.canUndo()).toBe(false);
    s.edit({ kind: 'set-route', key: 'bendPenaltyM', value: 5 });
    s.undo();
    expect(s.canRedo()).toBe(true);
    s.edit({ kind: 'set-route', key: 'seed', value: 9 });
    expect(s.canRedo()).toBe(false);
    expect(s.undoLabel()).toBe('Route seed');
  });

  it('never mutates a state it was given (states are frozen)', () => {
    const b = base();
    const d = diffFor(b, { kind: 'add-point', point: { id: 'S9', x: 1, y: 1, role: 'service', utilities: ['power'] } });
    const next = applyDiff(b, d);
    expect(b.points.length).toBe(1);
    expect(next.points.length).toBe(2);
    expect(Object.isFrozen(next)).toBe(true);
    expect(() => (next.points as PointInput[]).push(b.points[0])).toThrow();
  });

  it('refuses a duplicate point id and unknown ids', () => {
    const b = base();
    expect(() => diffFor(b, { kind: 'add-point', point: { ...b.points[0] } })).toThrow(/already used/);
    expect(() => diffFor(b, { kind: 'remove-point', id: 'nope' })).toThrow(/no point/);
  });

  it('apply then apply-inverse is the identity for random edit sequences (property)', () => {
    const edit = fc.oneof(
      fc.record({ kind: fc.constant('set-role' as const), layer: fc.constantFrom('BLDG', 'ROAD', 'NEW'), role: fc.constantFrom('building' as const, 'ignore' as const, 'crossing' as const) }),
      fc.record({ kind: fc.constant('set-route' as const), key: fc.constantFrom('cellM' as const, 'seed' as const), value: fc.integer({ min: 1, max: 9 }) }),
      fc.record({ kind: fc.constant('add-point' as const), point: fc.record({ id: fc.constantFrom('S1', 'S2', 'S3'), x: fc.double({ noNaN: true, min: -1e6, max: 1e6 }), y: fc.double({ noNaN: true, min: -1e6, max: 1e6 }), role: fc.constant('service' as const), utilities: fc.constant(['power']) }) }),
    );
    fc.assert(fc.property(fc.array(edit, { maxLength: 12 }), (edits) => {
      let s = base();
      for (const e of edits) {
        let d;
        try { d = diffFor(s, e as Edit); } catch { continue; } // duplicate ids are refused
        const next = applyDiff(s, d);
        expect(applyDiff(next, invertDiff(d))).toEqual(s);
        s = next;
      }
    }), { numRuns: 200 });
  });
});
