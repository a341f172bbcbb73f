import { defineConfig } from 'vitest/config';
import path from 'node:path';

const alias = {
  '@shared': path.resolve(import.meta.dirname, 'shared'),
  '@backend': path.resolve(import.meta.dirname, 'backend/src'),
  '@frontend': path.resolve(import.meta.dirname, 'frontend/src'),
};

// Top-level config with root '.' so tests are found (vite.config.ts uses root 'frontend').
export default defineConfig({
  resolve: { alias },
  test: {
    root: '.',
    testTimeout: 30_000,
    hookTimeout: 120_000,
    pool: 'forks',
    projects: [
      {
        resolve: { alias },
        // Pure tests share one module graph per worker thread (no per-file isolation): loading the engine once per
        // worker instead of once per file halves the suite's time. A test that changes module state restores it.
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}', 'tests/reference/**/*.test.ts'],
          testTimeout: 60_000,
          pool: 'threads',
          isolate: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts', 'tests/security/**/*.test.ts', 'tests/e2e/**/*.test.ts', 'tests/faults/**/*.test.ts', 'tests/fuzz/**/*.test.ts'],
          globalSetup: ['tests/helpers/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
