// The router's grid size and memory, estimated before anything is built (core/limits.ts), and
// the limit message that replaces an out-of-memory crash. The estimate is checked against the
// router itself: the grid it builds (same node count) and the bytes of every typed array it
// allocates during a route, counted in a child process.
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { checkRouteSize, estimateRouteMemory, LIMITS } from '../../core/limits';
import { defaultSettings } from '../../core/settings';
import { gridSite } from './gridSite';
import { readFileSync } from 'node:fs';
import { readDxfBytes } from '../../core/dxf/readDxf';
import { buildSite } from '../../core/site/buildSite';
import { parseRolesFile } from '../../core/site/rolesFile';
import type { Site } from '../../core/site/site';

const child = fileURLToPath(new URL('./routeAllocChild.ts', import.meta.url));
const root = fileURLToPath(new URL('../..', import.meta.url));

function measure(rows: number, cols: number, cellM: number, budgetMs: number): { gridNodes: number; nx: number; ny: number; estimate: { cells: number; nx: number; ny: number; bytes: number }; allocatedBytes: number } {
  const out = execFileSync(process.execPath, ['--import', 'tsx', child, String(rows), String(cols), String(cellM), String(budgetMs)], { cwd: root, encoding: 'utf8', timeout: 120_000 });
  return JSON.parse(out.trim().split('\n').pop()!);
}

const rect = (w: number, h: number, units: 'm' | 'ft' = 'm'): Site => ({
  units, frame: { originX: 0, originY: 0, scale: 1 }, buildings: [], keepOuts: [], pavements: [], crossings: [],
  boundary: Float64Array.from([0, 0, w, 0, w, h, 0, h]), roles: {}, warnings: [],
});

describe('route memory estimate', () => {
  it('counts the same grid as the router builds, and covers the bytes it allocates (within 3×)', () => {
    for (const [rows, cols, cellM, budget] of [[2, 2, 0.5, 500], [3, 4, 0.5, 1500], [4, 6, 0.25, 2000]] as const) {
      const m = measure(rows, cols, cellM, budget);
      console.log(JSON.stringify({ case: `${rows}x${cols}@${cellM}m`, gridNodes: m.gridNodes, estimateMB: +(m.estimate.bytes / 1048576).toFixed(1), allocatedMB: +(m.allocatedBytes / 1048576).toFixed(1), ratio: +(m.estimate.bytes / m.allocatedBytes).toFixed(2) }));
      expect(m.estimate.cells).toBe(m.gridNodes);
      expect([m.estimate.nx, m.estimate.ny]).toEqual([m.nx, m.ny]);
      // every allocation summed (freed ones included) bounds the peak from above
      expect(m.estimate.bytes).toBeGreaterThanOrEqual(m.allocatedBytes * 0.9);
      expect(m.estimate.bytes).toBeLessThanOrEqual(m.allocatedBytes * 3);
    }
  }, 300_000);

  it('grid cells follow the lattice formula: a 100 m × 50 m site at 0.5 m has 202 × 102 nodes (closed form)', () => {
    const e = estimateRouteMemory(rect(100, 50), { ...defaultSettings().route, cellM: 0.5 });
    // nodes from floor(min/h)·h to max inclusive, plus one guard column and row: 100/0.5 + 2, 50/0.5 + 2
    expect([e.nx, e.ny, e.cells, e.states]).toEqual([202, 102, 20604, 164832]);
  });

  it('a small site passes the check', () => {
    expect(checkRouteSize(gridSite(3, 3).site, defaultSettings().route)).toBeNull();
  });

  it('a 5 km × 5 km site at 0.5 m is refused with the grid, the memory and a cell size that fits', () => {
    const site = rect(5000, 5000);
    const route = { ...defaultSettings().route, cellM: 0.5 };
    const r = checkRouteSize(site, route);
    expect(r).not.toBeNull();
    if (!r) return;
    console.log(JSON.stringify({ limitMessage: r.message }));
    expect(r.kind).toBe('limit');
    expect(r.message).toContain('10,002 × 10,002 = 100,040,004 cells × 8 directions = 800,320,032 search states');
    expect(r.message).toMatch(/would need about [\d.]+ GB of memory, over the 2\.0 GB limit/);
    const m = /route\.cellM (\d+(?:\.\d+)?) m would need about/.exec(r.message);
    expect(m).not.toBeNull();
    const suggested = Number(m![1]);
    // the suggestion fits, and the finer step offered before it (3 m) does not
    expect(suggested).toBe(4);
    expect(estimateRouteMemory(site, { ...route, cellM: suggested }).bytes).toBeLessThanOrEqual(LIMITS.maxRouteBytes);
    expect(estimateRouteMemory(site, { ...route, cellM: 3 }).bytes).toBeGreaterThan(LIMITS.maxRouteBytes);
    expect(r.message).toContain('or draw a smaller site boundary');
  });

  it('a feet site states the area and the suggested cell in both units', () => {
    const r = checkRouteSize(rect(16_404, 16_404, 'ft'), { ...defaultSettings().route, cellM: 0.5 });
    expect(r?.message).toMatch(/routing a site of 5000 m × 5000 m \(16404 ft × 16404 ft\) with 0\.5 m \(1\.64 ft\) cells/);
    expect(r?.message).toMatch(/route\.cellM [\d.]+ m \([\d.]+ ft\) would need/);
  });

  it('a site too large for any offered cell asks for a smaller boundary', () => {
    const r = checkRouteSize(rect(400_000, 400_000), defaultSettings().route);
    expect(r?.message).toMatch(/draw a smaller site boundary .* no cell size up to 10 m fits this area/);
  });

  it('the demo site (300 m × 200 m with its margin) fits at 0.5 m and is refused at 0.1 m with 0.2 m suggested', () => {
    const demo = (f: string): string => fileURLToPath(new URL(`../../assets/demo/${f}`, import.meta.url));
    const d = readDxfBytes(readFileSync(demo('site.dxf')));
    if (!d.ok) throw new Error(d.error.message);
    const roles = parseRolesFile(readFileSync(demo('roles.json'), 'utf8'), 'roles.json', d.value.layers.map((l) => l.name));
    if (!roles.ok) throw new Error(roles.error.message);
    const s = buildSite(d.value, { roles: roles.value.roles });
    if (!s.ok) throw new Error(s.error.message);
    const route = defaultSettings().route;
    const e = estimateRouteMemory(s.value, route);
    console.log(JSON.stringify({ demoCellM: route.cellM, cells: e.cells, estimateMB: Math.round(e.bytes / 1048576) }));
    expect(checkRouteSize(s.value, route)).toBeNull();
    const fine = checkRouteSize(s.value, { ...route, cellM: 0.1 });
    expect(fine?.message).toMatch(/with 0\.1 m cells makes a grid of 3,002 × 2,002 = 6,010,004 cells .* route\.cellM 0\.2 m would need about/);
  });

  it('a lower memory limit is honoured', () => {
    const site = gridSite(3, 3).site;
    const e = estimateRouteMemory(site, defaultSettings().route);
    expect(checkRouteSize(site, defaultSettings().route, e.bytes)).toBeNull();
    expect(checkRouteSize(site, defaultSettings().route, e.bytes - 1)?.kind).toBe('limit');
  });
});
