// One pass over an ASCII DXF's group code / value pairs that records where Furrow may splice:
// section and table ends, existing layer and linetype names, the model-space block record, the
// $HANDSEED value and the largest handle in use. Works on the file's bytes, so that everything
// outside the insertion points is written back byte for byte; values are decoded only where needed.

export interface Span { start: number; end: number }

export interface DxfScan {
  eol: string;
  acadver: string;
  /** $DWGCODEPAGE, e.g. 'ANSI_1252' ('' when absent). */
  codepage: string;
  insUnits: number | null;
  handling: number | null;
  /** Byte span of $HANDSEED's group 5 value, when present. */
  handseed: Span | null;
  handseedValue: bigint | null;
  /** Largest handle defined outside the header (groups 5 and 105); -1 when none. */
  maxHandle: bigint;
  entitiesHaveHandles: boolean;
  /** Byte offset of the `0` line that starts ENDSEC, per section name. */
  sectionEnd: Map<string, number>;
  /** Byte offset of the `0` line that starts each section. */
  sectionStart: Map<string, number>;
  /** Byte offset of the `0` line of ENDTAB, per table name (upper case). */
  tableEnd: Map<string, number>;
  /** Handle of each TABLE head, per table name (upper case). */
  tableHandle: Map<string, string>;
  layerNames: string[];
  ltypeNames: string[];
  modelSpaceRecord: string | null;
  /** Plot style handle (group 390) of the first layer record, reused for new layers (AC1015+). */
  layerPlotStyle: string | null;
}

export interface DxfScanError { kind: 'binary' | 'structure'; message: string }

/** Bytes → string with one char per byte (lossless for any input). */
export function bytesToByteString(bytes: Uint8Array): string {
  const parts: string[] = [];
  for (let i = 0; i < bytes.length; i += 0x2000) parts.push(String.fromCharCode.apply(null, bytes.subarray(i, i + 0x2000) as unknown as number[]));
  return parts.join('');
}

/** The inverse of bytesToByteString (chars must be < 256). */
export function byteStringToBytes(s: string): Uint8Array {
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i) & 0xff;
  return out;
}

const SP = 32, TAB = 9, CR = 13, LF = 10;
const isSpace = (c: number): boolean => c === SP || c === TAB || c === CR;

/** Hex digit value, or -1. */
function hexVal(c: number): number {
  if (c >= 48 && c <= 57) return c - 48;
  if (c >= 65 && c <= 70) return c - 55;
  if (c >= 97 && c <= 102) return c - 87;
  return -1;
}

