// Bundles the Electron main process and the preload into CommonJS files in electron/dist/
// (the sandboxed preload cannot load modules from disk, so it must be one file).
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
const common = { bundle: true, platform: 'node', format: 'cjs', target: 'node20', external: ['electron'], sourcemap: false, logLevel: 'warning', absWorkingDir: here };
await build({ ...common, entryPoints: ['main.ts'], outfile: 'dist/main.cjs' });
await build({ ...common, entryPoints: ['preload.ts'], outfile: 'dist/preload.cjs' });
console.log('electron/dist/main.cjs and preload.cjs written');
