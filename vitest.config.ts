import { defineConfig } from 'vitest/config';

// Unit and API tests. Node for shared/ and server/, jsdom for React components.
// API tests need DATABASE_URL pointing at a migrated, disposable database: `npm test` sets it.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'node',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'jsdom',
          environment: 'jsdom',
          include: ['tests/unit/**/*.test.tsx'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          testTimeout: 20_000,
        },
      },
    ],
  },
});
