/**
 * Runs once when the built app server starts (`node dist/server/entry.mjs`, and so `npm start`):
 * astro.config.mjs adds an import of this module to the server entry, because the middleware and
 * the pages are only loaded on the first request. Starts the monthly letter's scheduler, and fails
 * the dataset jobs a stopped server left running (dataset-jobs.ts).
 */
import { sweepAtStart } from './dataset-jobs';
import { startLetterScheduler } from './letter-scheduler';

startLetterScheduler();
// Not awaited: the server must start even while the database is still coming up.
sweepAtStart().catch((e: unknown) => console.error('dataset jobs: the check at start failed', e));
