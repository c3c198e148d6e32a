import { defineConfig, devices } from '@playwright/test';

// Another checkout running its tests at the same time picks its own port with BW_E2E_PORT.
const PORT = Number(process.env.BW_E2E_PORT ?? 4331);

// Debian's Chromium, never a downloaded browser; as root it needs --no-sandbox.
export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: 'test-results/e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  reporter: [['list'], ['json', { outputFile: 'test-results/playwright.json' }]],
  use: {
    baseURL: `http://localhost:${PORT}`,
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
  },
  projects: [
    {
      name: 'chromium',
      use: {
        ...devices['Desktop Chrome'],
        launchOptions: {
          executablePath: '/usr/bin/chromium',
          args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic', '--no-first-run'],
        },
      },
    },
  ],
  webServer: {
    command: 'node dist/server/entry.mjs',
    url: `http://localhost:${PORT}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    // The database, SMTP and S3 settings come from run-tests.mjs's environment.
    env: { ...(process.env as Record<string, string>), HOST: '127.0.0.1', PORT: String(PORT) },
  },
});
