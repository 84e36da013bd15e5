/**
 * Which process a MariaDB pid file names, if it still names ours. After a reboot (or a container
 * restart) the file outlives its server and the system may have handed that number to anything,
 * often to a process of the very command that reads it. Waiting on such a pid hangs `db:up`;
 * signalling it kills a stranger. So a pid counts only while its command line names our data dir.
 */
import { existsSync, readFileSync } from 'node:fs';

/** Whether a /proc cmdline (arguments separated by NUL) is a server started on `dataDir`. */
export function cmdlineServesDataDir(cmdline: string, dataDir: string): boolean {
  return cmdline.split('\0').includes(`--datadir=${dataDir}`);
}

/** Whether a process with this pid runs (any process: see serverPid for ours). */
export function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** The pid in `pidFile` when that process runs and was started on `dataDir`; otherwise null. */
export function serverPid(pidFile: string, dataDir: string): number | null {
  if (!existsSync(pidFile)) return null;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 0 || !pidAlive(pid)) return null;
  // Without /proc (not Linux) the pid file is all there is to go on.
  if (!existsSync('/proc/self/cmdline')) return pid;
  try {
    return cmdlineServesDataDir(readFileSync(`/proc/${pid}/cmdline`, 'utf8'), dataDir) ? pid : null;
  } catch {
    return null; // gone between the two looks
  }
}
