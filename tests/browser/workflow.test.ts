// The whole job through the interface in headless Chromium: change a layer role, add a service by
// clicking near a wall, route, read totals and see the network, export DXF and XLSX (checked with
// independent readers), save and reopen a project, undo, and cancel a long run.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import DxfJs from 'dxf';
import { openApp, saveArtifact, ARTIFACTS, REPO, type OpenApp } from './harness';
import { PNG } from 'pngjs';

let app: OpenApp;
let page: Page;
let errors: string[];

const DEMO_DXF = fs.readFileSync(path.join(REPO, 'assets', 'demo', 'site.dxf'), 'utf8');

/** Building walls of the demo read straight from the DXF with the independent `dxf` package. */
function demoBuildingEdges(): [number, number, number, number][] {
  const helper = new DxfJs.Helper(DEMO_DXF);
  const edges: [number, number, number, number][] = [];
  for (const e of helper.denormalised as { type: string; layer: string; vertices?: { x: number; y: number }[]; closed?: boolean; shape?: boolean }[]) {
    if (e.layer !== 'BLDG-OUTLINE' || !e.vertices) continue;
    const v = e.vertices;
    const closed = e.closed || e.shape;
    for (let i = 0; i + 1 < v.length + (closed ? 1 : 0); i++) {
      const a = v[i], b = v[(i + 1) % v.length];
      edges.push([a.x, a.y, b.x, b.y]);
    }
  }
  return edges;
}

function distToEdges(x: number, y: number, edges: [number, number, number, number][]): number {
  let best = Infinity;
  for (const [ax, ay, bx, by] of edges) {
    const dx = bx - ax, dy = by - ay;
    const l2 = dx * dx + dy * dy;
    const t = l2 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / l2)) : 0;
    best = Math.min(best, Math.hypot(x - ax - t * dx, y - ay - t * dy));
  }
  return best;
}

/** Drawing coordinates → page coordinates through the view the app last drew with. */
async function toPage(x: number, y: number): Promise<{ x: number; y: number }> {
  const vp = await page.evaluate(() => window.furrowDebug!.view!);
  const box = (await page.locator('canvas.site-canvas').boundingBox())!;
  return { x: box.x + (x - vp.ox) * vp.scale + vp.tx, y: box.y - (y - vp.oy) * vp.scale + vp.ty };
}

async function points(): Promise<string[]> {
  await page.click('[data-step="points"]');
  return page.locator('#points-table tbody tr').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-point') ?? ''));
}

async function shot(name: string): Promise<void> {
  saveArtifact(name, await page.screenshot());
}

/** Pixels close to an APWA colour in a canvas screenshot. */
function countColour(png: Buffer, rgb: [number, number, number], tol = 40): number {
  const img = PNG.sync.read(png);
  let n = 0;
  for (let i = 0; i < img.data.length; i += 4) {
    if (Math.abs(img.data[i] - rgb[0]) <= tol && Math.abs(img.data[i + 1] - rgb[1]) <= tol && Math.abs(img.data[i + 2] - rgb[2]) <= tol) n++;
  }
  return n;
}

beforeAll(async () => {
  app = await openApp();
  ({ page, errors } = app);
});

afterAll(async () => {
  await app?.close();
});

