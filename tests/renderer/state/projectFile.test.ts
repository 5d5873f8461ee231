// The project file: round trip, and clear refusals for damaged or newer files.
import { describe, expect, it } from 'vitest';
import { DEFAULT_ROUTE } from '../../../core/settings';
import { parseProject, serializeProject, PROJECT_SCHEMA_VERSION } from '../../../renderer/src/state/projectFile';
import type { ProjectState } from '../../../renderer/src/state/edits';

const KEYS = ['power', 'telecom', 'water', 'gas'];
const state: ProjectState = {
  roles: { BLDG: 'building' }, units: 'ft', utilitiesOn: ['power', 'gas'],
  route: { ...DEFAULT_ROUTE, style: 'orthogonal', cellM: 0.25 },
  points: [{ id: 'S1', x: 512045.5, y: 4180085.25, role: 'service', utilities: ['power'] }],
};

describe('project file', () => {
  it('round-trips the drawing and every edit', () => {
    const text = serializeProject('site.dxf', '0\nEOF\n', state);
    const p = parseProject(text, KEYS);
    expect(p.ok).toBe(true);
    if (!p.ok) return;
    expect(p.value.schemaVersion).toBe(PROJECT_SCHEMA_VERSION);
    expect(p.value.drawing).toEqual({ name: 'site.dxf', text: '0\nEOF\n' });
    expect(p.value.units).toBe('ft');
    expect(p.value.state).toEqual({ roles: state.roles, points: state.points, route: state.route, utilitiesOn: state.utilitiesOn });
  });

  it('says which problem a bad file has', () => {
    const good = JSON.parse(serializeProject('site.dxf', '0\nEOF\n', state));
    const cases: [unknown, RegExp][] = [
      ['{', /not JSON/],
      [{ ...good, format: 'other' }, /not a Furrow project/],
      [{ ...good, schemaVersion: PROJECT_SCHEMA_VERSION + 1 }, /newer Furrow/],
      [{ ...good, schemaVersion: 0 }, /schemaVersion/],
      [{ ...good, drawing: { name: 'x' } }, /drawing/],
      [{ ...good, state: { ...good.state, roles: { BLDG: 'castle' } } }, /unknown role/],
      [{ ...good, state: { ...good.state, points: [good.state.points[0], good.state.points[0]] } }, /repeats the id/],
      [{ ...good, state: { ...good.state, points: [{ ...good.state.points[0], utilities: ['steam'] }] } }, /utilities/],
      [{ ...good, state: { ...good.state, route: { ...good.state.route, cellM: -1 } } }, /route cellM/],
      [{ ...good, state: { ...good.state, route: { ...good.state.route, style: 'curvy' } } }, /route style/],
    ];
    for (const [data, msg] of cases) {
      const r = parseProject(typeof data === 'string' ? data : JSON.stringify(data), KEYS);
      expect(r.ok, String(msg)).toBe(false);
      if (!r.ok) expect(r.error.message).toMatch(msg);
    }
  });
});
