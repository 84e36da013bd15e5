/**
 * npm run letters -- --month YYYY-MM        send that month's letters to every household, whatever the date
 * npm run letters -- --due [--now ISO]      send what is due now (or at --now), as the hourly job does
 *   --household ID[,ID…]                    only these households (repeatable)
 *
 * Prints one line per letter sent ("sent 2026-11 to a@b.c for Household name") or failed, then the
 * counts; lists letters left 'sending' by a run that stopped midway as uncertain (they may have
 * gone out: an operator decides). Exits 1 when any send failed. Needs the database running
 * (`npm start` or `npm run db:up`); mail goes where SMTP_URL says (the local fake when empty).
 */
import { parseArgs } from 'node:util';
import { z } from 'zod';
import { closeDb } from '@/db/client';
import { isMonth } from '@/lib/months';
import { loadDotEnv } from '@/server/config';
import { sendDueLetters, sendLettersFor, type LetterRunResult } from '@/server/letters';
import { isMain } from './is-main';

const USAGE = 'usage: npm run letters -- --month YYYY-MM | --due [--now 2027-01-01T02:00:00Z]  [--household ID[,ID…]]';

const argsSchema = z
  .object({
    month: z.string().refine(isMonth, 'month must be YYYY-MM, e.g. 2026-11').optional(),
    due: z.boolean().optional(),
    now: z
      .string()
      .refine((s) => !Number.isNaN(Date.parse(s)), 'now must be an ISO date and time, e.g. 2027-01-01T02:00:00Z')
      .transform((s) => new Date(s))
      .optional(),
    household: z
      .array(z.string())
      .optional()
      .transform((list) => list?.flatMap((s) => s.split(',')).filter(Boolean))
      .pipe(z.array(z.string().regex(/^[1-9][0-9]*$/, 'household must be a household id').transform(Number)).optional()),
  })
  .refine((a) => Boolean(a.month) !== Boolean(a.due), 'give either --month YYYY-MM or --due')
  .refine((a) => !a.now || a.due, '--now goes with --due');

export type LetterArgs = z.infer<typeof argsSchema>;

/** The command line as options, or an Error whose message says what is wrong. */
export function parseLetterArgs(argv: string[]): LetterArgs {
  const { values } = parseArgs({
    args: argv,
    options: { month: { type: 'string' }, due: { type: 'boolean' }, now: { type: 'string' }, household: { type: 'string', multiple: true } },
    strict: true,
  });
  const r = argsSchema.safeParse(values);
  if (!r.success) throw new Error(`${r.error.issues.map((i) => i.message).join('; ')}\n${USAGE}`);
  return r.data;
}

/** The run's summary lines (the per-letter lines were printed as they happened). */
export function summaryLines(r: LetterRunResult): string[] {
  const lines = [`${r.sent.length} sent, ${r.skipped} skipped, ${r.failed.length} failed, ${r.uncertain.length} uncertain`];
  if (r.quietHouseholds > 0) lines.push(`${r.quietHouseholds} household(s) with nothing eaten in the month: no letter`);
  for (const f of r.failed) lines.push(`failed ${f.month} to ${f.email} for ${f.householdName}: ${f.error}`);
  for (const u of r.uncertain) {
    lines.push(`uncertain ${u.month} to ${u.email} for ${u.householdName} (household ${u.householdId}): a run stopped while sending it; it may have gone out`);
  }
  return lines;
}

async function main(): Promise<number> {
  loadDotEnv();
  const args = parseLetterArgs(process.argv.slice(2));
  const log = (line: string) => console.log(line);
  const opts = { householdIds: args.household, log };
  const result = args.due ? await sendDueLetters(args.now ?? new Date(), opts) : await sendLettersFor(args.month!, opts);
  // Failed sends were printed as they happened; the summary repeats them for a reader of the tail.
  for (const line of summaryLines(result)) console.log(line);
  return result.failed.length > 0 ? 1 : 0;
}

if (isMain(import.meta.url)) {
  main().then(
    async (code) => {
      await closeDb();
      process.exit(code);
    },
    async (e: unknown) => {
      console.error(`letters: ${e instanceof Error ? e.message : String(e)}`);
      await closeDb().catch(() => {});
      process.exit(2);
    },
  );
}
