import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./', import.meta.url)),
      // 'server-only' throws outside React Server Components; data-layer modules are tested directly.
      'server-only': fileURLToPath(new URL('./tests/support/empty.ts', import.meta.url)),
    },
  },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts'],
    environment: 'node',
    setupFiles: ['tests/support/fast-check-seed.ts'],
    pool: 'forks',
    server: { deps: { inline: ['next-auth', '@auth/core'] } },
    testTimeout: 20_000,
  },
});
