import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  root,
  test: {
    include: ['test/**/*.test.ts'],
    // Browser tests run under Playwright, against the browser host (test/e2e).
    exclude: ['test/e2e/**', 'node_modules/**'],
    environment: 'node',
    testTimeout: 60_000,
    pool: 'forks',
    globalSetup: ['test/support/vitestGlobalSetup.ts'],
  },
});
