// The settings file: JSON that overrides the defaults in core/settings.ts. Every key is known
// to the schema below (type, unit, range); unknown keys and out-of-range values are errors that
// name the key. Documented in core/SETTINGS.md.

import { err, ok, type Result } from './result';
import {
  DEFAULT_DXF_LAYERS, defaultSettings, type DxfLayerNames, type PriceItem, type Settings, type UtilitySetting,
} from './settings';

export interface SettingsIssue {
  /** Dotted path of the key, e.g. 'route.cellM' or 'utilities[2].coverIn.soft'. */
  key: string;
  message: string;
}

export interface SettingsError {
  kind: 'json' | 'invalid';
  /** One line per issue, each naming the key and what to do. */
  message: string;
  issues: SettingsIssue[];
}

type Field =
  | { type: 'number'; min: number; max: number; minOpen?: boolean; integer?: boolean; unit: string }
  | { type: 'enum'; values: readonly string[] }
  | { type: 'boolean' }
  | { type: 'string'; pattern?: RegExp; hint?: string };

const num = (min: number, max: number, unit: string, extra: { minOpen?: boolean; integer?: boolean } = {}): Field => ({ type: 'number', min, max, unit, ...extra });

/** Route keys (see RouteSettings). */
export const ROUTE_FIELDS: Record<string, Field> = {
  style: { type: 'enum', values: ['orthogonal', 'octilinear', 'any-angle'] },
  cellM: num(0, 10, 'm', { minOpen: true }),
  clearanceM: num(0, 20, 'm'),
  pavementFactor: num(1, 100, 'ratio'),
  crossingPenaltyM: num(0, 1000, 'm'),
  bendPenaltyM: num(0, 1000, 'm'),
  snapToleranceM: num(0, 50, 'm'),
  timeBudgetMs: num(10, 600_000, 'ms', { integer: true }),
  seed: num(0, 2 ** 31 - 1, '-', { integer: true }),
};

/** Trench keys (see TrenchSettings). */
export const TRENCH_FIELDS: Record<string, Field> = {
  sideClearanceIn: num(0, 60, 'in'),
  minWidthIn: num(0, 240, 'in', { minOpen: true }),
  ductSpacingIn: num(0, 24, 'in'),
  beddingIn: num(0, 36, 'in'),
  soil: { type: 'enum', values: ['A', 'B', 'C', 'rock', 'unclassified'] },
  protective: { type: 'enum', values: ['shoring', 'sloping'] },
  swell: num(0, 1.5, 'fraction'),
  pavementOvercutIn: num(0, 60, 'in'),
  stubUpM: num(0, 10, 'm'),
  countRiserBends: { type: 'boolean' },
  utilitySeparationIn: num(0, 60, 'in'),
  ductsPerRow: num(1, 12, 'count', { integer: true }),
  importBackfill: { type: 'boolean' },
};

