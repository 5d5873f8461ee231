// Layer rules: core is pure (no electron, DOM libraries, pixi or Node-only modules, except
// core/io and core/cli, which are the file-system edge); renderer never imports electron/.
import tseslint from 'typescript-eslint';

const nodeBuiltins = ['fs', 'path', 'os', 'child_process', 'worker_threads', 'url', 'crypto', 'stream', 'util', 'process', 'readline', 'zlib', 'http', 'https', 'net'];
const nodeOnly = nodeBuiltins.flatMap((m) => [m, `node:${m}`, `${m}/*`, `node:${m}/*`]);

export default tseslint.config(
  { ignores: ['node_modules/**', '**/dist/**', 'out/**', 'tests/artifacts/**', '**/*.cjs'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
  {
    files: ['core/**/*.ts'],
    ignores: ['core/io/**', 'core/cli/**'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: nodeOnly.filter((m) => !m.includes('*')).concat(['electron', 'pixi.js']).map((name) => ({ name, message: 'core/ is pure: file I/O and platform code belong in core/io, core/cli, renderer/ or electron/.' })),
        patterns: [
          { group: ['**/renderer/**', '**/electron/**', '../../renderer/*', '../../electron/*'], message: 'core/ must not import upward (renderer/, electron/).' },
          { group: ['node:*'], message: 'core/ is pure: Node-only modules belong in core/io or core/cli.' },
        ],
      }],
    },
  },
  {
    files: ['renderer/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: ['electron', ...nodeOnly.filter((m) => !m.includes('*'))].map((name) => ({ name, message: 'renderer/ talks to the shell only through the typed bridge (electron/contract.ts).' })),
        patterns: [
          { group: ['**/electron/main*', '**/electron/preload*', '**/core/io/**', '**/core/cli/**'], message: 'renderer/ must not import the Electron main/preload or the Node edge of core.' },
        ],
      }],
    },
  },
);
