// The services CSV and the roles file: parsed as an independent CSV reader (Python's csv module)
// reads them, and every bad line named with what to do.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parsePointsCsv } from '../../../core/site/pointsCsv';
import { parseRolesFile } from '../../../core/site/rolesFile';

const KEYS = ['power', 'telecom', 'water', 'gas'];
const DEMO = join(__dirname, '..', '..', '..', 'assets', 'demo');

describe('services CSV', () => {
  it('reads the demo services file as Python csv.DictReader does', () => {
    const text = readFileSync(join(DEMO, 'services.csv'), 'utf8');
    const r = parsePointsCsv(text, KEYS);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // independent reader: /usr/bin/python3 csv module
    const py = JSON.parse(execFileSync('/usr/bin/python3', ['-c',
      'import csv,json,sys; print(json.dumps([dict(id=r["id"],x=float(r["x"]),y=float(r["y"]),role=r["role"],utilities=[u for u in r["utilities"].split(";") if u]) for r in csv.DictReader(open(sys.argv[1], newline=""))]))',
      join(DEMO, 'services.csv')], { encoding: 'utf8' }));
    expect(r.value).toEqual(py);
  });

  it('accepts quoted fields, CRLF, a BOM and blank lines', () => {
    const r = parsePointsCsv('\uFEFFid,x,y,role,utilities\r\n"P, 1",10.5,20,connection,"power;telecom"\r\n\r\nS1,11,21,service,power\r\n', KEYS);
    expect(r.ok && r.value.map((p) => p.id)).toEqual(['P, 1', 'S1']);
  });

  it('names the file, line and fix for each bad line', () => {
    const text = ['id,x,y,role,utilities', 'P1,0,0,connection,power', 'S1,abc,5,service,power', 'S2,1,2,building,power', 'S3,1,2,service,steam', 'S1,1,2,service,power'].join('\n');
    const r = parsePointsCsv(text, KEYS, 'pts.csv');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.message.split('\n')).toEqual([
      "pts.csv, line 3: x 'abc' is not a number; give the coordinate in drawing units",
      "pts.csv, line 4: role 'building' is neither 'service' nor 'connection'",
      "pts.csv, line 5: unknown utility 'steam'; use power, telecom, water, gas or define it in the settings file",
      "pts.csv, line 6: id 'S1' is already used on line 3; ids must be unique",
    ]);
    expect(r.error.lines).toEqual([3, 4, 5, 6]);
  });

  it('needs the header columns, a connection, and a connection for every utility asked for', () => {
    const noCol = parsePointsCsv('id,x,y,utilities\n', KEYS, 'a.csv');
    expect(noCol.ok ? '' : noCol.error.message).toBe("a.csv, line 1: the header has no 'role' column; the header must be id,x,y,role,utilities");
    const noConn = parsePointsCsv('id,x,y,role,utilities\nS1,1,2,service,power\n', KEYS, 'b.csv');
    expect(noConn.ok ? '' : noConn.error.message).toMatch(/^b\.csv: no point of connection/);
    const gap = parsePointsCsv('id,x,y,role,utilities\nP,0,0,connection,power\nS1,1,2,service,power;gas\n', KEYS, 'c.csv');
    expect(gap.ok ? '' : gap.error.message).toBe("c.csv, line 3: service 'S1' needs gas but no point of connection supplies it; add it to a connection's utilities");
  });
});

describe('roles file', () => {
  it('reads the demo roles and warns about layers the drawing lacks', () => {
    const text = readFileSync(join(DEMO, 'roles.json'), 'utf8');
    const layers = Object.keys(JSON.parse(text)).filter((l) => l !== 'ANNO-TEXT');
    const r = parseRolesFile(text, 'roles.json', layers);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.roles).toEqual(JSON.parse(text));
    expect(r.value.warnings).toHaveLength(1);
    expect(r.value.warnings[0]).toMatch(/'ANNO-TEXT' is not in the drawing/);
  });
  it('refuses unknown roles, naming the layer', () => {
    const r = parseRolesFile('{"BLDG": "house"}', 'r.json');
    expect(r.ok ? '' : r.error.message).toMatch(/^r\.json: layer 'BLDG' has role "house"; roles are building, keep-out/);
  });
});
