import { defineConfig } from '@playwright/test';

// Debian's Chromium (apt-get install chromium). Playwright's own browser download is never used.
const executablePath = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';

export default defineConfig({
  testDir: './test/e2e',
  testMatch: '**/*.spec.ts',
  // Playwright's TS loader reads "paths" from here; the root tsconfig.json is a solution file.
  tsconfig: './tsconfig.e2e.json',
  outputDir: './test-results',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [['list'], ['json', { outputFile: 'test-results/e2e-report.json' }]],
  use: {
    browserName: 'chromium',
    headless: true,
    viewport: { width: 1400, height: 950 },
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
});
