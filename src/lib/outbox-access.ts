/**
 * Who may read the development outbox (/dev/mail). It shows sign-up, password-reset and invitation
 * links, so it is open only on a machine nobody else reaches: the fake SMTP server is in use, the app
 * listens on loopback only, no proxy forwards to it, and the request itself comes from loopback.
 */

/** True for a loopback address or name, e.g. isLoopback('127.0.0.1') → true, isLoopback('0.0.0.0') → false. */
export function isLoopback(address: string | undefined | null): boolean {
  if (!address) return false;
  const a = address.trim().toLowerCase().replace(/^\[|\]$/g, '');
  return a === 'localhost' || a === '::1' || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(a) || /^::ffff:127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(a);
}

export interface OutboxContext {
  /** The fake SMTP server is in use (SMTP_URL empty). */
  fake: boolean;
  /** The address the app listens on (HOST). */
  bindHost: string;
  /** The connecting address of this request. */
  clientAddress: string | undefined;
  /** A reverse proxy forwards to the app (TRUST_PROXY=1): its requests all look local. */
  trustProxy: boolean;
}

/** Whether this request may see the outbox, e.g. outboxAllowed({ fake: true, bindHost: '127.0.0.1', clientAddress: '127.0.0.1', trustProxy: false }) → true. */
export function outboxAllowed(c: OutboxContext): boolean {
  return c.fake && !c.trustProxy && isLoopback(c.bindHost) && isLoopback(c.clientAddress);
}