export function scanDxf(b: Uint8Array): { ok: true; value: DxfScan } | { ok: false; error: DxfScanError } {
  const sentinel = 'AutoCAD Binary DXF';
  if (b.length >= sentinel.length && bytesToByteString(b.subarray(0, sentinel.length)) === sentinel) {
    return { ok: false, error: { kind: 'binary', message: 'the drawing is a binary DXF; save it as ASCII DXF to merge into it' } };
  }
  const firstLf = b.indexOf(LF);
  const eol = firstLf > 0 && b[firstLf - 1] === CR ? '\r\n' : '\n';
  const s: DxfScan = {
    eol, acadver: '', codepage: '', insUnits: null, handling: null, handseed: null, handseedValue: null, maxHandle: -1n,
    entitiesHaveHandles: false, sectionEnd: new Map(), sectionStart: new Map(), tableEnd: new Map(), tableHandle: new Map(),
    layerNames: [], ltypeNames: [], modelSpaceRecord: null, layerPlotStyle: null,
  };
  let maxNum = -1; // handles up to 13 hex digits as numbers (exact below 2^52); longer ones as BigInt
  let maxBig = -1n;
  let section: string | null = null;
  let expectSectionName = false;
  let sectionStartOffset = 0;
  let table: string | null = null;
  let expectTableName = false;
  let tableHeadOpen = false;
  let record: string | null = null;
  let recordName: string | null = null;
  let recordHandle: string | null = null;
  let recordPlot: string | null = null;
  let headerVar: string | null = null;
  const closeRecord = (): void => {
    if (section === 'TABLES' && table && record) {
      if (record === 'LAYER' && recordName !== null) {
        s.layerNames.push(recordName);
        if (s.layerNames.length === 1 && recordPlot) s.layerPlotStyle = recordPlot;
      }
      if (record === 'LTYPE' && recordName !== null) s.ltypeNames.push(recordName);
      if (record === 'BLOCK_RECORD' && recordName !== null && recordName.toUpperCase() === '*MODEL_SPACE' && recordHandle) s.modelSpaceRecord = recordHandle;
    }
    record = null; recordName = null; recordHandle = null; recordPlot = null;
  };
  const n = b.length;
  let pos = 0;
  let line = 0;
  while (pos < n) {
    const codeStart = pos;
    let nl = b.indexOf(LF, pos);
    if (nl < 0) nl = n;
    // group code: optional spaces, optional '-', digits, optional spaces / CR
    let i = pos;
    while (i < nl && isSpace(b[i])) i++;
    let neg = false;
    if (i < nl && b[i] === 45) { neg = true; i++; }
    const digitsAt = i;
    let code = 0;
    while (i < nl && b[i] >= 48 && b[i] <= 57) { code = code * 10 + (b[i] - 48); i++; }
    const digits = i - digitsAt;
    while (i < nl && isSpace(b[i])) i++;
    line++;
    if (digits === 0 || i !== nl) {
      if (digitsAt === nl && nl + 1 >= n) break; // blank last line
      const shown = bytesToByteString(b.subarray(pos, Math.min(nl, pos + 40))).trim();
      return { ok: false, error: { kind: 'structure', message: `line ${line}: expected a group code, found '${shown}'` } };
    }
    if (neg) code = -code;
    pos = nl + 1;
    if (pos > n) return { ok: false, error: { kind: 'structure', message: `line ${line}: group code ${code} has no value (file cut short?)` } };
    const valueStart = pos;
    nl = b.indexOf(LF, pos);
    if (nl < 0) nl = n;
    let valueEnd = nl;
    if (valueEnd > valueStart && b[valueEnd - 1] === CR) valueEnd--;
    pos = nl + 1;
    line++;
    // trimmed value bounds
    let vs = valueStart, ve = valueEnd;
    while (vs < ve && (b[vs] === SP || b[vs] === TAB)) vs++;
    while (ve > vs && (b[ve - 1] === SP || b[ve - 1] === TAB)) ve--;
    const value = (): string => bytesToByteString(b.subarray(vs, ve));

    if (code === 0) {
      closeRecord();
      headerVar = null;
      // entity types outside TABLES are not needed: only look for the section keywords there
      if (section !== 'TABLES' && !(ve - vs <= 7 && b[vs] >= 69 && b[vs] <= 83)) continue;
      const v = value();
      if (v === 'SECTION') { expectSectionName = true; sectionStartOffset = codeStart; continue; }
      if (v === 'ENDSEC') { if (section) s.sectionEnd.set(section, codeStart); section = null; table = null; continue; }
      if (v === 'EOF') break;
      if (section === 'TABLES') {
        if (v === 'TABLE') { expectTableName = true; tableHeadOpen = true; continue; }
        if (v === 'ENDTAB') { if (table) s.tableEnd.set(table, codeStart); table = null; continue; }
        tableHeadOpen = false;
      }
      record = v;
      continue;
    }
    if (expectSectionName && code === 2) { section = value().toUpperCase(); s.sectionStart.set(section, sectionStartOffset); expectSectionName = false; continue; }
    if (expectTableName && code === 2) { table = value().toUpperCase(); expectTableName = false; continue; }
    if (section === 'HEADER') {
      if (code === 9) { headerVar = value().toUpperCase(); continue; }
      if (headerVar === '$ACADVER' && code === 1) s.acadver = value();
      else if (headerVar === '$DWGCODEPAGE' && code === 3) s.codepage = value();
      else if (headerVar === '$INSUNITS' && code === 70) s.insUnits = Number(value());
      else if (headerVar === '$HANDLING' && code === 70) s.handling = Number(value());
      else if (headerVar === '$HANDSEED' && code === 5) { s.handseed = { start: valueStart, end: valueEnd }; s.handseedValue = parseHex(b, vs, ve); }
      continue;
    }
    // in R12 DIMSTYLE records group 5 is the arrow block name, not a handle (the handle is 105)
    if (code === 105 || (code === 5 && !(section === 'TABLES' && table === 'DIMSTYLE' && !tableHeadOpen))) {
      const len = ve - vs;
      if (len > 0 && len <= 13) {
        let h = 0;
        let okHex = true;
        for (let k = vs; k < ve; k++) { const d = hexVal(b[k]); if (d < 0) { okHex = false; break; } h = h * 16 + d; }
        if (okHex && h > maxNum) maxNum = h;
      } else if (len > 13) {
        const h = parseHex(b, vs, ve);
        if (h !== null && h > maxBig) maxBig = h;
      }
      if (section === 'ENTITIES') s.entitiesHaveHandles = true;
      else if (section === 'TABLES') {
        if (tableHeadOpen && table && !s.tableHandle.has(table)) s.tableHandle.set(table, value());
        else if (record) recordHandle = value();
      }
      continue;
    }
    if (code === 2 && record && recordName === null && section === 'TABLES') { recordName = value(); continue; }
    if (code === 390 && record === 'LAYER' && section === 'TABLES' && recordPlot === null) recordPlot = value();
  }
  closeRecord();
  const num = BigInt(maxNum);
  s.maxHandle = maxBig > num ? maxBig : num;
  return { ok: true, value: s };
}

function parseHex(b: Uint8Array, start: number, end: number): bigint | null {
  if (end <= start || end - start > 16) return null;
  let h = 0n;
  for (let k = start; k < end; k++) {
    const d = hexVal(b[k]);
    if (d < 0) return null;
    h = h * 16n + BigInt(d);
  }
  return h;
}
