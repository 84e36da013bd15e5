/**
 * The mail outbox as a site administrator sees it: monthly letters by status (sending, sent,
 * failed, and "uncertain" — left sending by a run that stopped), the latest failures, and, when
 * the local fake SMTP server is in use, what it has received (src/server/mail-outbox.ts).
 */
import { and, desc, eq, lt, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, letters, user } from '@/db/schema';
import { mailConfig } from './config';
import { listMail, type MailSummary } from './mail-outbox';
import { UNCERTAIN_AFTER_MS } from './letters';

export interface OutboxStatus {
  transport: 'fake' | 'smtp';
  letters: { sending: number; sent: number; failed: number; uncertain: number };
  failures: { householdName: string; email: string; month: string; attempts: number; error: string | null }[];
  /** The fake server's latest messages (fake transport only). */
  fakeMail: MailSummary[];
  fakeMailCount: number;
}

export async function outboxStatus(now = new Date()): Promise<OutboxStatus> {
  const db = getDb();
  const counts = await db.select({ status: letters.status, n: sql<number>`COUNT(*)` }).from(letters).groupBy(letters.status);
  const staleBefore = new Date(now.getTime() - UNCERTAIN_AFTER_MS);
  const [stale] = await db.select({ n: sql<number>`COUNT(*)` }).from(letters).where(and(eq(letters.status, 'sending'), lt(letters.claimedAt, staleBefore)));
  const failures = await db
    .select({ householdName: households.name, email: user.email, month: letters.month, attempts: letters.attempts, error: letters.error })
    .from(letters)
    .innerJoin(households, eq(households.id, letters.householdId))
    .innerJoin(user, eq(user.id, letters.userId))
    .where(eq(letters.status, 'failed'))
    .orderBy(desc(letters.id))
    .limit(20);
  const by = (s: string) => Number(counts.find((c) => c.status === s)?.n ?? 0);
  const cfg = mailConfig();
  const fake = cfg.fake ? await listMail(cfg.mailDir) : [];
  return {
    transport: cfg.fake ? 'fake' : 'smtp',
    letters: { sending: by('sending') - Number(stale?.n ?? 0), sent: by('sent'), failed: by('failed'), uncertain: Number(stale?.n ?? 0) },
    failures,
    fakeMail: fake.slice(0, 20),
    fakeMailCount: fake.length,
  };
}
