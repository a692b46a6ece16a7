import react from '@vitejs/plugin-react';
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
        // Components and hooks rendered in happy-dom with a real QueryClient; the server is a fetch stub.
        plugins: [react()],
        test: {
          name: 'client',
          include: ['tests/client/**/*.test.tsx'],
          environment: 'happy-dom',
          setupFiles: ['tests/client/support/setup.ts'],
          // Whole pages render and type key by key; on a busy 2-core machine that takes seconds.
          testTimeout: 20_000,
        },
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
