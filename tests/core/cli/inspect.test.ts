// `furrow inspect` end to end (execFile of the launcher): building count and area on every fixture
// against closed forms / shapely (see tests/fixtures/dxf/make_fixtures.py), JSON keys, exit codes.
import { execFile } from 'node:child_process';
import { writeFileSync, mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { expected, fixturePath } from '../dxf/fixtures';

const FURROW = fileURLToPath(new URL('../../../core/cli/furrow.mjs', import.meta.url));
const TMP = fileURLToPath(new URL('../../.tmp/inspect-cli/', import.meta.url));

function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [FURROW, ...args], { timeout: 60_000 }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : -1) : 0, stdout, stderr });
    });
  });
}

// [fixture, extra args, building count, area, allowed area error]
const PI = Math.PI;
const segment = (r: number, t: number): number => (r * r / 2) * (t - Math.sin(t)); // circular segment, closed form
const r90 = 20 / (2 * Math.sin(PI / 4));
const CASES: [string, string[], number, number, number][] = [
  ['rect_l_m_r2000.dxf', [], 2, 650, 1e-9], // shoelace: 20 x 10 + L (30 x 20 - 15 x 10)
  ['circle_bulge_m.dxf', [], 3, PI * 100 + PI * 50 + 200 + segment(r90, PI / 2), 0.01 * (2 * PI * 10 + PI * 10 + r90 * PI / 2)],
  ['polyline_r12.dxf', ['--units', 'ft'], 3, 800 + PI * 50 + 900 + 24, 0.01 * PI * 10],
  ['pieces_m.dxf', [], 1, 200 + PI * 12.5, 0.01 * PI * 5 + 0.1],
  ['courtyard_overlap_m.dxf', [], 2, 1500 + 150, 1e-6],
  ['blocks_m.dxf', [], 5, 740, 1e-6], // 80 (1 + 4 + 1 + 1 + 2.25)
  ['curves_m.dxf', [], 1, PI * 20 * 10 - PI * 9, 0.01 * (97 + 2 * PI * 3)], // ellipse pi a b minus a circular courtyard
  ['stateplane_ft.dxf', [], 2, 3900, 1e-6],
  ['mm.dxf', [], 2, 200.12, 1e-6],
  ['unitless.dxf', ['--units', 'm'], 1, 200, 1e-9],
  ['roles_m.dxf', [], 2, 300 + 144, 1e-9],
  ['selfcross_zero_m.dxf', [], 3, 250, 1e-6],
  ['many_blocks_m.dxf', [], 2500, 2500 * 200, 1e-6],
  ['good_small.dxf', [], 1, 200, 1e-9],
];

describe('furrow inspect', () => {
  it.each(CASES)('%s: building count and footprint area', async (name, extra, count, area, tol) => {
    const r = await run(['inspect', fixturePath(name), ...extra, '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(Object.keys(j)).toEqual(expect.arrayContaining(['units', 'extents', 'layers', 'buildings', 'warnings']));
    expect(j.buildings.count).toBe(count);
    expect(Math.abs(j.buildings.area - area)).toBeLessThanOrEqual(tol);
    for (const l of j.layers) expect(Object.keys(l).sort()).toEqual(['entities', 'name', 'reason', 'role']);
  });

  it('matches shapely on the overlapping footprints', async () => {
    const r = await run(['inspect', fixturePath('overlaps_m.dxf'), '--json']);
    const exp = expected()['overlaps_m.dxf'];
    const j = JSON.parse(r.stdout);
    expect(j.buildings.count).toBe(exp.count);
    expect(Math.abs(j.buildings.area - exp.area)).toBeLessThan(0.05);
  });

  it('prints units, extents, layers with roles and reasons, and buildings as text', async () => {
    const r = await run(['inspect', fixturePath('roles_m.dxf')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/units\s+m/);
    expect(r.stdout).toMatch(/extents/);
    expect(r.stdout).toMatch(/PAVE-ASPHALT\s+1\s+pavement\s+suggested: layer name contains 'ASPHALT'/);
    expect(r.stdout).toMatch(/buildings 2, footprint area 444\.00 m²/);
  });

  it('uses a roles file', async () => {
    mkdirSync(TMP, { recursive: true });
    const roles = join(TMP, 'roles.json');
    writeFileSync(roles, JSON.stringify({ BLDG: 'building', MISC: 'ignore' }));
    const r = await run(['inspect', fixturePath('roles_m.dxf'), '--roles', roles, '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.buildings).toEqual({ count: 1, area: 300 });
    expect(j.layers.find((l: { name: string }) => l.name === 'BLDG').reason).toMatch(/given/);
  });

  it.each([
    ['binary.dxf', /ASCII/],
    ['truncated.dxf', /truncated/],
    ['garbage.dxf', /not an ASCII DXF/],
    ['empty.dxf', /empty/],
    ['paper_only.dxf', /paper space/],
    ['open_only.dxf', /BLDG, BLDG-2/],
    ['unitless.dxf', /--units m or --units ft/],
    ['cyclic_blocks.dxf', /recursive/],
    ['deep_blocks.dxf', /nest deeper/],
  ])('exits 2 on %s, naming the file and what to do', async (name, what) => {
    const r = await run(['inspect', fixturePath(name)]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(name);
    expect(r.stderr).toMatch(what);
  });

  it('exits 2 on a missing file, a bad unit and a bad roles file', async () => {
    expect((await run(['inspect', fixturePath('nope.dxf')])).code).toBe(2);
    expect((await run(['inspect', fixturePath('good_small.dxf'), '--units', 'yd'])).code).toBe(2);
    mkdirSync(TMP, { recursive: true });
    const bad = join(TMP, 'bad-roles.json');
    writeFileSync(bad, JSON.stringify({ BLDG: 'house' }));
    const r = await run(['inspect', fixturePath('good_small.dxf'), '--roles', bad]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/house/);
  });
});
