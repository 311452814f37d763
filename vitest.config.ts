import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  plugins: [react()],
  // Tests run server code outside Next.js: `server-only` is its empty module here (scripts/outside-next.cjs).
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./', import.meta.url)),
      'server-only': fileURLToPath(new URL('./node_modules/server-only/empty.js', import.meta.url)),
    },
  },
  test: {
    environment: 'node',
    include: ['tests/unit/**/*.test.{ts,tsx}', 'tests/integration/**/*.test.{ts,tsx}'],
    // Integration tests share one database, so files run one at a time.
    fileParallelism: false,
    // The integration tests play the proxy: each scenario sends its own X-Forwarded-For, so its
    // limits are its own. tests/integration/trust-proxy.test.ts runs without (TRUST_PROXY=false).
    env: { TRUST_PROXY: 'true' },
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
