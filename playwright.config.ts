import { defineConfig } from '@playwright/test';

// The app is built and started by docker-local/test.sh before Playwright runs; no browser download:
// Debian's chromium (package `chromium`) is driven directly.
export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: '.local/playwright-results',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  reporter: [['list']],
  use: {
    baseURL: process.env.APP_URL ?? 'http://localhost:3100',
    trace: 'off',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
});
