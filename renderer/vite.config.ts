// Vite config for the renderer: the same bundle runs in a plain browser (`npm run web`) and in
// the Electron window (served from the app:// scheme, hence the relative base).
// eslint-disable-next-line no-restricted-imports -- the build config runs in Node, not in the renderer
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

const rendererDir = fileURLToPath(new URL('.', import.meta.url));
const repoDir = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  root: rendererDir,
  base: './',
  publicDir: false,
  server: { host: '127.0.0.1', fs: { allow: [repoDir] } },
  preview: { host: '127.0.0.1' },
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    chunkSizeWarningLimit: 4096,
    sourcemap: false,
  },
});
