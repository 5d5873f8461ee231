// The schedule writers bundled for the browser by Vite and run in Chromium (playwright-core):
// they must work without Node built-ins and give the same PDF and CSV bytes as in Node.
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import zlib from 'node:zlib';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from 'vite';
import { chromium } from 'playwright-core';
import type { Browser } from 'playwright-core';
import { sampleSchedules } from './browser/sample';

/** A PDF split into its inflated streams and the text around them (lengths and offsets dropped). */
function pdfParts(bytes: Uint8Array): { streams: string[]; frame: string } {
  const text = Buffer.from(bytes).toString('latin1');
  const streams: string[] = [];
  const frame = text
    .replace(/stream\n([\s\S]*?)\nendstream/g, (_m, body: string) => {
      streams.push(zlib.inflateSync(Buffer.from(body, 'latin1')).toString('latin1'));
      return 'stream';
    })
    .replace(/\/Length \d+/g, '/Length')
    .replace(/xref[\s\S]*$/, '');
  return { streams, frame };
}

const CHROMIUM = process.env.FURROW_CHROMIUM ?? '/usr/bin/chromium';
const SRC = path.resolve(__dirname, 'browser');
const OUT = path.resolve(__dirname, '../../.tmp/export-browser');

describe.skipIf(!fs.existsSync(CHROMIUM))('schedule writers in a Vite browser bundle', () => {
  let server: http.Server;
  let browser: Browser;
  let result: { pdf: number[]; xlsx: number[]; csv: string };
  let pageErrors: string[] = [];

  beforeAll(async () => {
    await build({ root: SRC, base: './', logLevel: 'error', configFile: false, build: { outDir: OUT, emptyOutDir: true, target: 'es2022', chunkSizeWarningLimit: 8192 } });
    server = http.createServer((req, res) => {
      const f = path.join(OUT, decodeURIComponent(!req.url || req.url === '/' ? '/index.html' : req.url));
      if (!f.startsWith(OUT) || !fs.existsSync(f)) { res.writeHead(404); res.end(); return; }
      res.writeHead(200, { 'content-type': f.endsWith('.js') ? 'text/javascript' : 'text/html' });
      res.end(fs.readFileSync(f));
    });
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox'] });
    const page = await browser.newPage();
    pageErrors = [];
    page.on('pageerror', (e) => pageErrors.push(String(e)));
    await page.goto(`http://127.0.0.1:${(server.address() as AddressInfo).port}/`);
    await page.waitForFunction(() => typeof (window as unknown as { runSchedules?: unknown }).runSchedules === 'function', null, { timeout: 60_000 });
    result = await page.evaluate(() => (window as unknown as { runSchedules: () => Promise<{ pdf: number[]; xlsx: number[]; csv: string }> }).runSchedules());
  });
  afterAll(async () => {
    await browser?.close();
    server?.close();
  });

  it('the bundle runs without errors and writes a PDF that poppler renders', () => {
    expect(pageErrors).toEqual([]);
    const pdf = path.join(OUT, 'browser.pdf');
    fs.writeFileSync(pdf, Uint8Array.from(result.pdf));
    const r = spawnSync('pdftoppm', ['-png', '-r', '30', '-f', '1', '-l', '1', '-singlefile', pdf, path.join(OUT, 'browser-page1')]);
    expect(r.status).toBe(0);
    expect(fs.statSync(path.join(OUT, 'browser-page1.png')).size).toBeGreaterThan(1000);
  });

  it('gives the same PDF content (inflated streams and objects) and CSV as Node, and a zip (XLSX) container', async () => {
    const node = await sampleSchedules();
    // The two builds deflate with different libraries, so compare what the streams hold.
    const a = pdfParts(Uint8Array.from(result.pdf));
    const b = pdfParts(node.pdf);
    expect(a.streams.length).toBeGreaterThan(0);
    expect(a.streams).toEqual(b.streams);
    expect(a.frame).toBe(b.frame);
    expect(result.csv).toBe(node.csv);
    expect(result.xlsx.slice(0, 4)).toEqual([0x50, 0x4b, 0x03, 0x04]); // "PK\3\4", ZIP local file header (APPNOTE)
  });
});
