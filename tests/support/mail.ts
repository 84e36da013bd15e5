/**
 * Reading the mail the built server sent, from the test run's fake SMTP outbox (MAIL_DIR, set by
 * `npm test`). Example:
 *
 *   const msg = await waitForMail('robin@test.selfsown.invalid', { subject: /Confirm/ });
 *   const link = linkTo(msg, '/api/auth/verify-email');
 */
import { listMail, readMessage, type MailMessage } from '@/server/mail-outbox';

export type { MailMessage };

/**
 * The newest message to `to` (optionally: whose subject matches, received after the message id
 * `after`), waiting up to `timeoutMs` for it to arrive.
 */
export async function waitForMail(to: string, opts: { subject?: RegExp; after?: string; timeoutMs?: number } = {}): Promise<MailMessage> {
  const { subject, after, timeoutMs = 10_000 } = opts;
  const address = to.toLowerCase();
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = (await listMail()).find((m) => m.to.includes(address) && (!subject || subject.test(m.subject)) && (!after || m.id > after));
    if (hit) {
      const msg = await readMessage(hit.id);
      if (msg) return msg;
    }
    if (Date.now() > until) throw new Error(`no mail to ${to}${subject ? ` matching ${subject}` : ''} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The id of the newest message in the outbox ('' when empty): pass as `after` to wait for a newer one. */
export async function lastMailId(): Promise<string> {
  return (await listMail())[0]?.id ?? '';
}

/** The first link in a message whose path starts with `pathPrefix`; throws when there is none. */
export function linkTo(msg: MailMessage, pathPrefix: string): string {
  const link = msg.links.find((l) => new URL(l).pathname.startsWith(pathPrefix));
  if (!link) throw new Error(`no link to ${pathPrefix} in "${msg.subject}": ${msg.links.join(', ') || 'no links'}`);
  return link;
}
