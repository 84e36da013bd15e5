import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));
/** tsconfig.json's "@/*" → "src/*", which Vitest does not read by itself. */
const resolve = { alias: [{ find: /^@\//, replacement: `${root}src/` }] };

// Four projects: pure domain code (no database); the data layer + HTTP API against the real
// MariaDB and the built server that `npm test` (src/cli/test.ts) starts before running these; the
// faults and load tests, which npm test runs file by file in their own stages; and the cluster
// tests that only `npm run test:cluster` runs (two servers on a Galera cluster).
export default defineConfig({
  root,
  test: {
    projects: [
      {
        resolve,
        test: {
          name: 'unit',
          root,
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        resolve,
        test: {
          name: 'integration',
          root,
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          // One database shared by the files: run them one after another.
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 60_000,
          hookTimeout: 180_000,
        },
      },
      {
        resolve,
        test: {
          // Only `npm run test:cluster` (src/cli/test-cluster.ts) runs these: they need its Galera cluster.
          name: 'cluster',
          root,
          include: ['tests/cluster/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 240_000,
          hookTimeout: 120_000,
        },
      },
      {
        // npm test's faults and load stages: each brings up what it breaks or loads (src/cli/test.ts).
        resolve,
        test: {
          name: 'faults',
          root,
          include: ['tests/faults/**/*.test.ts', 'tests/load/**/*.test.ts'],
          environment: 'node',
          pool: 'forks',
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 180_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
