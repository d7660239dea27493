// One vitest configuration for every suite. Client tests opt into jsdom with a
// `// @vitest-environment jsdom` line; API and worker tests read DATABASE_URL and
// REDIS_URL that scripts/test.ts sets after starting throwaway servers.
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

/** The import aliases of every suite (the browser tests' configuration reads them too). */
export const testResolve = {
  alias: {
    '@': fileURLToPath(new URL('./src', import.meta.url)),
    '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    '@server': fileURLToPath(new URL('./server', import.meta.url)),
  },
};

export default defineConfig({
  resolve: testResolve,
  test: {
    include: ['tests/**/*.test.{ts,tsx}'],
    exclude: ['tests/e2e/**', 'node_modules/**'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: 'forks',
    globalSetup: ['tests/support/global-setup.ts'],
    setupFiles: ['tests/support/setup-testing-library.ts'],
  },
});