describe('working through the demo site in the browser', () => {
  it('shows the demo layers with their roles and the site found', async () => {
    await page.click('[data-step="layers"]');
    await expect.poll(() => page.locator('#site-status').textContent()).toMatch(/\d+ buildings/);
    expect(await page.locator('select[data-layer="BLDG-OUTLINE"]').inputValue()).toBe('building');
    await shot('01-layers.png');
  });

  it('changes a layer role, updates the site model, and undoes it', async () => {
    const before = await page.locator('#site-status').textContent();
    const buildings = Number(/(\d+) buildings/.exec(before ?? '')?.[1]);
    expect(buildings).toBeGreaterThan(3);
    await page.selectOption('select[data-layer="BLDG-OUTLINE"]', 'ignore');
    // with no building layer left the site model reports it (core's message), instead of a blank state
    await expect.poll(() => page.locator('#site-status').textContent()).toMatch(/no layer has the building role/);
    expect(await page.locator('#site-status').getAttribute('class')).toContain('error');
    expect(await page.locator('#undo').isEnabled()).toBe(true);
    await page.click('#undo');
    await expect.poll(() => page.locator('#site-status').textContent()).toBe(before);
    expect(await page.locator('select[data-layer="BLDG-OUTLINE"]').inputValue()).toBe('building');
    await page.click('#redo');
    expect(await page.locator('select[data-layer="BLDG-OUTLINE"]').inputValue()).toBe('ignore');
    await page.click('#undo');
    expect(await page.locator('select[data-layer="BLDG-OUTLINE"]').inputValue()).toBe('building');
  });

  it('adds a service by clicking near a wall: it snaps onto the wall', async () => {
    const before = await points();
    await page.click('[data-tool="add-service"]');
    // 1.2 m off the wall that S1 sits on (S1 is on a wall of the demo site, services.csv)
    const click = { x: 512045 + 6, y: 4180085 + 1.2 };
    const edges = demoBuildingEdges();
    expect(edges.length).toBeGreaterThan(8);
    const p = await toPage(click.x, click.y);
    await page.mouse.move(p.x, p.y);
    await page.mouse.click(p.x, p.y);
    const after = await points();
    expect(after.length).toBe(before.length + 1);
    const id = after.find((x) => !before.includes(x))!;
    const xy = await page.locator('#selected-xy').textContent();
    const m = /X ([\d,.-]+)\s+Y ([\d,.-]+)/.exec(xy ?? '')!;
    const sx = Number(m[1].replace(/,/g, '')), sy = Number(m[2].replace(/,/g, ''));
    // on a wall (the panel shows 3 decimals), and moved no more than the 2 m snap distance
    expect(distToEdges(sx, sy, edges)).toBeLessThan(0.002);
    expect(Math.hypot(sx - click.x, sy - click.y)).toBeLessThanOrEqual(2.0 + 0.002);
    expect(id).toMatch(/^S\d+$/);
    await shot('02-service-added.png');
    // a click far from any wall adds nothing and says why
    const far = await toPage(512125, 4180000.5 - 30);
    await page.mouse.click(far.x, far.y);
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/No building wall/);
    expect((await points()).length).toBe(after.length);
    await page.click('[data-tool="select"]');
  });

  it('routes the network in a worker and shows totals and the drawn network', async () => {
    const canvasBefore = await page.locator('canvas.site-canvas').screenshot();
    await page.click('[data-step="results"]');
    await page.click('#run-route');
    await page.waitForFunction(() => (window.furrowDebug?.runs ?? 0) >= 1 || document.getElementById('run-error'), null, { timeout: 120_000 });
    expect(await page.locator('#run-error').count()).toBe(0);
    const length = Number((await page.locator('[data-figure="Trench length"]').textContent())!.replace(/,/g, ''));
    expect(length).toBeGreaterThan(100);
    expect(await page.locator('#services-connected').textContent()).toMatch(/^13 of 13 services connected/);
    expect(await page.locator('[data-notice]').count()).toBe(1);
    const canvas = await page.locator('canvas.site-canvas').screenshot();
    saveArtifact('03-canvas-routed.png', canvas);
    // APWA red (electric) is not in the drawing's own palette: it appears only once the network is drawn
    expect(countColour(canvasBefore, [255, 0, 0])).toBe(0);
    expect(countColour(canvas, [255, 0, 0])).toBeGreaterThan(300);
    await shot('03-routed.png');
  });

  it('shows the take-off grouped with a total, sortable by cost', async () => {
    await page.click('[data-step="takeoff"]');
    const total = Number((await page.locator('#takeoff-total').textContent())!.replace(/,/g, ''));
    expect(total).toBeGreaterThan(0);
    expect(await page.locator('#takeoff-table tr.group').count()).toBeGreaterThan(3);
    await page.click('th[data-sort="cost"]');
    const costs = await page.locator('#takeoff-table tbody tr[data-line] td:last-child').allTextContents();
    const nums = costs.map((c) => Number(c.replace(/,/g, '')));
    expect(nums.length).toBeGreaterThan(5);
    for (let i = 1; i < nums.length; i++) expect(nums[i]).toBeLessThanOrEqual(nums[i - 1]);
    await page.click('th[data-sort="cost"]');
    await shot('04-takeoff.png');
    await page.click('#group-by-kind');
    expect(await page.locator('#takeoff-table tr.group').count()).toBeGreaterThan(3);
  });

  it('exports DXF (merged and layers only) and XLSX that independent readers accept', async () => {
    const save = async (kind: string): Promise<string> => {
      const [dl] = await Promise.all([page.waitForEvent('download'), page.click(`[data-export="${kind}"]`)]);
      const file = path.join(ARTIFACTS, dl.suggestedFilename());
      fs.mkdirSync(ARTIFACTS, { recursive: true });
      await dl.saveAs(file);
      return file;
    };
    const merged = await save('dxf-merged');
    const layersOnly = await save('dxf-layers');
    const xlsx = await save('xlsx');
    expect(path.basename(merged)).toBe('site-routed.dxf');
    // `dxf` (npm) reads both; the trench centreline is there, and the merged file keeps the buildings
    for (const f of [merged, layersOnly]) {
      const helper = new DxfJs.Helper(fs.readFileSync(f, 'utf8'));
      const layers = new Set((helper.denormalised as { layer: string }[]).map((e) => e.layer));
      expect(layers.has('TRENCH-CENTERLINE'), f).toBe(true);
    }
    const mergedLayers = new Set((new DxfJs.Helper(fs.readFileSync(merged, 'utf8')).denormalised as { layer: string }[]).map((e) => e.layer));
    expect(mergedLayers.has('BLDG-OUTLINE')).toBe(true);
    // openpyxl (Python, independent of exceljs) opens the workbook; the notice heads the first sheet
    const out = execFileSync('/usr/bin/python3', ['-c', [
      'import sys, openpyxl',
      'wb = openpyxl.load_workbook(sys.argv[1])',
      'ws = wb.worksheets[0]',
      'print(len(wb.sheetnames)); print(ws.cell(1, 1).value)',
    ].join('\n'), xlsx], { encoding: 'utf8' });
    const [sheets, firstCell] = out.trim().split('\n');
    expect(Number(sheets)).toBeGreaterThanOrEqual(2);
    expect(firstCell).toContain('VERIFY BEFORE USE');
  });

  it('keeps the previous run beside a new one to compare', async () => {
    await page.click('[data-step="settings"]');
    await page.selectOption('select[data-setting="style"]', 'orthogonal');
    await page.click('[data-step="results"]');
    await page.click('#run-route');
    await page.waitForFunction(() => (window.furrowDebug?.runs ?? 0) >= 2 || document.getElementById('run-error'), null, { timeout: 120_000 });
    const heads = await page.locator('#run-figures thead th').allTextContents();
    expect(heads).toContain('Run 2');
    expect(heads).toContain('Run 1');
    await shot('05-compare.png');
  });

  it('saves the project and opens it again with the same points, roles and settings', async () => {
    const pts = await points();
    const [dl] = await Promise.all([page.waitForEvent('download'), page.click('#save-project')]);
    const file = path.join(ARTIFACTS, dl.suggestedFilename());
    await dl.saveAs(file);
    expect(path.extname(file)).toBe('.furrow');
    const saved = JSON.parse(fs.readFileSync(file, 'utf8'));
    expect(saved.schemaVersion).toBe(1);
    expect(saved.state.route.style).toBe('orthogonal');

    await page.goto(`${app.server.url}?empty`);
    await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
    expect(await page.locator('#doc-name').textContent()).toBe('No drawing');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('#open-project')]);
    await chooser.setFiles(file);
    await expect.poll(() => page.locator('#doc-name').textContent()).toBe('site.dxf (demo)');
    expect(await points()).toEqual(pts);
    await page.click('[data-step="settings"]');
    expect(await page.locator('select[data-setting="style"]').inputValue()).toBe('orthogonal');
  });

  it('refuses a damaged or newer project file with a clear message', async () => {
    const newer = path.join(ARTIFACTS, 'newer.furrow');
    fs.writeFileSync(newer, JSON.stringify({ format: 'furrow-project', schemaVersion: 99 }));
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('#open-project')]);
    await chooser.setFiles(newer);
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/newer Furrow \(schema 99\)/);
    const junk = path.join(ARTIFACTS, 'junk.furrow');
    fs.writeFileSync(junk, '<html>not a project</html>');
    const [chooser2] = await Promise.all([page.waitForEvent('filechooser'), page.click('#open-project')]);
    await chooser2.setFiles(junk);
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/not a Furrow project/);
    // the open document is kept
    expect(await page.locator('#doc-name').textContent()).toBe('site.dxf (demo)');
  });

  it('cancels a long run and stays responsive while it runs', async () => {
    await page.click('[data-step="settings"]');
    // 0.25 m cells: about 3 s for the demo here, while staying under the router's memory check (0.1 m is refused)
    await page.fill('input[data-setting="cellM"]', '0.25');
    await page.locator('input[data-setting="cellM"]').dispatchEvent('change');
    await page.fill('input[data-setting="timeBudgetMs"]', '120000');
    await page.locator('input[data-setting="timeBudgetMs"]').dispatchEvent('change');
    await page.click('[data-step="results"]');
    await page.click('#run-route');
    await page.waitForSelector('#run-progress', { timeout: 10_000 });
    // the interface thread is free: a page script answers quickly and steps still switch
    const t0 = Date.now();
    await page.evaluate(() => 1 + 1);
    expect(Date.now() - t0).toBeLessThan(1000);
    await page.click('[data-step="points"]');
    await page.click('[data-step="results"]');
    await page.waitForTimeout(300);
    expect(await page.locator('#run-progress').count()).toBe(1);
    await page.click('#cancel-run');
    await expect.poll(() => page.locator('#run-error').textContent(), { timeout: 3000 }).toBe('Run cancelled.');
    expect(await page.locator('#run-progress').count()).toBe(0);
    expect(await page.locator('#run-route').isEnabled()).toBe(true);
    expect(await page.evaluate(() => window.furrowDebug!.runs)).toBe(0);
  });

  it('explains an unreadable drawing and keeps the open one (never a blank screen)', async () => {
    const bad = path.join(ARTIFACTS, 'not-a-drawing.dxf');
    fs.writeFileSync(bad, 'this is not DXF <script>alert(1)</script>\n');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('#open-drawing')]);
    await chooser.setFiles(bad);
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/^Could not read not-a-drawing\.dxf: /);
    expect(await page.locator('#ui-message script').count()).toBe(0);
    expect(await page.locator('#doc-name').textContent()).toMatch(/^site\.dxf \(demo\)/);
    const png = await page.locator('canvas.site-canvas').screenshot();
    expect(countColour(png, [0xe3, 0xd5, 0xb8], 12)).toBeGreaterThan(100); // buildings still drawn (theme sandstone)
  });

  it('logged no page errors', () => {
    expect(errors).toEqual([]);
  });
});
