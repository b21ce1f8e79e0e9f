import { fileURLToPath, URL } from 'node:url';
import vue from '@vitejs/plugin-vue';
import { defineConfig } from 'vitest/config';

const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
};

export default defineConfig({
  plugins: [vue()],
  resolve: { alias },
  server: {
    // The Express server serves the API; the Vite dev server forwards to it.
    proxy: { '/api': `http://localhost:${process.env.PORT ?? 3000}` },
  },
  build: { outDir: 'dist', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  test: {
    include: ['tests/**/*.test.ts'],
    exclude: ['tests/e2e/**', 'node_modules/**'],
    // PGlite takes seconds to boot: each test file shares one instance.
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: 'forks',
    // One migrated database with the library seeded, built once per run for the server tests.
    globalSetup: ['tests/setup/seeded-database.ts'],
    benchmark: { include: ['tests/bench/**/*.bench.ts'] },
  },
});
