// No lost work in the browser: unsaved edits are autosaved to localStorage; after a crash (the page
// dies without a clean save) the app offers to restore them with the autosave's time, Restore brings
// the edit back through the project parser, Discard empties the slot, and a clean save empties it too.
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { collectErrors, ensureRendererBuilt, launchBrowser, saveArtifact, serveDir, DIST, type Browser, type StaticServer } from './harness';

let server: StaticServer;
let browser: Browser;
let page: Page;
let errors: string[] = [];

const SLOT_KEY = 'furrow.recovery';

async function openApp(query = ''): Promise<void> {
  page = await browser.context.newPage();
  page.setDefaultTimeout(15_000);
  errors = collectErrors(page);
  await page.goto(`${server.url}${query}`);
  await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
}

async function slot(): Promise<{ savedAt: string; project: string } | null> {
  const raw = await page.evaluate((k) => window.localStorage.getItem(k), SLOT_KEY);
  return raw === null ? null : JSON.parse(raw);
}

async function buildingRole(): Promise<string> {
  await page.click('[data-step="layers"]');
  return page.locator('select[data-layer="BLDG-OUTLINE"]').inputValue();
}

/** Kill the renderer process the way a crash would: no pagehide, no clean save. */
async function crash(): Promise<void> {
  const cdp = await browser.context.newCDPSession(page);
  const crashed = page.waitForEvent('crash');
  void cdp.send('Page.crash').catch(() => undefined); // never answers: the page dies
  await crashed;
  await page.close().catch(() => undefined);
}

