// Shared setup for browser tests: build the renderer once (cached by timestamps), serve
// renderer/dist from a tiny static server on 127.0.0.1 (random port), and drive Debian's Chromium
// headless through playwright-core with software WebGL (SwiftShader) — no GPU needed.

import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { PNG } from 'pngjs';

export const REPO = fileURLToPath(new URL('../..', import.meta.url));
export const DIST = path.join(REPO, 'renderer', 'dist');
export const ARTIFACTS = path.join(REPO, 'tests', '.tmp', 'browser');
export const CHROMIUM = process.env.FURROW_CHROMIUM ?? '/usr/bin/chromium';

function newestMtime(dir: string): number {
  let newest = 0;
  if (!fs.existsSync(dir)) return 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'dist' || entry.name === 'node_modules') continue;
    const p = path.join(dir, entry.name);
    const t = entry.isDirectory() ? newestMtime(p) : fs.statSync(p).mtimeMs;
    if (t > newest) newest = t;
  }
  return newest;
}

/** Build renderer/dist unless it is newer than every renderer, core and demo source. */
export async function ensureRendererBuilt(): Promise<void> {
  const indexHtml = path.join(DIST, 'index.html');
  const built = fs.existsSync(indexHtml) ? fs.statSync(indexHtml).mtimeMs : 0;
  const sources = Math.max(
    newestMtime(path.join(REPO, 'renderer')),
    newestMtime(path.join(REPO, 'core')),
    newestMtime(path.join(REPO, 'assets', 'demo')),
  );
  if (built > sources) return;
  // one build at a time across parallel test files
  const lock = path.join(REPO, 'tests', '.tmp', 'renderer-build.lock');
  fs.mkdirSync(path.dirname(lock), { recursive: true });
  for (let i = 0; ; i++) {
    try { fs.mkdirSync(lock); break; } catch {
      if (i > 600) throw new Error(`renderer build lock ${lock} held for 10 minutes`);
      await new Promise((r) => setTimeout(r, 1000));
      if (fs.existsSync(indexHtml) && fs.statSync(indexHtml).mtimeMs > sources) return;
    }
  }
  try {
    const { build } = await import('vite');
    await build({ configFile: path.join(REPO, 'renderer', 'vite.config.ts'), logLevel: 'warn' });
  } finally {
    fs.rmSync(lock, { recursive: true, force: true });
  }
}

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript', '.mjs': 'text/javascript', '.css': 'text/css',
  '.json': 'application/json', '.png': 'image/png', '.svg': 'image/svg+xml', '.wasm': 'application/wasm',
  '.dxf': 'text/plain', '.csv': 'text/csv', '.woff2': 'font/woff2',
};

export interface StaticServer { url: string; close(): Promise<void> }

export async function serveDir(dir: string): Promise<StaticServer> {
  const root = path.resolve(dir);
  const server = http.createServer((req, res) => {
    const urlPath = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    const file = path.resolve(root, '.' + (urlPath.endsWith('/') ? urlPath + 'index.html' : urlPath));
    if (!file.startsWith(root + path.sep) || !fs.existsSync(file) || !fs.statSync(file).isFile()) {
      res.writeHead(404).end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': MIME[path.extname(file)] ?? 'application/octet-stream', 'cache-control': 'no-store' });
    fs.createReadStream(file).pipe(res);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const addr = server.address();
  if (!addr || typeof addr === 'string') throw new Error('server has no port');
  return {
    url: `http://127.0.0.1:${addr.port}/`,
    close: () => new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); }),
  };
}

export interface Browser { context: BrowserContext; userDataDir: string; close(): Promise<void> }

export async function launchBrowser(viewport = { width: 1280, height: 800 }): Promise<Browser> {
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'furrow-chromium-'));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    viewport,
    acceptDownloads: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run',
      // software WebGL through SwiftShader (Chromium no longer falls back to it silently)
      '--enable-unsafe-swiftshader', '--use-angle=swiftshader',
    ],
  });
  return {
    context,
    userDataDir,
    close: async () => {
      await context.close();
      fs.rmSync(userDataDir, { recursive: true, force: true });
    },
  };
}

/** Page errors and console errors collected for assertions. */
export function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(`console: ${m.text()}`); });
  return errors;
}

export interface PixelCount { total: number; differing: number; colours: number }

/** Count pixels that differ from `background` by more than `tolerance` in any channel. */
export function countNonBackground(png: Buffer, background: number, tolerance = 12): PixelCount {
  const img = PNG.sync.read(png);
  const br = (background >> 16) & 255, bg = (background >> 8) & 255, bb = background & 255;
  let differing = 0;
  const colours = new Set<number>();
  for (let i = 0; i < img.data.length; i += 4) {
    const r = img.data[i], g = img.data[i + 1], b = img.data[i + 2];
    if (Math.abs(r - br) > tolerance || Math.abs(g - bg) > tolerance || Math.abs(b - bb) > tolerance) {
      differing++;
      if (colours.size < 4096) colours.add(((r >> 3) << 10) | ((g >> 3) << 5) | (b >> 3));
    }
  }
  return { total: img.width * img.height, differing, colours: colours.size };
}

export function saveArtifact(name: string, data: Buffer): string {
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  const p = path.join(ARTIFACTS, name);
  fs.writeFileSync(p, data);
  return p;
}

export interface OpenApp { server: StaticServer; browser: Browser; page: Page; errors: string[]; close(): Promise<void> }

/** Builds the renderer if needed, serves it, opens it in Chromium and waits until the demo is ready. */
export async function openApp(query = ''): Promise<OpenApp> {
  await ensureRendererBuilt();
  const server = await serveDir(DIST);
  const browser = await launchBrowser();
  const page = await browser.context.newPage();
  page.setDefaultTimeout(15_000);
  const errors = collectErrors(page);
  await page.goto(server.url + query);
  await page.waitForFunction(() => window.furrowDebug?.ready === true, null, { timeout: 60_000 });
  return { server, browser, page, errors, close: async () => { await browser.close(); await server.close(); } };
}
