/**
 * The built app as the benchmark runs it: `node <out dir>/server/entry.mjs` on a free loopback
 * port with its own environment (its bench database, no letter job, no mail sent), as
 * src/cli/test.ts starts the server under test; then one signed-in cookie for the bench account.
 */
import { resolve } from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { freeLoopbackPort, startService, stopService, waitForHttp } from '@/cli/processes';
import { childEnv, outDir, serverNodeFlags } from '@/server/config';

export interface BenchServer {
  base: string;
  child: ChildProcess;
  cookie: string;
  stop(): Promise<void>;
}

/** Starts the built server on `databaseUrl` and signs the bench account in; `nodeArgs` go before the entry (e.g. --cpu-prof). */
export async function startBenchServer(databaseUrl: string, account: { email: string; password: string }, nodeArgs: string[] = []): Promise<BenchServer> {
  const port = await freeLoopbackPort();
  const base = `http://127.0.0.1:${port}`;
  const env = childEnv({
    DATABASE_URL: databaseUrl,
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_ORIGIN: base,
    NODE_ENV: 'production',
    SELFSOWN_ALLOW_DEV_SECRET: '1',
    LETTERS_SCHEDULER: 'off',
    SMTP_URL: '',
    FAKE_SMTP_PORT: String(await freeLoopbackPort()),
    // One sign-in per run; the rest of the limits as the app has them.
    AUTH_SIGNIN_RATE_LIMIT: '100/60',
  });
  const child = startService('node', [...serverNodeFlags(), ...nodeArgs, resolve(outDir(), 'server/entry.mjs')], env, true);
  const stop = () => stopService(child);
  try {
    await waitForHttp(`${base}/`, 60_000, child);
    const r = await fetch(`${base}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base },
      body: JSON.stringify(account),
    });
    await r.arrayBuffer();
    const cookie = (r.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).join('; ');
    if (r.status !== 200 || !cookie.includes('session_token')) throw new Error(`bench sign-in answered ${r.status}`);
    return { base, child, cookie, stop };
  } catch (e) {
    await stop();
    throw e;
  }
}

/** Resident memory of a process in MB, from /proc (Linux). */
export async function rssMb(pid: number): Promise<number> {
  const { readFileSync } = await import('node:fs');
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'));
  if (!line) throw new Error(`no VmRSS for process ${pid}`);
  return Number(line.replace(/\D+/g, '')) / 1024;
}
