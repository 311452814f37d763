import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

/** Browser tests: playwright-core drives Debian's chromium against the built app on $PORT. */
export default defineConfig({
  // Tests run server code outside Next.js: `server-only` is its empty module here (scripts/outside-next.cjs).
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./', import.meta.url)),
      'server-only': fileURLToPath(new URL('./node_modules/server-only/empty.js', import.meta.url)),
    },
  },
  test: {
    environment: 'node',
    include: ['tests/e2e/**/*.test.ts'],
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
