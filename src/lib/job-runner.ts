/**
 * Who runs a dataset job, and when a running job is stuck. A job row names the server process
 * working on it ("host:pid:boot id") and carries a heartbeat the process touches while it works;
 * the row, not process memory, is the truth, so any app server can tell a job whose process died:
 *
 *  - on the same host, a process that has exited (or a pid now used by a later start of the app,
 *    told apart by the boot id) left it: stuck at once, which is what a restarted server finds;
 *  - anywhere, a heartbeat older than JOB_STALE_MS: the process stopped, hung or lost the database.
 */

/** How often a running job's heartbeat is touched. */
export const JOB_HEARTBEAT_MS = 15_000;
/** A running job unheard of for this long is stuck: 20 missed heartbeats, far beyond a slow statement. */
export const JOB_STALE_MS = 5 * 60_000;

/** One server process: its host name, process id and a random id drawn when it started. */
export interface JobRunner {
  host: string;
  pid: number;
  boot: string;
}

/** The runner as stored. Example: runnerText({ host: 'app1', pid: 42, boot: 'k3x9' }) → 'app1:42:k3x9' */
export function runnerText(r: JobRunner): string {
  return `${r.host}:${r.pid}:${r.boot}`;
}

/** The stored runner read back; null for a missing or malformed one. Host names may hold colons (IPv6). */
export function parseRunner(text: string | null | undefined): JobRunner | null {
  const m = /^(.+):(\d+):([^:]+)$/.exec(text ?? '');
  return m ? { host: m[1]!, pid: Number(m[2]), boot: m[3]! } : null;
}

/** What the sweep needs of a job row. */
export interface RunningJob {
  status: string;
  runner: string | null;
  heartbeatAt: Date | null;
  updatedAt: Date;
}

const RUNNING = new Set(['reading', 'applying']);

function utc(d: Date): string {
  return d.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
}

/**
 * Why a job is stuck, as the phase the page shows, or null while it is not running or still alive.
 * `alive(pid)` answers for a process on this host. Example: a job of 'app1:42:old' seen by
 * { host: 'app1', pid: 42, boot: 'new' } → 'Stopped: the server process running it (app1, pid 42) is gone…'
 */
export function stuckReason(job: RunningJob, now: Date, self: JobRunner, alive: (pid: number) => boolean): string | null {
  if (!RUNNING.has(job.status)) return null;
  const heard = job.heartbeatAt ?? job.updatedAt;
  const runner = parseRunner(job.runner);
  const undo = job.status === 'reading' ? 'nothing was loaded; upload the files again' : 'nothing was changed (the load is one transaction); start it again';
  if (runner && runner.host === self.host && runner.boot !== self.boot && (runner.pid === self.pid || !alive(runner.pid))) {
    return `Stopped: the server process running it (${runner.host}, pid ${runner.pid}) is gone, last heard from ${utc(heard)}; ${undo}.`;
  }
  if (now.getTime() - heard.getTime() > JOB_STALE_MS) {
    return `Stopped: no sign of the server running it for over ${JOB_STALE_MS / 60_000} minutes (last heard from ${utc(heard)}); ${undo}.`;
  }
  return null;
}
