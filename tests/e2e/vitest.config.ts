import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests: one Chromium per file, a fresh context per test, files one after another (one server).
export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('../../src', import.meta.url)),
      '@shared': fileURLToPath(new URL('../../shared', import.meta.url)),
    },
  },
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // The machine may be busy (argon2 hashing, two cores): give polled expectations as long as a locator.
    expect: { poll: { timeout: 15_000 } },
    fileParallelism: false,
    pool: 'forks',
  },
});
