import { defineConfig } from 'vitest/config';

// Three projects in one run, so `npm test` ends with a single summary line:
// unit (pure shared/ code, no I/O), server (real PostgreSQL through tests/support/db.ts),
// browser (playwright-core driving Debian's Chromium against the built app).
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts', 'tests/unit/**/*.test.tsx'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'server',
          globalSetup: ['tests/support/global-setup.ts'],
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'browser',
          globalSetup: ['tests/support/global-setup.ts'],
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
