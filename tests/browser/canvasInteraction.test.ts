// Canvas interaction in headless Chromium: wheel zoom about the cursor, drag to pan, fit, the scale
// bar, cursor coordinates in drawing units, moving and deleting a point, and hover labels.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, saveArtifact, ARTIFACTS, type OpenApp } from './harness';

let app: OpenApp;
let page: Page;
let errors: string[];

type View = { scale: number; tx: number; ty: number; ox: number; oy: number };
const view = (): Promise<View> => page.evaluate(() => ({ ...window.furrowDebug!.view! }));
async function box(): Promise<{ x: number; y: number; width: number; height: number }> {
  return (await page.locator('canvas.site-canvas').boundingBox())!;
}
/** Screen (page) position → drawing coordinates with the app's last view; the formula is the test's own. */
async function toDrawing(px: number, py: number): Promise<{ x: number; y: number }> {
  const v = await view();
  const b = await box();
  return { x: (px - b.x - v.tx) / v.scale + v.ox, y: -(py - b.y - v.ty) / v.scale + v.oy };
}
async function toPage(x: number, y: number): Promise<{ x: number; y: number }> {
  const v = await view();
  const b = await box();
  return { x: b.x + (x - v.ox) * v.scale + v.tx, y: b.y - (y - v.oy) * v.scale + v.ty };
}
/** Wait past the crisp re-render that follows a view change (SETTLE_MS = 160 in siteCanvas.ts). */
async function settled(): Promise<void> {
  await page.waitForTimeout(300);
}

beforeAll(async () => {
  app = await openApp();
  ({ page, errors } = app);
});

afterAll(async () => {
  await app?.close();
});