/** Per-utility keys (see UtilitySetting); `cable` and `coverIn` are nested. */
export const UTILITY_FIELDS: Record<string, Field> = {
  key: { type: 'string', pattern: /^[a-z][a-z0-9_-]{0,31}$/, hint: 'lower-case letters, digits, - or _, starting with a letter' },
  label: { type: 'string', pattern: /^.{1,80}$/, hint: '1 to 80 characters' },
  color: { type: 'string', pattern: /^#[0-9A-Fa-f]{6}$/, hint: "'#RRGGBB'" },
  kind: { type: 'enum', values: ['radial', 'main'] },
  diameterIn: num(0, 48, 'in', { minOpen: true }),
  perService: num(1, 12, 'count', { integer: true }),
  bendLimitDeg: num(0, 1440, 'deg'),
  maxPullM: num(0, 10_000, 'm'),
  tracer: { type: 'boolean' },
  source: { type: 'string' },
};
export const COVER_FIELDS: Record<string, Field> = { soft: num(0, 240, 'in'), pavement: num(0, 240, 'in') };
export const CABLE_FIELDS: Record<string, Field> = {
  weightLbPerFt: num(0, 100, 'lb/ft', { minOpen: true }),
  friction: num(0, 2, 'ratio', { minOpen: true }),
  maxTensionLb: num(0, 100_000, 'lb', { minOpen: true }),
};
export const PRICE_FIELDS: Record<string, Field> = {
  key: { type: 'string', pattern: /^[A-Za-z0-9_.-]{1,80}$/, hint: 'letters, digits, . - _' },
  description: { type: 'string' },
  unit: { type: 'enum', values: ['m', 'm2', 'm3', 'ft', 'yd2', 'yd3', 'ea'] },
  price: num(0, 1e9, 'currency'),
};
// DXF layer names may not contain < > / \ " : ; ? * | = ` (DXF reference, symbol table names).
export const LAYER_FIELDS: Record<string, Field> = Object.fromEntries(
  Object.keys(DEFAULT_DXF_LAYERS).map((k) => [k, { type: 'string', pattern: /^[^<>/\\":;?*|=`]{1,255}$/, hint: 'a DXF layer name without < > / \\ " : ; ? * | = `' }]),
);
export const TOP_KEYS = ['units', 'route', 'trench', 'utilities', 'currency', 'prices', 'dxfLayers'] as const;

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function checkField(key: string, v: unknown, f: Field, issues: SettingsIssue[]): boolean {
  switch (f.type) {
    case 'number': {
      if (typeof v !== 'number' || !Number.isFinite(v)) { issues.push({ key, message: `must be a number (${f.unit}), got ${JSON.stringify(v)}` }); return false; }
      const low = f.minOpen ? v <= f.min : v < f.min;
      if (low || v > f.max) {
        issues.push({ key, message: `${v} is out of range: must be ${f.minOpen ? 'more than' : 'at least'} ${f.min} and at most ${f.max}${f.unit === '-' ? '' : ' ' + f.unit}` });
        return false;
      }
      if (f.integer && !Number.isInteger(v)) { issues.push({ key, message: `must be a whole number, got ${v}` }); return false; }
      return true;
    }
    case 'enum':
      if (typeof v !== 'string' || !f.values.includes(v)) { issues.push({ key, message: `must be one of ${f.values.map((x) => `'${x}'`).join(', ')}, got ${JSON.stringify(v)}` }); return false; }
      return true;
    case 'boolean':
      if (typeof v !== 'boolean') { issues.push({ key, message: `must be true or false, got ${JSON.stringify(v)}` }); return false; }
      return true;
    case 'string':
      if (typeof v !== 'string' || (f.pattern && !f.pattern.test(v))) { issues.push({ key, message: `must be ${f.hint ?? 'text'}, got ${JSON.stringify(v)}` }); return false; }
      return true;
  }
}

/** Copy the known, valid keys of `src` onto `dst`; report unknown and invalid ones. */
function applyFields(path: string, src: unknown, fields: Record<string, Field>, dst: Record<string, unknown>, issues: SettingsIssue[]): void {
  if (!isObj(src)) { issues.push({ key: path, message: 'must be an object { ... }' }); return; }
  for (const [k, v] of Object.entries(src)) {
    const key = `${path}.${k}`;
    const f = Object.prototype.hasOwnProperty.call(fields, k) ? fields[k] : undefined;
    if (!f) { issues.push({ key, message: `unknown key; known keys: ${Object.keys(fields).join(', ')}` }); continue; }
    if (checkField(key, v, f, issues)) dst[k] = v;
  }
}

function parseUtility(path: string, src: unknown, defaults: readonly UtilitySetting[], issues: SettingsIssue[]): UtilitySetting | null {
  if (!isObj(src)) { issues.push({ key: path, message: 'must be an object with at least a "key"' }); return null; }
  const base = defaults.find((d) => d.key === src.key);
  const out: Record<string, unknown> = base ? { ...base, coverIn: { ...base.coverIn }, ...(base.cable ? { cable: { ...base.cable } } : {}) } : {};
  const plain: Record<string, unknown> = Object.create(null); // '__proto__' stays a key, refused below
  for (const [k, v] of Object.entries(src)) if (k !== 'coverIn' && k !== 'cable') plain[k] = v;
  applyFields(path, plain, UTILITY_FIELDS, out, issues);
  if ('coverIn' in src) {
    const cover: Record<string, unknown> = { ...((out.coverIn as object) ?? {}) };
    applyFields(`${path}.coverIn`, src.coverIn, COVER_FIELDS, cover, issues);
    out.coverIn = cover;
  }
  if ('cable' in src) {
    if (src.cable === null) delete out.cable;
    else {
      const cable: Record<string, unknown> = { ...((out.cable as object) ?? {}) };
      applyFields(`${path}.cable`, src.cable, CABLE_FIELDS, cable, issues);
      for (const k of Object.keys(CABLE_FIELDS)) if (!(k in cable)) issues.push({ key: `${path}.cable.${k}`, message: 'missing; cable data needs weightLbPerFt, friction and maxTensionLb' });
      out.cable = cable;
    }
  }
  if (!base) {
    if (!('source' in out)) out.source = 'settings file';
    for (const k of Object.keys(UTILITY_FIELDS)) if (!(k in out)) issues.push({ key: `${path}.${k}`, message: `missing; a new utility ('${String(src.key)}') needs every key: ${Object.keys(UTILITY_FIELDS).join(', ')}, coverIn` });
    const cover = out.coverIn as Record<string, unknown> | undefined;
    if (!cover || !('soft' in cover) || !('pavement' in cover)) issues.push({ key: `${path}.coverIn`, message: 'missing; give { "soft": in, "pavement": in }' });
  }
  return out as unknown as UtilitySetting;
}

/**
 * Parse and validate a settings file (JSON text) on top of the defaults. `source` names the
 * file in messages. Every problem is reported, each naming its key.
 */
export function parseSettingsFile(text: string, source = 'settings.json'): Result<Settings, SettingsError> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (x) {
    const msg = x instanceof Error ? x.message : String(x);
    const at = /position (\d+)/.exec(msg);
    const line = at ? text.slice(0, Number(at[1])).split('\n').length : null;
    return err({ kind: 'json', issues: [], message: `${source}${line ? `, line ${line}` : ''}: not valid JSON (${msg}); fix the syntax (double-quoted keys, no trailing commas)` });
  }
  return validateSettings(data, source);
}

/** Validate already-parsed settings data (from the app or a project file) on top of the defaults. */
export function validateSettings(data: unknown, source = 'settings'): Result<Settings, SettingsError> {
  const issues: SettingsIssue[] = [];
  const s = defaultSettings();
  if (!isObj(data)) return err({ kind: 'invalid', issues: [{ key: '(top)', message: 'must be a JSON object { ... }' }], message: `${source}: must be a JSON object { ... }` });
  for (const [k, v] of Object.entries(data)) {
    switch (k) {
      case 'units':
        if (checkField('units', v, { type: 'enum', values: ['m', 'ft'] }, issues)) s.units = v as 'm' | 'ft';
        break;
      case 'route': applyFields('route', v, ROUTE_FIELDS, s.route as unknown as Record<string, unknown>, issues); break;
      case 'trench': applyFields('trench', v, TRENCH_FIELDS, s.trench as unknown as Record<string, unknown>, issues); break;
      case 'currency':
        if (checkField('currency', v, { type: 'string', pattern: /^[A-Z]{3}$/, hint: 'a three-letter ISO 4217 code such as "USD"' }, issues)) s.currency = v as string;
        break;
      case 'utilities': {
        if (!Array.isArray(v)) { issues.push({ key: 'utilities', message: 'must be a list [ { "key": ... }, ... ]' }); break; }
        const list = v.map((u, i) => parseUtility(`utilities[${i}]`, u, s.utilities, issues)).filter((u): u is UtilitySetting => u !== null);
        const keys = list.map((u) => u.key);
        keys.forEach((key, i) => { if (keys.indexOf(key) !== i) issues.push({ key: `utilities[${i}].key`, message: `'${key}' appears twice; each utility key once` }); });
        // Listed utilities replace the defaults; a default not listed is dropped only when the list is given.
        s.utilities = list;
        break;
      }
      case 'prices': {
        if (!Array.isArray(v)) { issues.push({ key: 'prices', message: 'must be a list [ { "key", "description", "unit", "price" }, ... ]' }); break; }
        const list: PriceItem[] = [];
        v.forEach((p, i) => {
          const out: Record<string, unknown> = {};
          applyFields(`prices[${i}]`, p, PRICE_FIELDS, out, issues);
          for (const f of Object.keys(PRICE_FIELDS)) if (isObj(p) && !(f in p)) issues.push({ key: `prices[${i}].${f}`, message: 'missing; each price needs key, description, unit and price' });
          list.push(out as unknown as PriceItem);
        });
        const keys = list.map((p) => p.key);
        keys.forEach((key, i) => { if (key !== undefined && keys.indexOf(key) !== i) issues.push({ key: `prices[${i}].key`, message: `'${key}' appears twice` }); });
        s.prices = list;
        break;
      }
      case 'dxfLayers': {
        const names: Record<string, unknown> = { ...DEFAULT_DXF_LAYERS };
        applyFields('dxfLayers', v, LAYER_FIELDS, names, issues);
        const vals = Object.values(names).map((n) => String(n).toUpperCase());
        if (new Set(vals).size !== vals.length) issues.push({ key: 'dxfLayers', message: 'two layers have the same name (DXF layer names ignore case); give each its own' });
        s.dxfLayers = names as unknown as DxfLayerNames;
        break;
      }
      default:
        issues.push({ key: k, message: `unknown key; known keys: ${TOP_KEYS.join(', ')}` });
    }
  }
  if (issues.length) {
    return err({ kind: 'invalid', issues, message: issues.map((i) => `${source}: ${i.key}: ${i.message}`).join('\n') });
  }
  return ok(s);
}
