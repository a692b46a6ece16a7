import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    // Integration files share one database; they run one after another (unit files are quick).
    fileParallelism: false,
    projects: [
      {
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          // The app's request and error lines would bury the test output; tests that look at them spy.
          env: { LOG_LEVEL: 'silent' },
          // one real database shared by every file: run files one after another
          fileParallelism: false,
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
    ],
  },
});
