// The settings file: defaults round-trip, every key documented, bad keys and values named.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_ROUTE, DEFAULT_TRENCH, DEFAULT_UTILITIES, defaultSettings } from '../../core/settings';
import {
  CABLE_FIELDS, COVER_FIELDS, LAYER_FIELDS, PRICE_FIELDS, ROUTE_FIELDS, TOP_KEYS, TRENCH_FIELDS, UTILITY_FIELDS,
  parseSettingsFile, validateSettings,
} from '../../core/settingsFile';

const DOC = readFileSync(join(__dirname, '..', '..', 'core', 'SETTINGS.md'), 'utf8');

describe('settings file', () => {
  it('an empty object gives the defaults', () => {
    const r = parseSettingsFile('{}');
    expect(r.ok && r.value).toEqual(defaultSettings());
  });

  it('the defaults themselves pass validation (every default key is in the schema and in range)', () => {
    const r = validateSettings(JSON.parse(JSON.stringify(defaultSettings())));
    expect(r.ok ? [] : r.error.issues).toEqual([]);
    for (const k of Object.keys(DEFAULT_ROUTE)) expect(ROUTE_FIELDS[k]).toBeDefined();
    for (const k of Object.keys(DEFAULT_TRENCH)) expect(TRENCH_FIELDS[k]).toBeDefined();
    for (const u of DEFAULT_UTILITIES) for (const k of Object.keys(u)) if (k !== 'coverIn' && k !== 'cable') expect(UTILITY_FIELDS[k]).toBeDefined();
  });

  it('documents every key in core/SETTINGS.md', () => {
    const all = [...TOP_KEYS, ...Object.keys(ROUTE_FIELDS), ...Object.keys(TRENCH_FIELDS), ...Object.keys(UTILITY_FIELDS),
      ...Object.keys(COVER_FIELDS), ...Object.keys(CABLE_FIELDS), ...Object.keys(PRICE_FIELDS), ...Object.keys(LAYER_FIELDS)];
    const missing = all.filter((k) => !DOC.includes(`\`${k}\``) && !DOC.includes(`.${k}\``));
    expect(missing).toEqual([]);
  });

  it('names unknown keys at every level', () => {
    const r = parseSettingsFile(JSON.stringify({ colour: 1, route: { cellSize: 1 }, trench: { soilType: 'B' }, utilities: [{ key: 'power', coverInches: 3 }] }), 'job.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.issues.map((i) => i.key)).toEqual(['colour', 'route.cellSize', 'trench.soilType', 'utilities[0].coverInches']);
    expect(r.error.message).toMatch(/^job\.json: colour: unknown key/);
  });

  it('reports every out-of-range value with its key, range and unit', () => {
    const r = parseSettingsFile(JSON.stringify({
      route: { cellM: 0, timeBudgetMs: 12.5, style: 'diagonal' },
      trench: { swell: 2, soil: 'D' },
      utilities: [{ key: 'power', coverIn: { soft: -1 } }],
    }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const byKey = Object.fromEntries(r.error.issues.map((i) => [i.key, i.message]));
    expect(byKey['route.cellM']).toBe('0 is out of range: must be more than 0 and at most 10 m');
    expect(byKey['route.timeBudgetMs']).toMatch(/whole number/);
    expect(byKey['route.style']).toMatch(/'orthogonal', 'octilinear', 'any-angle'/);
    expect(byKey['trench.swell']).toMatch(/at most 1\.5/);
    // OSHA 29 CFR 1926 Subpart P App. A: soil types A, B, C (plus stable rock)
    expect(byKey['trench.soil']).toMatch(/'A', 'B', 'C', 'rock'/);
    expect(byKey['utilities[0].coverIn.soft']).toMatch(/-1 is out of range: must be at least 0/);
  });

  it('accepts local rules: NEC 2023 Table 300.5 24 in under roads, OSHA type C with sloping', () => {
    // NEC 2023 Table 300.5 (quoted): 24 in in streets, roads and parking lots for every column
    const r = parseSettingsFile(JSON.stringify({ units: 'ft', trench: { soil: 'C', protective: 'sloping' }, utilities: [{ key: 'power', coverIn: { soft: 24, pavement: 24 } }] }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.units).toBe('ft');
    expect(r.value.utilities).toHaveLength(1);
    expect(r.value.utilities[0]).toEqual({ ...DEFAULT_UTILITIES[0], coverIn: { soft: 24, pavement: 24 } });
    expect(r.value.trench.soil).toBe('C');
  });

  it('needs every key of a new utility and names the missing ones', () => {
    const r = parseSettingsFile(JSON.stringify({ utilities: [{ key: 'irrigation', label: 'Irrigation', color: '#800080' }] }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const keys = r.error.issues.map((i) => i.key);
    for (const k of ['kind', 'diameterIn', 'perService', 'bendLimitDeg', 'maxPullM', 'tracer', 'coverIn']) expect(keys).toContain(`utilities[0].${k}`);
  });

  it('checks layer names: forbidden characters and names equal ignoring case', () => {
    const r = parseSettingsFile(JSON.stringify({ dxfLayers: { centerline: 'A:B', outline: 'trench-notes' } }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.issues.map((i) => i.key)).toEqual(['dxfLayers.centerline', 'dxfLayers']);
  });

  it('points at the line of a JSON syntax error', () => {
    const r = parseSettingsFile('{\n  "route": {\n    "cellM": 0.5,\n  }\n}', 'mine.json');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.kind).toBe('json');
    expect(r.error.message).toMatch(/^mine\.json, line 4: not valid JSON/);
  });

  it('does not mutate the shared defaults', () => {
    const before = JSON.stringify(defaultSettings());
    parseSettingsFile(JSON.stringify({ route: { cellM: 1 }, utilities: [{ key: 'power', coverIn: { soft: 30 } }] }));
    expect(JSON.stringify(defaultSettings())).toBe(before);
  });
});
