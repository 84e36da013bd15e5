import { defineConfig } from '@playwright/test';
import base from '../playwright.config';

// The faults stage's browser test (src/cli/test.ts): the same browser settings as tests/e2e, but
// it starts, stops and kills its own app server (TEST_BASE_URL) against the stage's private MariaDB.
export default defineConfig({
  ...base,
  testDir: '.',
  testMatch: '*.spec.ts',
  timeout: 120_000,
  outputDir: `../../.data/test-reports-${process.env.TEST_PORT ?? '4399'}/faults-artifacts`,
});
