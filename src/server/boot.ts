/**
 * Runs once when the built app server starts (`node dist/server/entry.mjs`, and so `npm start`):
 * astro.config.mjs adds an import of this module to the server entry, because the middleware and
 * the pages are only loaded on the first request. Starts the monthly letter's scheduler.
 */
import { startLetterScheduler } from './letter-scheduler';

startLetterScheduler();
