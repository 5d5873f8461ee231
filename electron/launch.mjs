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
if (!fs.existsSync(path.join(repo, 'renderer', 'dist', 'index.html'))) run('npx', ['vite', 'build', '--config', 'renderer/vite.config.ts']);
if (!fs.existsSync(path.join(repo, 'electron', 'dist', 'main.cjs'))) run(process.execPath, [path.join(repo, 'electron', 'bundle.mjs')]);

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
