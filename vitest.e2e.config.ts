// Browser tests (tests/e2e/**/*.e2e.ts): one app started the way the start command starts
// it (its own PostgreSQL, Redis and fake SMTP in a temporary folder), driven by Debian's
// Chromium through playwright-core. Files run one after another: the machine has two cores.
import { defineConfig } from 'vitest/config';
import { testResolve } from './vitest.config';

export default defineConfig({
  resolve: testResolve,
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    pool: 'forks',
    fileParallelism: false,
    testTimeout: 120_000,
    hookTimeout: 240_000,
    teardownTimeout: 90_000,
    globalSetup: ['tests/e2e/support/global-setup.ts'],
  },
});
