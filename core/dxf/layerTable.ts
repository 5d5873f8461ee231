// The TABLES section, read here instead of by dxf-parser: its VPORT and LAYER loops do not advance
// on an unexpected 0-group and hang on a damaged table. Only the LAYER table is needed (name,
// colour 62 — negative when off — and flags 70, bit 1 frozen: DXF reference, LAYER table).

export interface LayerRecord { name: string; color: number; on: boolean; frozen: boolean }

/** Where the TABLES section is in the text: [start, end) covering `0/SECTION … 0/ENDSEC`, or null. */
export function findTablesSection(text: string): { start: number; end: number } | null {
  const head = /(^|\n)[ \t]*0[ \t]*\r?\n[ \t]*SECTION[ \t]*\r?\n[ \t]*2[ \t]*\r?\n[ \t]*TABLES[ \t]*\r?\n/g;
  const m = head.exec(text);
  if (!m) return null;
  const start = m.index + (m[1] ? 1 : 0);
  const tail = /\n[ \t]*0[ \t]*\r?\n[ \t]*ENDSEC[ \t]*\r?(\n|$)/g;
  tail.lastIndex = head.lastIndex;
  const t = tail.exec(text);
  if (!t) return null;
  return { start, end: t.index + t[0].length };
}

/** LAYER records from the TABLES section text; damaged records are skipped, never looped on. */
export function readLayerTable(tablesText: string): LayerRecord[] {
  const lines = tablesText.split(/\r\n|\r|\n/);
  const out: LayerRecord[] = [];
  let table = '';
  let rec: LayerRecord | null = null;
  const flush = (): void => {
    if (rec && rec.name !== '') out.push(rec);
    rec = null;
  };
  for (let i = 0; i + 1 < lines.length; i += 2) {
    const code = Number.parseInt(lines[i].trim(), 10);
    const value = lines[i + 1].trim();
    if (code === 0) {
      flush();
      if (value === 'LAYER' && table === 'LAYER') rec = { name: '', color: 7, on: true, frozen: false };
      else if (value === 'ENDTAB') table = '';
      continue;
    }
    if (code === 2 && rec === null && table === '' && i >= 2 && lines[i - 1].trim() === 'TABLE') {
      table = value;
      continue;
    }
    if (!rec) continue;
    const r: LayerRecord = rec;
    if (code === 2) r.name = value;
    else if (code === 62) {
      const c = Number.parseInt(value, 10);
      if (Number.isFinite(c)) { r.color = Math.abs(c); r.on = c >= 0; }
    } else if (code === 70) {
      const f = Number.parseInt(value, 10);
      if (Number.isFinite(f)) r.frozen = (f & 1) !== 0;
    }
  }
  flush();
  return out;
}
