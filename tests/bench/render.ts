// Render benchmark: a generated drawing of 100,000 entities drawn by the app's pixi.js canvas in
// headless Chromium with software WebGL (SwiftShader, no GPU). Targets: first draw <= 2 s and
// pan/zoom frame p95 <= 50 ms. Peer in the same page: the same drawing stroked with Canvas 2D.
// Pan/zoom frames move a snapshot of the drawing (see renderer/src/canvas/siteCanvas.ts); the crisp
// re-render after the view settles is reported separately (settle*Ms) — it is not hidden.
// The machine's load average is printed with each line: shared cores make every figure slower.
// One JSON line per case.   npx tsx tests/bench/render.ts [--entities 100000] [--frames 120]
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { build } from 'esbuild';
import { launchBrowser, serveDir, REPO } from '../browser/harness';

const args = process.argv.slice(2);
const arg = (name: string, dflt: number): number => (args.includes(name) ? Number(args[args.indexOf(name) + 1]) : dflt);
const cases = args.includes('--entities') ? [arg('--entities', 100_000)] : [10_000, 100_000];
const frames = arg('--frames', 120);

const out = path.join(REPO, 'tests', '.tmp', 'render-bench');
fs.mkdirSync(out, { recursive: true });
await build({
  entryPoints: [path.join(REPO, 'tests', 'bench', 'renderPage.ts')],
  bundle: true, format: 'esm', target: 'es2022', outfile: path.join(out, 'bench.js'), logLevel: 'warning',
});
fs.writeFileSync(path.join(out, 'index.html'),
  '<!doctype html><html><head><meta charset="utf-8"><style>html,body{margin:0;height:100%}#host{position:absolute;inset:0}</style></head>' +
  '<body><div id="host"></div><script type="module" src="./bench.js"></script></body></html>');

const server = await serveDir(out);
const browser = await launchBrowser({ width: 1280, height: 800 });
let failed = false;
try {
  for (const n of cases) {
    const page = await browser.context.newPage();
    await page.goto(server.url);
    await page.waitForFunction(() => 'runRenderBench' in window);
    const r = await page.evaluate(([entities, f]) => (window as any).runRenderBench(entities, f), [n, frames] as const);
    const line = {
      bench: 'render', case: `${n} entities`, ...r,
      firstDrawMs: +r.firstDrawMs.toFixed(1), frameP50Ms: +r.frameP50Ms.toFixed(2), frameP95Ms: +r.frameP95Ms.toFixed(2),
      rafP50Ms: +r.rafP50Ms.toFixed(1), rafP95Ms: +r.rafP95Ms.toFixed(1),
      settleP50Ms: +r.settleP50Ms.toFixed(1), settleMaxMs: +r.settleMaxMs.toFixed(1),
      peerFirstDrawMs: +r.peerFirstDrawMs.toFixed(1), peerFrameP95Ms: +r.peerFrameP95Ms.toFixed(2),
      ratioFirstDrawVsCanvas2d: +(r.firstDrawMs / r.peerFirstDrawMs).toFixed(2),
      ratioFrameP95VsCanvas2d: +(r.frameP95Ms / r.peerFrameP95Ms).toFixed(3),
      targets: { firstDrawMs: 2000, frameP95Ms: 50 },
      loadAverage: +os.loadavg()[0].toFixed(2), cpus: os.cpus().length,
      pass: r.firstDrawMs <= 2000 && r.frameP95Ms <= 50 && r.rafP95Ms <= 50 && r.nonBackgroundPixels > 0,
    };
    if (n >= 100_000 && !line.pass) failed = true;
    console.log(JSON.stringify(line));
    await page.close();
  }
} finally {
  await browser.close();
  await server.close();
}
process.exitCode = failed ? 1 : 0;