beforeAll(async () => {
  await ensureRendererBuilt();
  server = await serveDir(DIST);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('autosave and restore after a crash', () => {
  it('autosaves an edit, and after a crash offers it back with the time and restores it', async () => {
    await openApp('?autosaveSeconds=3600'); // the timer stays out of the way; the hook autosaves
    expect(await page.evaluate(() => window.furrowDebug!.autosaveIntervalMs)).toBe(3_600_000);
    expect(await page.locator('#recovery-offer').count()).toBe(0);
    expect(await slot()).toBeNull();
    // nothing unsaved yet: nothing is written
    expect(await page.evaluate(() => window.furrowDebug!.autosaveNow!())).toBe(false);
    expect(await slot()).toBeNull();

    expect(await buildingRole()).toBe('building');
    await page.selectOption('select[data-layer="BLDG-OUTLINE"]', 'ignore');
    const before = Date.now();
    expect(await page.evaluate(() => window.furrowDebug!.autosaveNow!())).toBe(true);
    const saved = await slot();
    expect(saved).not.toBeNull();
    expect(Math.abs(Date.parse(saved!.savedAt) - before)).toBeLessThan(10_000);
    const project = JSON.parse(saved!.project);
    expect(project.format).toBe('furrow-project');
    expect(project.state.roles['BLDG-OUTLINE']).toBe('ignore');
    // the same state is not written twice
    expect(await page.evaluate(() => window.furrowDebug!.autosaveNow!())).toBe(false);

    await crash();
    await openApp('?autosaveSeconds=3600');
    const offer = page.locator('#recovery-offer');
    await expect.poll(() => offer.isVisible()).toBe(true);
    expect(await offer.textContent()).toMatch(/site\.dxf/);
    const shown = await page.locator('#recovery-time').textContent();
    const expected = await page.evaluate((iso) => {
      const d = new Date(iso);
      return d.toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit', second: '2-digit' });
    }, saved!.savedAt);
    expect(shown).toContain(expected);
    expect(await page.locator('#recovery-restore').textContent()).toBe('Restore');
    expect(await page.locator('#recovery-discard').textContent()).toBe('Discard');
    saveArtifact('recovery-offer.png', await page.screenshot());
    // the freshly opened demo has the original role until the user restores
    expect(await buildingRole()).toBe('building');

    await page.click('#recovery-restore');
    await expect.poll(() => offer.count()).toBe(0);
    expect(await page.locator('#ui-message').textContent()).toMatch(/Restored/);
    expect(await page.locator('#doc-name').textContent()).toMatch(/•/); // restored work is unsaved
    expect(await buildingRole()).toBe('ignore');
    expect(errors).toEqual([]);
  });

  it('autosaves on its own timer, and Discard empties the slot so the offer does not come back', async () => {
    await page.close();
    await openApp('?autosaveSeconds=1');
    // the restored work of the first test was never saved, so it is offered again
    expect(await slot()).not.toBeNull();
    await expect.poll(() => page.locator('#recovery-offer').isVisible()).toBe(true);
    await page.click('#recovery-discard');
    await expect.poll(() => slot()).toBeNull();

    await page.click('[data-step="settings"]');
    await page.selectOption('select[data-setting="style"]', 'orthogonal');
    // within a few ticks of the one-second timer the slot holds the edit, with no hook called
    await expect.poll(async () => (await slot())?.project ?? '', { timeout: 8_000 }).toMatch(/"style":\s*"orthogonal"/);

    await crash();
    await openApp('?autosaveSeconds=1');
    await expect.poll(() => page.locator('#recovery-offer').isVisible()).toBe(true);
    await page.click('#recovery-discard');
    expect(await page.locator('#recovery-offer').count()).toBe(0);
    expect(await slot()).toBeNull();
    await page.click('[data-step="settings"]');
    expect(await page.locator('select[data-setting="style"]').inputValue()).not.toBe('orthogonal');

    // a clean close (no unsaved edits) leaves no slot, so a reload offers nothing
    await page.reload();
    await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
    expect(await page.locator('#recovery-offer').count()).toBe(0);
    expect(await slot()).toBeNull();
    expect(errors).toEqual([]);
  });

  it('writes the slot when the page is closed with unsaved edits, and a clean save empties it', async () => {
    await page.click('[data-step="settings"]');
    await page.selectOption('select[data-setting="style"]', 'orthogonal');
    expect(await slot()).toBeNull();
    await page.reload(); // pagehide with unsaved edits: written on the way out
    await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
    await expect.poll(() => page.locator('#recovery-offer').isVisible()).toBe(true);
    await page.click('#recovery-restore');
    await page.click('[data-step="settings"]');
    expect(await page.locator('select[data-setting="style"]').inputValue()).toBe('orthogonal');
    expect(await page.evaluate(() => window.furrowDebug!.autosaveNow!())).toBe(true);
    expect(await slot()).not.toBeNull();

    const [dl] = await Promise.all([page.waitForEvent('download'), page.click('#save-project')]);
    const saved = JSON.parse(fs.readFileSync((await dl.path())!, 'utf8'));
    expect(saved.state.route.style).toBe('orthogonal');
    await expect.poll(() => slot()).toBeNull();
    expect(await page.locator('#doc-name').textContent()).not.toMatch(/•/);
    expect(errors).toEqual([]);
  });

  it('lets the user set the autosave interval (default 3 min), refusing values out of range', async () => {
    await page.goto(server.url); // no address override: the default applies
    await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
    expect(await page.evaluate(() => window.furrowDebug!.autosaveIntervalMs)).toBe(180_000);
    await page.click('[data-step="settings"]');
    const input = page.locator('input[data-pref="autosave-minutes"]');
    expect(await input.inputValue()).toBe('3');
    await input.fill('0');
    await input.dispatchEvent('change');
    await expect.poll(() => page.locator('#ui-message').textContent()).toMatch(/between 0\.5 and 120 min/);
    expect(await page.evaluate(() => window.furrowDebug!.autosaveIntervalMs)).toBe(180_000);
    await input.fill('1.5');
    await input.dispatchEvent('change');
    expect(await page.evaluate(() => window.furrowDebug!.autosaveIntervalMs)).toBe(90_000);
    // kept for the next start
    await page.reload();
    await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
    expect(await page.evaluate(() => window.furrowDebug!.autosaveIntervalMs)).toBe(90_000);
    expect(errors, errors.join('\n')).toEqual([]);
  });

  it('validates the autosave on Restore: a damaged or newer one is explained, and Discard clears it', async () => {
    await page.evaluate((k) => window.localStorage.setItem(k, JSON.stringify({
      savedAt: '2026-12-02T09:15:00.000Z', project: JSON.stringify({ format: 'furrow-project', schemaVersion: 99 }),
    })), SLOT_KEY);
    await crash(); // (a clean reload would empty the slot: nothing is unsaved here)
    await openApp();
    await expect.poll(() => page.locator('#recovery-offer').isVisible()).toBe(true);
    expect(await page.locator('#recovery-problem').isVisible()).toBe(false);
    await page.click('#recovery-restore');
    // parseProject refuses it; the message says why and the open drawing is untouched
    await expect.poll(() => page.locator('#recovery-problem').isVisible()).toBe(true);
    expect(await page.locator('#recovery-problem').textContent()).toMatch(/cannot be restored: .*newer/i);
    expect(await page.locator('#doc-name').textContent()).toMatch(/^site\.dxf \(demo\)$/);
    await page.click('#recovery-discard');
    expect(await page.locator('#recovery-offer').count()).toBe(0);
    expect(await slot()).toBeNull();
    expect(errors, errors.join('\n')).toEqual([]);
  });
});
