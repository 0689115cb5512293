import { defineConfig } from 'vitest/config';

// Browser tests: the production build served by the real server over the test database,
// driven through playwright-core in Debian's chromium. `npm test` runs them after the build.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    name: 'browser',
    environment: 'node',
    include: ['tests/e2e/**/*.e2e.ts'],
    globalSetup: ['tests/e2e/global-setup.ts'],
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 90_000,
  },
});
