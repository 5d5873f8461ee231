// The DXF reader: ASCII DXF text (R12 / AC1009 and R2000+) → `Drawing`, built on dxf-parser with
// robust handlers for POLYLINE, LWPOLYLINE, CIRCLE and ELLIPSE (see parserHandlers.ts). Bad input returns a
// DxfReadError value; nothing here throws on malformed files.

import DxfParser from 'dxf-parser';
import type { Drawing, DrawingLayer, DxfReadError, Extents } from './drawing';
import { err, ok, type Result } from '../result';
import { metresPerInsUnit, M_PER_FT } from '../units';
import { CircleHandler, EllipseHandler, LwPolylineHandler, PolylineHandler } from './parserHandlers';
import { Exploder } from './explode';
import { LIMITS } from '../limits';
import { findTablesSection, readLayerTable, type LayerRecord } from './layerTable';

export interface ReadDxfOptions {
  /** Largest chord error (sagitta) for curves, in drawing units. Default: 1 cm (metric) / 0.03 ft (imperial). */
  chordTolerance?: number;
  /** Refuse files larger than this many bytes (default 200 MB). */
  maxBytes?: number;
  /** Refuse drawings that expand (blocks included) to more entities than this (default 2 000 000). */
  maxEntities?: number;
  /** Refuse block references nested deeper than this (default 16). */
  maxBlockDepth?: number;
  /** Refuse drawings that expand to more polyline vertices than this, curves tessellated (default LIMITS.maxVertices, core/limits.ts). */
  maxVertices?: number;
}

// the defaults live in the one table of limits (core/limits.ts)
export const DEFAULT_MAX_BYTES = LIMITS.maxFileBytes;
export const DEFAULT_MAX_ENTITIES = LIMITS.maxEntities;
export const DEFAULT_MAX_BLOCK_DEPTH = LIMITS.maxBlockDepth;

const BINARY_SENTINEL = 'AutoCAD Binary DXF';
const IMPERIAL_CODES = new Set([1, 2, 3, 10, 21]);

const binaryError = (): DxfReadError => ({
  kind: 'binary',
  message: 'this is a binary DXF; Furrow reads ASCII DXF. Open it in your drawing program and save it again as ASCII (text) DXF, R12 or R2000 or later.',
});

/** Default chord tolerance in drawing units for a $INSUNITS code: 1 cm metric, 0.03 ft imperial, 0.01 unitless. */
export function defaultChordTolerance(insUnits: number): number {
  const mpu = metresPerInsUnit(insUnits);
  if (mpu === null) return 0.01;
  return IMPERIAL_CODES.has(insUnits) ? (0.03 * M_PER_FT) / mpu : 0.01 / mpu;
}

/** Decode DXF bytes (detects binary DXF; UTF-8, falling back to Windows-1252 for older files) and read them. */
export function readDxfBytes(bytes: Uint8Array, opts: ReadDxfOptions = {}): Result<Drawing, DxfReadError> {
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  if (bytes.length > maxBytes) return err(tooLarge(bytes.length, maxBytes));
  const head = String.fromCharCode(...bytes.subarray(0, BINARY_SENTINEL.length));
  if (head === BINARY_SENTINEL) return err(binaryError());
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    text = new TextDecoder('windows-1252').decode(bytes);
  }
  return readDxf(text, opts);
}