describe('canvas navigation and editing', () => {
  it('zooms with the wheel about the cursor: the drawing point under it stays put', async () => {
    const b = await box();
    const at = { x: b.x + b.width * 0.3, y: b.y + b.height * 0.6 };
    await page.mouse.move(at.x, at.y);
    const before = await toDrawing(at.x, at.y);
    const s0 = (await view()).scale;
    await page.mouse.wheel(0, -300);
    await page.waitForFunction((s) => window.furrowDebug!.view!.scale > s * 1.5, s0);
    await settled();
    const after = await toDrawing(at.x, at.y);
    expect((await view()).scale).toBeCloseTo(s0 * Math.pow(1.2, 3), 6);
    expect(Math.hypot(after.x - before.x, after.y - before.y)).toBeLessThan(1e-6 * Math.max(1, Math.abs(before.x)));
    // the status line shows the cursor in drawing units (the demo is in metres)
    await page.mouse.move(at.x + 1, at.y);
    const xy = await page.locator('#cursor-xy').textContent();
    const m = /X ([\d.]+)\s+Y ([\d.]+) m/.exec(xy ?? '');
    expect(m).not.toBeNull();
    const shown = await toDrawing(at.x + 1, at.y);
    expect(Math.abs(Number(m![1]) - shown.x)).toBeLessThan(0.002);
    expect(Math.abs(Number(m![2]) - shown.y)).toBeLessThan(0.002);
  });

  it('updates the scale bar to a 1-2-5 length that matches the zoom', async () => {
    const label = await page.locator('.scalebar-label').textContent();
    const len = Number(/^([\d.]+) m$/.exec(label ?? '')![1]);
    const px = await page.locator('.scalebar-bar').evaluate((el) => el.getBoundingClientRect().width);
    const { scale } = await view();
    expect(Math.abs(px - len * scale)).toBeLessThan(1.5);
    expect(String(len / 10 ** Math.floor(Math.log10(len)))).toMatch(/^(1|2|5)$/);
  });

  it('pans with space+drag and fits back', async () => {
    const v0 = await view();
    const b = await box();
    await page.mouse.move(b.x + 400, b.y + 300);
    await page.keyboard.down('Space');
    await page.mouse.down();
    await page.mouse.move(b.x + 480, b.y + 260, { steps: 6 });
    await page.mouse.up();
    await page.keyboard.up('Space');
    await settled();
    const v1 = await view();
    expect(v1.tx - v0.tx).toBeCloseTo(80, 6);
    expect(v1.ty - v0.ty).toBeCloseTo(-40, 6);
    expect(v1.scale).toBe(v0.scale);
    saveArtifact('10-zoomed-panned.png', await page.screenshot());
    await page.click('#fit');
    await settled();
    expect((await view()).scale).toBeLessThan(v1.scale);
  });

  it('moves a point by dragging (services snap back onto a wall), then deletes it; undo brings it back', async () => {
    await page.click('[data-step="points"]');
    await page.click('[data-tool="select"]');
    const s1 = { x: 512045, y: 4180085 }; // S1 in the demo services.csv
    const from = await toPage(s1.x, s1.y);
    const to = await toPage(s1.x + 4, s1.y);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(to.x, to.y, { steps: 5 });
    await page.mouse.up();
    await expect.poll(() => page.locator('#selected-xy').textContent()).toMatch(/^S1: X 512,049\.\d{3}/);
    const xy = /X ([\d,.]+)\s+Y ([\d,.]+)/.exec((await page.locator('#selected-xy').textContent())!)!;
    // dropped along the same wall: x moved by ~4 m, y stays on the wall line
    expect(Math.abs(Number(xy[1].replace(/,/g, '')) - (s1.x + 4))).toBeLessThan(0.05);
    expect(Math.abs(Number(xy[2].replace(/,/g, '')) - s1.y)).toBeLessThan(0.01);
    const count = await page.locator('#points-table tbody tr').count();
    await page.click('#delete-point');
    expect(await page.locator('#points-table tbody tr').count()).toBe(count - 1);
    await page.click('#undo');
    expect(await page.locator('#points-table tbody tr').count()).toBe(count);
    await page.click('#undo');
    await expect.poll(() => page.locator('tr[data-point="S1"]').count()).toBe(1);
  });

  it('shows a label when hovering a point, as plain text', async () => {
    const p = await toPage(512045, 4180085);
    await page.mouse.move(p.x, p.y);
    await expect.poll(() => page.locator('#hover-tip').isVisible()).toBe(true);
    const tip = page.locator('#hover-tip');
    expect(await tip.textContent()).toMatch(/^Service S1/);
    expect(await tip.evaluate((el) => el.children.length)).toBe(0); // text only, no markup
  });

  it('imports points from a services CSV (undoable) and reports a bad one by line', async () => {
    fs.mkdirSync(ARTIFACTS, { recursive: true });
    const good = path.join(ARTIFACTS, 'two-points.csv');
    fs.writeFileSync(good, 'id,x,y,role,utilities\nP1,512125,4180000.5,connection,power\nB7,512045,4180085,service,power\n');
    await page.click('[data-step="points"]');
    const before = await page.locator('#points-table tbody tr').count();
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.click('#import-points')]);
    await chooser.setFiles(good);
    await expect.poll(() => page.locator('#points-table tbody tr').evaluateAll((r) => r.map((x) => x.getAttribute('data-point')))).toEqual(['P1', 'B7']);
    await page.click('#undo');
    await expect.poll(() => page.locator('#points-table tbody tr').count()).toBe(before);
    const bad = path.join(ARTIFACTS, 'bad-points.csv');
    fs.writeFileSync(bad, 'id,x,y,role,utilities\nP1,512125,4180000.5,connection,power\nB7,east,4180085,service,power\n');
    const [chooser2] = await Promise.all([page.waitForEvent('filechooser'), page.click('#import-points')]);
    await chooser2.setFiles(bad);
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/line 3/);
    expect(await page.locator('#points-table tbody tr').count()).toBe(before);
  });

  it('logged no page errors', () => {
    expect(errors).toEqual([]);
  });
});
