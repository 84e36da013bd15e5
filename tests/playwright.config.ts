import { defineConfig, devices } from '@playwright/test';

// Served by `npm test` (src/cli/test.ts) from the built app; Chromium is Debian's.
export default defineConfig({
  testDir: './e2e',
  fullyParallel: false,
  workers: 1,
  // One retry in CI only; a test that needed it is reported as flaky in the summary, not hidden.
  retries: process.env.CI ? 1 : 0,
  // PW_REPEAT_EACH=N runs each test N times (hunting a flaky one; see DEVELOPERS.md).
  repeatEach: Number(process.env.PW_REPEAT_EACH ?? 1),
  timeout: 60_000,
  reporter: [['list'], ['json']],
  outputDir: `../.data/test-reports-${process.env.TEST_PORT ?? '4399'}/e2e-artifacts`,
  use: {
    baseURL: process.env.TEST_BASE_URL ?? `http://127.0.0.1:${process.env.TEST_PORT ?? '4399'}`,
    trace: 'retain-on-failure',
    // The built app registers a service worker. Most specs test the page and its server, and route
    // requests with page.route (which a worker would bypass), so workers are off; the offline spec
    // (tests/e2e/offline.spec.ts) turns them on.
    serviceWorkers: 'block',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless',
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
  projects: [
    { name: 'desktop', use: { ...devices['Desktop Chrome'], channel: undefined } },
  ],
});
