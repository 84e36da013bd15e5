/**
 * The local fake SMTP server's outbox: every message it received, stored as MAIL_DIR/<id>.eml with
 * an index (MAIL_DIR/index.json). Written by src/cli/mail-fake.ts; read by /dev/mail and the tests.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { mailConfig } from './config';

export const INDEX_FILE = 'index.json';

/** One line of the index. */
export interface MailSummary {
  id: string;
  /** Envelope recipients, lower case. */
  to: string[];
  from: string;
  subject: string;
  /** ISO date the fake received it. */
  date: string;
  size: number;
}

export interface MailMessage extends MailSummary {
  text: string;
  html: string | null;
  /** Every http(s) link in the plain-text body, in order. */
  links: string[];
}

const ID_RE = /^\d{13}-[0-9a-f]{8}$/;

/**
 * True for an id the fake hands out (time in ms, dash, 8 hex digits) — nothing that names a path.
 * @example isMailId('1764633600000-0a1b2c3d') // true; isMailId('../index') // false
 */
export function isMailId(id: string): boolean {
  return ID_RE.test(id);
}

/**
 * The http(s) links in a text, trailing punctuation removed.
 * @example findLinks('Open http://x.test/a?b=1. Thanks') // ['http://x.test/a?b=1']
 */
export function findLinks(text: string): string[] {
  return [...text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)].map((m) => m[0].replace(/[.,;:!?]+$/, ''));
}

/** Every stored message, newest first (empty when nothing was sent yet). */
export async function listMail(dir = mailConfig().mailDir): Promise<MailSummary[]> {
  let raw: string;
  try {
    raw = await readFile(join(dir, INDEX_FILE), 'utf8');
  } catch {
    return [];
  }
  const rows = JSON.parse(raw) as MailSummary[];
  return rows.slice().sort((a, b) => (a.id < b.id ? 1 : a.id > b.id ? -1 : 0));
}

/** One stored message, parsed; null for an unknown or malformed id. */
export async function readMessage(id: string, dir = mailConfig().mailDir): Promise<MailMessage | null> {
  if (!isMailId(id)) return null;
  const summary = (await listMail(dir)).find((m) => m.id === id);
  let source: Buffer;
  try {
    source = await readFile(join(dir, `${id}.eml`));
  } catch {
    return null;
  }
  const parsed = await simpleParser(source);
  const text = parsed.text ?? '';
  return {
    id,
    to: summary?.to ?? [],
    from: summary?.from ?? parsed.from?.text ?? '',
    subject: parsed.subject ?? summary?.subject ?? '',
    date: summary?.date ?? (parsed.date ?? new Date()).toISOString(),
    size: summary?.size ?? source.length,
    text,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    links: findLinks(text),
  };
}
