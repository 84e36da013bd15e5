/** Child processes for the start and test commands: started in their own group, stopped by pid. */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { childEnv } from '@/server/config';

export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = childEnv()): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', env });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(127));
  });
}

export function startService(cmd: string, args: string[], env: NodeJS.ProcessEnv, quiet = false): ChildProcess {
  const child = spawn(cmd, args, { env, detached: true, stdio: quiet ? ['ignore', 'ignore', 'inherit'] : 'inherit' });
  return child;
}

/** Stops a service and everything it started (its process group), waiting for it to exit. */
export async function stopService(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null || !child.pid) return;
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  try {
    process.kill(-child.pid, 'SIGTERM');
  } catch {
    child.kill('SIGTERM');
  }
  const timer = setTimeout(() => {
    try {
      process.kill(-child.pid!, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }, 5000);
  await exited;
  clearTimeout(timer);
}

/** Polls a URL until it answers (any status), or throws after `timeoutMs`. */
export async function waitForHttp(url: string, timeoutMs = 30_000, child?: ChildProcess): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child && child.exitCode !== null) throw new Error(`the server exited (code ${child.exitCode}) before answering ${url}`);
    try {
      await fetch(url, { redirect: 'manual' });
      return;
    } catch {
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}

/** A loopback port nothing listens on now (the OS picks it). */
export function freeLoopbackPort(): Promise<number> {
  return new Promise((ok, fail) => {
    const s = createServer();
    s.once('error', fail);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => ok(port));
    });
  });
}
