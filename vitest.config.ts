import { defineConfig } from 'vitest/config';

// Test files run in this many worker processes at once; each worker has a PostgreSQL database of
// its own (tests/helpers/global-setup.ts), and the files of one worker run one after another.
const workers = Math.max(1, Number(process.env.QUILTLINE_TEST_WORKERS ?? 2));

// Server tests that never touch the database (pure functions, PDFs, the fake payment service).
const pureServerTests = [
  'tests/server/invoices-pdf.test.ts',
  'tests/server/invoices-totals.test.ts',
  'tests/server/lib.test.ts',
  'tests/server/payments-config.test.ts',
  'tests/server/payments-fake-service.test.ts',
  'tests/server/storage-drivers.test.ts',
  'tests/server/test-summary.test.ts',
];

// Three projects: `unit` needs nothing running (`npm run test:unit`), `server` and `browser` get the
// PostgreSQL cluster and migrated databases from the global setup (run only when the project has
// files in the run). Component tests opt into a DOM with `// @vitest-environment happy-dom`.
export default defineConfig({
  test: {
    environment: 'node',
    fileParallelism: workers > 1,
    maxWorkers: workers,
    testTimeout: 30_000,
    hookTimeout: 120_000,
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/{shared,editor,client}/**/*.test.{ts,tsx}', ...pureServerTests] },
      },
      {
        extends: true,
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          exclude: pureServerTests,
          globalSetup: ['tests/helpers/global-setup.ts'],
        },
      },
      {
        extends: true,
        test: { name: 'browser', include: ['tests/browser/**/*.test.ts'], globalSetup: ['tests/helpers/global-setup.ts'] },
      },
    ],
  },
});
