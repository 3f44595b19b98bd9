import { defineConfig } from 'vitest/config';

// Three projects: pure unit tests, HTTP integration tests against a real PostgreSQL,
// and browser journeys in headless Chromium against the built app.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}'],
          environment: 'node',
          // A first PDF render (fonts parsed) or a lint run with type information takes seconds on a busy 2-core machine.
          testTimeout: 20000,
        },
      },
      {
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts'],
          setupFiles: ['tests/support/integration-setup.ts'],
          fileParallelism: false,
          testTimeout: 30000,
          hookTimeout: 60000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/e2e-setup.ts'],
          fileParallelism: false,
          testTimeout: 90000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
