import { defineConfig } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 5190);
const databaseUrl = process.env.E2E_DATABASE_URL;
if (!databaseUrl) throw new Error('E2E_DATABASE_URL is not set: run the e2e tests through `npm test`.');

export default defineConfig({
  testDir: 'e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [['list']],
  timeout: 30_000,
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    browserName: 'chromium',
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
  },
  webServer: {
    command: 'node_modules/.bin/tsx server/index.ts',
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: {
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      // Production settings, as a real installation checks them (a secret of 32+ characters, the public address).
      SESSION_SECRET: 'e2e-only-secret-not-for-any-real-installation',
      NODE_ENV: 'production',
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      SMTP_URL: process.env.SMTP_URL ?? '',
    },
  },
});
