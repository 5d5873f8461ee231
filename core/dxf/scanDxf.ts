// One pass over an ASCII DXF's group code / value pairs that records where Furrow may splice:
// section and table ends, existing layer and linetype names, the model-space block record, the
// $HANDSEED value and the largest handle in use. Works on a byte string (one char per byte) so
// that everything outside the insertion points is written back byte for byte.

import { parseHandle } from './dxfFormat';

export interface Span { start: number; end: number }

export interface DxfScan {
  eol: string;
  acadver: string;
  /** $DWGCODEPAGE, e.g. 'ANSI_1252' ('' when absent). */
  codepage: string;
  insUnits: number | null;
  handling: number | null;
  /** Value span of $HANDSEED's group 5, when present. */
  handseed: Span | null;
  handseedValue: bigint | null;
  /** Largest handle defined outside the header (groups 5 and 105); -1 when none. */
  maxHandle: bigint;
  entitiesHaveHandles: boolean;
  /** Offset of the `0` line that starts ENDSEC, per section name. */
  sectionEnd: Map<string, number>;
  /** Offset of the `0` line that starts each section. */
  sectionStart: Map<string, number>;
  /** Offset of the `0` line of ENDTAB, per table name (upper case). */
  tableEnd: Map<string, number>;
  /** Handle of each TABLE head, per table name (upper case). */
  tableHandle: Map<string, string>;
  layerNames: string[];
  ltypeNames: string[];
  modelSpaceRecord: string | null;
}

export interface DxfScanError { kind: 'binary' | 'structure'; message: string }

/** Bytes → string with one char per byte (lossless for any input). */
export function bytesToByteString(bytes: Uint8Array): string {
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return s;
}

/** The inverse of bytesToByteString (chars must be < 256). */
export function byteStringToBytes(s: string): Uint8Array {
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i) & 0xff;
  return out;
}

export function scanDxf(text: string): { ok: true; value: DxfScan } | { ok: false; error: DxfScanError } {
  if (text.startsWith('AutoCAD Binary DXF')) return { ok: false, error: { kind: 'binary', message: 'the drawing is a binary DXF; save it as ASCII DXF to merge into it' } };
  const eol = /\r\n/.test(text.slice(0, 4096)) ? '\r\n' : '\n';
  const s: DxfScan = {
    eol, acadver: '', codepage: '', insUnits: null, handling: null, handseed: null, handseedValue: null, maxHandle: -1n,
    entitiesHaveHandles: false, sectionEnd: new Map(), sectionStart: new Map(), tableEnd: new Map(), tableHandle: new Map(),
    layerNames: [], ltypeNames: [], modelSpaceRecord: null,
  };
  let pos = 0;
  let line = 0;
  let section: string | null = null;
  let expectSectionName = false;
  let sectionStartOffset = 0;
  let table: string | null = null;
  let expectTableName = false;
  let tableHeadOpen = false;
  let record: string | null = null; // current table record or entity type
  let recordName: string | null = null;
  let recordHandle: string | null = null;
  let headerVar: string | null = null;
  const closeRecord = (): void => {
    if (section === 'TABLES' && table && record) {
      if (record === 'LAYER' && recordName !== null) s.layerNames.push(recordName);
      if (record === 'LTYPE' && recordName !== null) s.ltypeNames.push(recordName);
      if (record === 'BLOCK_RECORD' && recordName !== null && recordName.toUpperCase() === '*MODEL_SPACE' && recordHandle) s.modelSpaceRecord = recordHandle;
    }
    record = null; recordName = null; recordHandle = null;
  };
  const n = text.length;
  while (pos < n) {
    const codeStart = pos;
    let nl = text.indexOf('\n', pos);
    if (nl < 0) nl = n;
    const codeText = text.slice(pos, nl).trim();
    pos = nl + 1;
    line++;
    if (codeText === '' && pos >= n) break;
    const code = Number(codeText);
    if (!/^-?\d+$/.test(codeText)) return { ok: false, error: { kind: 'structure', message: `line ${line}: expected a group code, found '${codeText.slice(0, 40)}'` } };
    if (pos > n) return { ok: false, error: { kind: 'structure', message: `line ${line}: group code ${code} has no value (file cut short?)` } };
    const valueStart = pos;
    nl = text.indexOf('\n', pos);
    if (nl < 0) nl = n;
    let valueEnd = nl;
    if (valueEnd > valueStart && text.charCodeAt(valueEnd - 1) === 13) valueEnd--;
    const raw = text.slice(valueStart, valueEnd);
    const value = raw.trim();
    pos = nl + 1;
    line++;

    if (code === 0) {
      closeRecord();
      headerVar = null;
      if (value === 'SECTION') { expectSectionName = true; sectionStartOffset = codeStart; continue; }
      if (value === 'ENDSEC') { if (section) s.sectionEnd.set(section, codeStart); section = null; table = null; continue; }
      if (value === 'EOF') break;
      if (section === 'TABLES') {
        if (value === 'TABLE') { expectTableName = true; tableHeadOpen = true; continue; }
        if (value === 'ENDTAB') { if (table) s.tableEnd.set(table, codeStart); table = null; continue; }
        tableHeadOpen = false;
      }
      record = value;
      continue;
    }
    if (expectSectionName && code === 2) { section = value.toUpperCase(); s.sectionStart.set(section, sectionStartOffset); expectSectionName = false; continue; }
    if (expectTableName && code === 2) { table = value.toUpperCase(); expectTableName = false; continue; }
    if (section === 'HEADER') {
      if (code === 9) { headerVar = value.toUpperCase(); continue; }
      if (headerVar === '$ACADVER' && code === 1) s.acadver = value;
      else if (headerVar === '$DWGCODEPAGE' && code === 3) s.codepage = value;
      else if (headerVar === '$INSUNITS' && code === 70) s.insUnits = Number(value);
      else if (headerVar === '$HANDLING' && code === 70) s.handling = Number(value);
      else if (headerVar === '$HANDSEED' && code === 5) { s.handseed = { start: valueStart, end: valueEnd }; s.handseedValue = parseHandle(value); }
      continue;
    }
    if (code === 5 || code === 105) {
      const h = parseHandle(value);
      if (h !== null && h > s.maxHandle) s.maxHandle = h;
      if (section === 'ENTITIES') s.entitiesHaveHandles = true;
      if (section === 'TABLES' && tableHeadOpen && table && !s.tableHandle.has(table)) s.tableHandle.set(table, value);
      else if (record) recordHandle = value;
      continue;
    }
    if (code === 2 && record && recordName === null) recordName = value;
  }
  closeRecord();
  return { ok: true, value: s };
}
