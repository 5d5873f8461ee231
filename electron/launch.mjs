// `npm start`: builds what is missing (renderer, main/preload bundle) and runs the real Electron binary
// on this folder. With no file argument it opens the demo site assets/demo/site.dxf.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRequire } from 'node:module';

const repo = fileURLToPath(new URL('..', import.meta.url));
const require = createRequire(import.meta.url);
const run = (cmd, args) => {
  const r = spawnSync(cmd, args, { cwd: repo, stdio: 'inherit', shell: process.platform === 'win32' });
  if (r.status !== 0) process.exit(r.status ?? 1);
};
// Rebuild when a source file is newer than the built output (so a pulled change is never run stale).
const newest = (dir) => {
  let t = 0;
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    if (e.name === 'dist' || e.name === 'node_modules') continue;
    const p = path.join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : fs.statSync(p).mtimeMs);
  }
  return t;
};
const builtAt = (file) => (fs.existsSync(file) ? fs.statSync(file).mtimeMs : -1);
const sources = Math.max(newest(path.join(repo, 'core')), newest(path.join(repo, 'renderer')));
if (builtAt(path.join(repo, 'renderer', 'dist', 'index.html')) < sources) run('npx', ['vite', 'build', '--config', 'renderer/vite.config.ts']);
if (builtAt(path.join(repo, 'electron', 'dist', 'main.cjs')) < Math.max(sources, newest(path.join(repo, 'electron')))) run(process.execPath, [path.join(repo, 'electron', 'bundle.mjs')]);

// Electron 45 fetches its runtime on first use rather than at npm install: do that once here.
const electronDir = path.dirname(require.resolve('electron/package.json'));
const binaryReady = () => {
  try {
    const p = require('electron');
    return typeof p === 'string' && fs.existsSync(p);
  } catch {
    return false;
  }
};
if (!binaryReady()) {
  console.error('Fetching the Electron runtime (first start only)...');
  spawnSync(process.execPath, [path.join(electronDir, 'install.js')], { cwd: electronDir, stdio: 'inherit' });
  for (const k of Object.keys(require.cache)) if (k.startsWith(electronDir)) delete require.cache[k];
}

let electronBinary;
try {
  electronBinary = require('electron'); // the package exports the binary's path
} catch (e) {
  console.error(`Electron is not installed (${e.message}). Install it with npm, or use \`npm run web\` for the browser version.`);
  process.exit(1);
}
if (typeof electronBinary !== 'string' || !fs.existsSync(electronBinary)) {
  console.error('The Electron binary is missing (its download may have been blocked). Use `npm run web` for the browser version.');
  process.exit(1);
}
const fileArgs = process.argv.slice(2);
const env = { ...process.env };
if (!fileArgs.some((a) => !a.startsWith('-'))) env.FURROW_OPEN = path.join(repo, 'assets', 'demo', 'site.dxf');
const child = spawn(electronBinary, [repo, ...fileArgs], { stdio: 'inherit', env });
child.on('exit', (code) => process.exit(code ?? 0));
