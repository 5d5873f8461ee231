import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  root: fileURLToPath(new URL("..", import.meta.url)),
  test: {
    include: ['tests/**/*.test.ts'],
    exclude: ['node_modules/**', 'tests/bench/**'],
    testTimeout: 120_000,
    hookTimeout: 180_000,
    pool: 'forks',
    fileParallelism: true,
    maxWorkers: 2,
  },
});