/** A byte count for messages: MB with one decimal from 1 MB up, else kB or bytes. */
export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} kB`;
  return `${n} bytes`;
}

export function tooLarge(size: number, max: number): DxfReadError {
  return {
    kind: 'too-large',
    message: `the file is ${formatBytes(size)}, over the ${formatBytes(max)} limit; purge unused layers and blocks, or raise the size limit`,
  };
}

/** Read ASCII DXF text into a Drawing. */
export function readDxf(text: string, opts: ReadDxfOptions = {}): Result<Drawing, DxfReadError> {
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  if (text.length > maxBytes) return err(tooLarge(text.length, maxBytes));
  if (text.startsWith(BINARY_SENTINEL)) return err(binaryError());
  if (text.trim() === '') return err({ kind: 'empty', message: 'the file is empty' });
  const pre = precheck(text);
  if (pre) return err(pre);

  const parser = new DxfParser();
  parser.registerEntityHandler(PolylineHandler as any);
  parser.registerEntityHandler(LwPolylineHandler as any);
  parser.registerEntityHandler(CircleHandler as any);
  parser.registerEntityHandler(EllipseHandler as any);
  // the TABLES section is read by readLayerTable and kept away from dxf-parser (see layerTable.ts)
  const tables = findTablesSection(text);
  const layerRecords = tables ? readLayerTable(text.slice(tables.start, tables.end)) : [];
  const body = tables ? text.slice(0, tables.start) + text.slice(tables.end) : text;
  let dxf: any;
  // dxf-parser reports odd groups on the console; the reader reports through its result instead
  const { warn, error, log } = console;
  try {
    console.warn = console.error = console.log = () => {};
    dxf = parser.parseSync(body);
  } catch (x) {
    const msg = x instanceof Error ? x.message : String(x);
    if (/end of input/i.test(msg)) {
      return err({ kind: 'truncated', message: `the file ends before its end-of-file marker (${msg}); it may be truncated — save or copy it again` });
    }
    return err({ kind: 'garbage', message: `the file is not valid DXF (${msg}); save it again as ASCII DXF` });
  } finally {
    console.warn = warn;
    console.error = error;
    console.log = log;
  }
  if (!dxf || !Array.isArray(dxf.entities)) {
    return err({ kind: 'no-model-space', message: 'the file has no ENTITIES section (no model-space drawing); export the site plan again' });
  }

  const header = dxf.header ?? {};
  const version = typeof header.$ACADVER === 'string' ? header.$ACADVER : 'AC1009';
  const insUnits = typeof header.$INSUNITS === 'number' && Number.isFinite(header.$INSUNITS) ? header.$INSUNITS : 0;
  const chordTolerance = opts.chordTolerance ?? defaultChordTolerance(insUnits);
  const maxEntities = opts.maxEntities ?? DEFAULT_MAX_ENTITIES;
  if (dxf.entities.length > maxEntities) {
    return err({ kind: 'limit', message: `the drawing has ${dxf.entities.length} entities, over the limit of ${maxEntities}; purge detail or raise the limit` });
  }
  const ex = new Exploder(dxf.blocks ?? {}, {
    chordTolerance,
    maxEntities,
    maxBlockDepth: opts.maxBlockDepth ?? DEFAULT_MAX_BLOCK_DEPTH,
    maxVertices: opts.maxVertices,
  });
  const failure = ex.run(dxf.entities);
  if (failure) return err(failure);
  if (ex.out.length === 0) {
    return err({ kind: 'empty', message: 'model space has no drawable entities (the drawing may be only in paper space / layouts); export the model space' });
  }

  const warnings = [...new Set(ex.notes)];
  for (const [type, n] of [...ex.skipped].sort((a, b) => (a[0] < b[0] ? -1 : 1))) {
    warnings.push(`skipped ${n} ${type} ${n === 1 ? 'entity' : 'entities'}`);
  }
  return ok({
    header: { version, insUnits, extents: extentsOf(ex.out) },
    layers: layersOf(layerRecords, ex.out),
    entities: ex.out,
    warnings,
  });
}

/** Cheap structural checks before parsing: catches text that is not DXF and files cut short. */
function precheck(text: string): DxfReadError | null {
  let i = 0;
  while (i < text.length && /\s/.test(text[i])) i++;
  const firstLineEnd = text.indexOf('\n', i);
  const first = text.slice(i, firstLineEnd < 0 ? text.length : firstLineEnd).trim();
  if (!/^-?\d+$/.test(first)) {
    return { kind: 'garbage', message: `the file does not start with a DXF group code (found '${first.slice(0, 40)}'); it is not an ASCII DXF file` };
  }
  if (text.indexOf('SECTION') < 0) {
    return { kind: 'garbage', message: 'the file has no DXF SECTION; it is not an ASCII DXF file' };
  }
  let j = text.length;
  while (j > 0 && /\s/.test(text[j - 1])) j--;
  if (!text.slice(Math.max(0, j - 3), j).endsWith('EOF')) {
    return { kind: 'truncated', message: 'the file ends without the DXF end-of-file marker (0 / EOF); it is probably truncated — save or copy it again' };
  }
  if (!/\n\s*ENTITIES\s*\r?\n/.test(text)) {
    return { kind: 'no-model-space', message: 'the file has no ENTITIES section (no model-space drawing); export the site plan again' };
  }
  return null;
}

function extentsOf(entities: Drawing['entities']): Extents {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const e of entities) {
    if (e.kind === 'polyline') {
      const p = e.points;
      for (let i = 0; i < p.length; i += 2) {
        const x = p[i], y = p[i + 1];
        if (x < minX) minX = x;
        if (x > maxX) maxX = x;
        if (y < minY) minY = y;
        if (y > maxY) maxY = y;
      }
    } else {
      if (e.x < minX) minX = e.x;
      if (e.x > maxX) maxX = e.x;
      if (e.y < minY) minY = e.y;
      if (e.y > maxY) maxY = e.y;
    }
  }
  return { minX, minY, maxX, maxY };
}

/** Layers from the table, plus any used but missing; entity layer names take the table's spelling (DXF layer names are case-insensitive). */
function layersOf(records: LayerRecord[], entities: Drawing['entities']): DrawingLayer[] {
  const out = new Map<string, DrawingLayer>(); // key: upper-case name
  for (const l of records) {
    const key = l.name.toUpperCase();
    if (!out.has(key)) out.set(key, { name: l.name, color: l.color, on: l.on, frozen: l.frozen });
  }
  let last = '';
  let lastCanon = '';
  for (const e of entities) {
    if (e.layer === last) { e.layer = lastCanon; continue; }
    last = e.layer;
    const key = e.layer.toUpperCase();
    let l = out.get(key);
    if (!l) {
      l = { name: e.layer, color: 7, on: true, frozen: false };
      out.set(key, l);
    }
    lastCanon = l.name;
    e.layer = l.name;
  }
  return [...out.values()];
}
