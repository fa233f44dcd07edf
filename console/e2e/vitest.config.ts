import { defineConfig } from 'vitest/config';

// Browser tests: Node drives Debian's chromium through playwright-core against the production
// build served by the real server at LUMENWRIGHT_TEST_URL. One file at a time, one test at a time.
export default defineConfig({
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.ts'],
    root: new URL('..', import.meta.url).pathname,
    testTimeout: 180_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    maxWorkers: 1,
    sequence: { concurrent: false },
  },
});
