/**
 * The monthly letter's job inside the app server: croner runs sendDueLetters() at minute 7 of
 * every hour (hourly, because each household's month begins at its own local midnight), never two
 * runs at once in one process (`protect`). Several app servers may each run it: the claim in
 * letters.ts keeps every letter to one sending. LETTERS_SCHEDULER=off leaves it out.
 */
import { Cron } from 'croner';
import { lettersNow, lettersSchedule, lettersSchedulerOn } from './config';
import { sendDueLetters } from './letters';

/** Minute 7 of every hour (UTC): clear of the top of the hour, when other jobs tend to run. LETTERS_SCHEDULE may say otherwise. */
export const LETTER_SCHEDULE = '7 * * * *';

let job: Cron | null = null;

/** Starts the hourly job once per process (no-op when it runs already or LETTERS_SCHEDULER=off). */
export function startLetterScheduler(log: (line: string) => void = (l) => console.log(l)): Cron | null {
  if (job || !lettersSchedulerOn()) return job;
  job = new Cron(
    lettersSchedule(),
    {
      name: 'monthly-letters',
      timezone: 'UTC',
      protect: () => log('letters: the previous run is still going; this hour is skipped'),
      // The timer alone never keeps a process alive (the server's socket does).
      unref: true,
      catch: (e) => log(`letters: the run failed: ${e instanceof Error ? e.message : String(e)}`),
    },
    async () => {
      const r = await sendDueLetters(lettersNow(), { log: (l) => log(`letters: ${l}`) });
      // Letters another server claimed first count as skipped: with several servers, each says what it did.
      if (r.sent.length || r.failed.length || r.uncertain.length || r.skipped) {
        log(`letters: ${r.sent.length} sent, ${r.failed.length} failed, ${r.uncertain.length} uncertain, ${r.skipped} skipped`);
      }
    },
  );
  log('letters: scheduler on');
  return job;
}

/** Stops the job (tests, shutdown). */
export function stopLetterScheduler(): void {
  job?.stop();
  job = null;
}
