// Untrusted files. A drawing's text and layer names are data: markup in them comes back
// character for character as plain text (never decoded, stripped or interpreted), the same as
// the independent `dxf` npm reader gives. Settings and project files are data too: keys that
// reach an object's prototype chain (__proto__, constructor, toString...) are refused as unknown
// keys at every level, and numbers must be finite.
import { parseString } from 'dxf';
import { afterEach, describe, expect, it } from 'vitest';
import { readDxf } from '../../core/dxf/readDxf';
import { buildSite } from '../../core/site/buildSite';
import { inspectDrawing, inspectText } from '../../core/site/inspect';
import { parseSettingsFile, validateSettings } from '../../core/settingsFile';
import { defaultSettings } from '../../core/settings';
import { withEntities } from '../fuzz/seedDrawings';

const SCRIPT = '<script>alert("x")</script> & <img src=x onerror=alert(1)>';
const MTEXT_RAW = '{\\fArial|b1;<iframe src="javascript:alert(1)">}\\P&lt;b&gt;';

describe('markup in a drawing stays plain text', () => {
  const text = withEntities([
    [0, 'TEXT'], [8, 'NOTE<b>'], [10, 1], [20, 1], [30, 0], [40, 1], [1, SCRIPT],
    [0, 'MTEXT'], [8, 'NOTE'], [10, 2], [20, 2], [30, 0], [40, 1], [1, MTEXT_RAW],
  ]);

  it('TEXT and layer names come back verbatim, as the independent dxf reader gives them', () => {
    const r = readDxf(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const texts = r.value.entities.filter((e) => e.kind === 'text');
    const other = parseString(text).entities.filter((e: { type: string }) => e.type === 'TEXT');
    expect(other[0].string).toBe(SCRIPT);
    expect(texts[0]).toMatchObject({ text: other[0].string, layer: other[0].layer });
    expect(r.value.layers.map((l) => l.name)).toContain('NOTE<b>');
  });

  it('MTEXT loses only its formatting codes ({\\f...;} and \\P as a line break); markup and entities are not decoded', () => {
    const r = readDxf(text);
    if (!r.ok) throw new Error(r.error.message);
    const mt = r.value.entities.filter((e) => e.kind === 'text')[1];
    expect(mt.kind === 'text' && mt.text).toBe('<iframe src="javascript:alert(1)">\n&lt;b&gt;');
  });

  it('the inspect report carries the layer name as text', () => {
    const r = readDxf(text);
    if (!r.ok) throw new Error(r.error.message);
    const s = buildSite(r.value, { roles: { BLDG: 'building' } });
    const rep = inspectDrawing(r.value, s.ok ? s.value : s.error, { BLDG: 'building' });
    expect(rep.layers.map((l) => l.name)).toContain('NOTE<b>');
    expect(inspectText(rep)).toContain('NOTE<b>');
  });
});

describe('settings files cannot reach the prototype chain', () => {
  afterEach(() => {
    // nothing leaked onto Object.prototype or into fresh defaults
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(({} as Record<string, unknown>).cellM).toBeUndefined();
    expect(defaultSettings().route.cellM).toBe(0.5);
  });

  const refused: [string, string][] = [
    ['{"__proto__": {"polluted": 1}}', '__proto__'],
    ['{"constructor": {"polluted": 1}}', 'constructor'],
    ['{"route": {"__proto__": {"cellM": 5}}}', 'route.__proto__'],
    ['{"route": {"constructor": 1}}', 'route.constructor'],
    ['{"trench": {"toString": 1}}', 'trench.toString'],
    ['{"utilities": [{"key": "power", "__proto__": {"polluted": 1}}]}', 'utilities[0].__proto__'],
    ['{"utilities": [{"key": "power", "coverIn": {"__proto__": {"soft": 1}}}]}', 'utilities[0].coverIn.__proto__'],
    ['{"dxfLayers": {"constructor": "X"}}', 'dxfLayers.constructor'],
    ['{"prices": [{"key": "a", "description": "b", "unit": "m", "price": 1, "hasOwnProperty": 1}]}', 'prices[0].hasOwnProperty'],
  ];
  for (const [json, key] of refused) {
    it(`refuses ${key} as an unknown key`, () => {
      const r = parseSettingsFile(json);
      expect(r.ok, `${json} was accepted`).toBe(false);
      if (r.ok) return;
      expect(r.error.issues.map((i) => i.key)).toContain(key);
      expect(r.error.message).toContain('unknown key');
    });
  }

  it('refuses non-finite numbers: 1e999 in JSON (parses to Infinity), NaN and ±Infinity in parsed data', () => {
    const j = parseSettingsFile('{"route": {"cellM": 1e999}}');
    expect(j.ok).toBe(false);
    for (const v of [NaN, Infinity, -Infinity]) {
      const r = validateSettings({ route: { cellM: v }, trench: { swell: v } });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.issues.map((i) => i.key).sort()).toEqual(['route.cellM', 'trench.swell']);
    }
  });

  it('NaN, Infinity and bare words are not JSON: a syntax error naming the file', () => {
    for (const t of ['{"route": {"cellM": NaN}}', '{"route": {"cellM": Infinity}}']) {
      const r = parseSettingsFile(t, 'harrowmere-settings.json');
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toMatchObject({ kind: 'json' });
      if (!r.ok) expect(r.error.message).toContain('harrowmere-settings.json');
    }
  });
});
