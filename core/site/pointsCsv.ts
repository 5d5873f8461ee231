// The services file (DESIGN.md "Contracts"): CSV with header `id,x,y,role,utilities`; role is
// `service` or `connection`; utilities a `;`-separated list of utility keys; coordinates in
// drawing units. Problems come back as values naming the file, the line and what to do.

import { err, ok, type Result } from '../result';
import type { PointInput, TerminalRole } from './site';

export interface PointsFileError {
  kind: 'points';
  /** One line per problem: "<file>, line <n>: <what> — <what to do>". */
  message: string;
  lines: number[];
}

const COLUMNS = ['id', 'x', 'y', 'role', 'utilities'] as const;

/** Split one CSV line (double quotes may wrap a field; "" inside quotes is a quote). */
function splitCsvLine(line: string): string[] {
  const out: string[] = [];
  let cur = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (quoted) {
      if (c === '"' && line[i + 1] === '"') { cur += '"'; i++; } else if (c === '"') quoted = false; else cur += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') { out.push(cur); cur = ''; } else cur += c;
  }
  out.push(cur);
  return out.map((f) => f.trim());
}

/**
 * Parse the services CSV. `utilityKeys` are the keys defined in the settings; `source` names the
 * file in messages.
 */
export function parsePointsCsv(text: string, utilityKeys: readonly string[], source = 'services.csv'): Result<PointInput[], PointsFileError> {
  const problems: string[] = [];
  const badLines: number[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const headerAt = lines.findIndex((l) => l.trim() !== '');
  if (headerAt < 0) return err({ kind: 'points', lines: [1], message: `${source}: the file is empty; write a header line id,x,y,role,utilities and one line per point` });
  const header = splitCsvLine(lines[headerAt]).map((h) => h.toLowerCase());
  const col: Record<string, number> = {};
  for (const c of COLUMNS) {
    const i = header.indexOf(c);
    if (i < 0) return err({ kind: 'points', lines: [headerAt + 1], message: `${source}, line ${headerAt + 1}: the header has no '${c}' column; the header must be id,x,y,role,utilities` });
    col[c] = i;
  }
  const known = new Set(utilityKeys);
  const seen = new Map<string, number>();
  const points: PointInput[] = [];
  const note = (ln: number, msg: string): void => { problems.push(`${source}, line ${ln}: ${msg}`); if (!badLines.includes(ln)) badLines.push(ln); };
  for (let i = headerAt + 1; i < lines.length; i++) {
    const raw = lines[i];
    if (raw.trim() === '') continue;
    const ln = i + 1;
    const f = splitCsvLine(raw);
    if (f.length < header.length) { note(ln, `${f.length} fields, the header has ${header.length}; give id,x,y,role,utilities`); continue; }
    const id = f[col.id];
    const x = Number(f[col.x]);
    const y = Number(f[col.y]);
    const role = f[col.role].toLowerCase();
    const utilities = f[col.utilities].split(';').map((u) => u.trim()).filter((u) => u !== '');
    if (id === '') note(ln, 'the id is empty; give each point a name');
    else if (seen.has(id)) note(ln, `id '${id}' is already used on line ${seen.get(id)}; ids must be unique`);
    else seen.set(id, ln);
    if (f[col.x] === '' || !Number.isFinite(x)) note(ln, `x '${f[col.x]}' is not a number; give the coordinate in drawing units`);
    if (f[col.y] === '' || !Number.isFinite(y)) note(ln, `y '${f[col.y]}' is not a number; give the coordinate in drawing units`);
    if (role !== 'service' && role !== 'connection') note(ln, `role '${f[col.role]}' is neither 'service' nor 'connection'`);
    if (utilities.length === 0) note(ln, `no utilities; list them separated by ';' (${utilityKeys.join(', ')})`);
    const unknown = utilities.filter((u) => !known.has(u));
    if (unknown.length) note(ln, `unknown utilit${unknown.length > 1 ? 'ies' : 'y'} ${unknown.map((u) => `'${u}'`).join(', ')}; use ${utilityKeys.join(', ')} or define it in the settings file`);
    points.push({ id, x, y, role: role as TerminalRole, utilities });
  }
  if (!problems.length) {
    if (!points.some((p) => p.role === 'connection')) problems.push(`${source}: no point of connection; add a line with role 'connection'`);
    if (!points.some((p) => p.role === 'service')) problems.push(`${source}: no service point; add a line with role 'service' for each building entry`);
    const served = new Set(points.filter((p) => p.role === 'connection').flatMap((p) => p.utilities));
    for (const p of points) {
      const missing = p.role === 'service' ? p.utilities.filter((u) => !served.has(u)) : [];
      if (missing.length) { problems.push(`${source}, line ${seen.get(p.id)}: service '${p.id}' needs ${missing.join(', ')} but no point of connection supplies ${missing.length > 1 ? 'them' : 'it'}; add it to a connection's utilities`); badLines.push(seen.get(p.id)!); }
    }
  }
  if (problems.length) return err({ kind: 'points', lines: badLines, message: problems.join('\n') });
  return ok(points);
}
