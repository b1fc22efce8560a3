import { defineConfig } from 'vitest/config';

// Test files run in this many worker processes at once; each worker has a PostgreSQL database of
// its own (tests/helpers/global-setup.ts), and the files of one worker run one after another.
const workers = Math.max(1, Number(process.env.QUILTLINE_TEST_WORKERS ?? 2));

export default defineConfig({
  test: {
    include: ['tests/**/*.test.{ts,tsx}'],
    environment: 'node',
    // Starts the project PostgreSQL cluster and creates fresh, migrated databases for the run.
    globalSetup: ['tests/helpers/global-setup.ts'],
    fileParallelism: workers > 1,
    maxWorkers: workers,
    testTimeout: 30_000,
    hookTimeout: 120_000,
  },
});
