import { defineConfig, devices } from '@playwright/test';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

// Debian's Chromium; Playwright never downloads a browser here.
const chromium = ['/usr/lib/chromium/chromium', '/usr/bin/chromium'].find((p) => fs.existsSync(p));
const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://127.0.0.1:${port}`;
// Uploaded photos go to a throwaway folder, never into the checkout's .data/uploads. Set in the
// environment so the specs (which run in workers) write seeded photos where the server reads them.
const storageDir = (process.env.E2E_STORAGE_DIR ??= path.join(
  os.tmpdir(),
  `headroom-e2e-uploads-${port}`,
));

export default defineConfig({
  testDir: 'e2e',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  outputDir: 'test-results',
  use: {
    baseURL,
    trace: 'retain-on-failure',
    // The service worker (offline app shell) only where a spec allows it: e2e/offline.spec.ts.
    serviceWorkers: 'block',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: chromium,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-dev-shm-usage',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'] } }],
  webServer: {
    // npm test has built the client and migrated the database in DATABASE_URL.
    command: 'node --import tsx server/index.ts',
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: {
      PORT: String(port),
      NODE_ENV: 'test',
      AUTH_RATE_LIMIT: '1000',
      PASSWORD_RESET_RATE_LIMIT: '1000',
      LOG_LEVEL: 'warn',
      DATABASE_URL: process.env.DATABASE_URL ?? '',
      // No SMTP settings: the server runs its mail catcher here; specs read it at /dev/mail.
      MAIL_CATCHER_PORT: process.env.E2E_MAIL_PORT ?? String(port + 1),
      MAIL_DIR: process.env.E2E_MAIL_DIR ?? path.join(os.tmpdir(), `headroom-e2e-mail-${port}`),
      STORAGE_DIR: storageDir,
      // npm test builds the client into its own folder; by hand, the checkout's dist/.
      ...(process.env.E2E_CLIENT_DIR ? { CLIENT_DIR: process.env.E2E_CLIENT_DIR } : {}),
      APP_URL: baseURL,
      MAIL_POLL_MS: '200',
    },
  },
});
