// The renderer loads and draws the demo site in headless Chromium with software WebGL.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { collectErrors, countNonBackground, ensureRendererBuilt, launchBrowser, saveArtifact, serveDir, DIST, type Browser, type StaticServer } from './harness';

// Canvas background of the "loam" theme (renderer/src/theme.ts CANVAS_BACKGROUND).
const BACKGROUND = 0x1a1d17;

let server: StaticServer;
let browser: Browser;
let page: Page;
let errors: string[];

beforeAll(async () => {
  await ensureRendererBuilt();
  server = await serveDir(DIST);
  browser = await launchBrowser();
  page = await browser.context.newPage();
  errors = collectErrors(page);
  await page.goto(server.url);
  await page.waitForFunction(() => window.furrowDebug?.ready === true || window.furrowDebug?.lastError, null, { timeout: 60_000 });
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('renderer loads and draws the demo site', () => {
  it('opens the demo drawing without errors', async () => {
    const debug = await page.evaluate(() => window.furrowDebug);
    expect(debug?.lastError).toBeNull();
    expect(debug?.drawingName).toContain('site.dxf');
    expect(debug?.layerCount).toBeGreaterThan(5);
    expect(debug?.segmentCount).toBeGreaterThan(100);
    expect(errors).toEqual([]);
  });

  it('draws with WebGL, not a fallback', async () => {
    expect(await page.locator('canvas.site-canvas').getAttribute('data-renderer')).toBe('webgl');
  });

  it('paints the canvas: many non-background pixels in several role colours', async () => {
    const png = await page.locator('canvas.site-canvas').screenshot();
    saveArtifact('demo-site-canvas.png', png);
    const count = countNonBackground(png, BACKGROUND);
    // A blank or cleared canvas has ~0 differing pixels; the demo's buildings, roads and boundary
    // cover well over 1 % of the canvas at fit zoom.
    expect(count.differing / count.total).toBeGreaterThan(0.01);
    expect(count.colours).toBeGreaterThan(4);
    // ... and most of it is still the theme's background (a wrongly composited layer tints it all)
    expect(count.differing / count.total).toBeLessThan(0.5);
  });

  it('an empty canvas really counts as blank (the check can fail)', async () => {
    const blank = await page.evaluate(async () => {
      const c = document.createElement('canvas');
      c.width = 64; c.height = 64;
      const ctx = c.getContext('2d')!;
      ctx.fillStyle = '#1a1d17';
      ctx.fillRect(0, 0, 64, 64);
      return c.toDataURL('image/png');
    });
    const count = countNonBackground(Buffer.from(blank.split(',')[1], 'base64'), BACKGROUND);
    expect(count.differing).toBe(0);
  });
});
