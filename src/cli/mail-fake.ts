/**
 * The local fake SMTP server (package smtp-server) used in development and tests in place of a
 * real mail service. Listens on 127.0.0.1 only, needs no login, refuses messages over the size
 * limit, and stores every message as MAIL_DIR/<id>.eml plus a line in MAIL_DIR/index.json.
 *
 * `npm start` (when SMTP_URL is empty) and `npm test` start it themselves; for `npm run dev` run
 * `npx tsx src/cli/mail-fake.ts` beside it.
 */
import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync } from 'node:fs';
import { rename, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { loadDotEnv, mailConfig } from '@/server/config';
import { INDEX_FILE, type MailSummary } from '@/server/mail-outbox';
import { isMain } from './is-main';

export interface MailFakeOptions {
  port: number;
  dir: string;
  /** Largest message accepted, bytes (default 5 MB). */
  maxBytes?: number;
  log?: (line: string) => void;
}

export interface MailFake {
  port: number;
  dir: string;
  close(): Promise<void>;
}

function newId(): string {
  // Sortable by arrival: milliseconds first, then randomness against collisions.
  return `${Date.now()}-${randomBytes(4).toString('hex')}`;
}

/** Starts the fake on 127.0.0.1:`port`; resolves once it listens, rejects if the port is taken. */
export async function startMailFake(opts: MailFakeOptions): Promise<MailFake> {
  const { port, dir, maxBytes = 5 * 1024 * 1024, log = () => {} } = opts;
  mkdirSync(dir, { recursive: true });
  let index: MailSummary[] = [];
  try {
    index = JSON.parse(readFileSync(join(dir, INDEX_FILE), 'utf8')) as MailSummary[];
  } catch {
    index = [];
  }
  // One writer, one queue: index updates never interleave.
  let writing: Promise<void> = Promise.resolve();
  const store = (summary: MailSummary, source: Buffer) => {
    writing = writing.then(async () => {
      await writeFile(join(dir, `${summary.id}.eml`), source);
      index.push(summary);
      const tmp = join(dir, `${INDEX_FILE}.${process.pid}.tmp`);
      await writeFile(tmp, JSON.stringify(index, null, 1));
      await rename(tmp, join(dir, INDEX_FILE));
    });
    return writing;
  };

  const server = new SMTPServer({
    name: 'selfsown-mail-fake',
    banner: 'Selfsown local fake SMTP: mail is stored, never delivered',
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxBytes,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          const err = Object.assign(new Error(`Message larger than ${maxBytes} bytes refused`), { responseCode: 552 });
          callback(err);
          return;
        }
        const source = Buffer.concat(chunks);
        void simpleParser(source)
          .then((parsed) => {
            const summary: MailSummary = {
              id: newId(),
              to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              subject: parsed.subject ?? '',
              date: new Date().toISOString(),
              size: source.length,
            };
            return store(summary, source).then(() => {
              log(`• mail to ${summary.to.join(', ')}: ${summary.subject}`);
              callback();
            });
          })
          .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
      });
    },
  });

  await new Promise<void>((resolve, reject) => {
    const onError = (e: NodeJS.ErrnoException) => {
      reject(
        e.code === 'EADDRINUSE'
          ? new Error(`the fake SMTP port 127.0.0.1:${port} is in use (another Selfsown running?); set FAKE_SMTP_PORT to a free port`)
          : e,
      );
    };
    server.once('error', onError);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', onError);
      server.on('error', (e) => console.error(`mail fake: ${e.message}`));
      resolve();
    });
  });

  return {
    port,
    dir,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
      }).then(() => writing),
  };
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  const cfg = mailConfig();
  startMailFake({ port: cfg.fakePort, dir: cfg.mailDir, log: (l) => console.log(l) }).then(
    (fake) => {
      console.log(`• fake SMTP on 127.0.0.1:${fake.port}, mail stored in ${fake.dir}`);
      const stop = () => void fake.close().then(() => process.exit(0));
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    },
    (e: unknown) => {
      console.error(`mail-fake: ${e instanceof Error ? e.message : String(e)}`);
      process.exit(1);
    },
  );
}
