import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.{ts,tsx}'],
    environment: 'node',
    // Starts the project PostgreSQL cluster and creates a fresh, migrated database for the run.
    globalSetup: ['tests/helpers/global-setup.ts'],
    // API tests share one PostgreSQL database per run.
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 120_000,
  },
});
