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
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    testTimeout: 30_000,
    hookTimeout: 120_000,
    pool: 'forks',
  },
});
