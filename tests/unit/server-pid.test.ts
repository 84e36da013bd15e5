import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { cmdlineServesDataDir, serverPid } from '@/cli/server-pid';

const dirs: string[] = [];
const children: ChildProcess[] = [];

afterEach(() => {
  for (const c of children.splice(0)) c.kill('SIGKILL');
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

function pidFileWith(text: string): { pidFile: string; dataDir: string } {
  const dir = mkdtempSync(join(tmpdir(), 'selfsown-pid-'));
  dirs.push(dir);
  const pidFile = join(dir, 'mariadb.pid');
  writeFileSync(pidFile, text);
  return { pidFile, dataDir: join(dir, 'mariadb') };
}

describe('a command line', () => {
  it('serves a data directory only when it names that exact directory', () => {
    const cmd = ['/usr/sbin/mariadbd', '--no-defaults', '--datadir=/srv/a/.data/mariadb', '--port=3307'].join('\0') + '\0';
    expect(cmdlineServesDataDir(cmd, '/srv/a/.data/mariadb')).toBe(true);
    expect(cmdlineServesDataDir(cmd, '/srv/a/.data/maria')).toBe(false);
    expect(cmdlineServesDataDir(cmd, '/srv/b/.data/mariadb')).toBe(false);
    expect(cmdlineServesDataDir('node\0src/cli/db.ts\0up\0', '/srv/a/.data/mariadb')).toBe(false);
  });
});

describe('the pid in a pid file', () => {
  it('is null when there is no file, or the file holds no pid', () => {
    const { pidFile, dataDir } = pidFileWith('not a pid\n');
    expect(serverPid(pidFile, dataDir)).toBeNull();
    expect(serverPid(pidFile + '.missing', dataDir)).toBeNull();
  });

  it('is null when the pid now belongs to another program, as after a reboot', () => {
    // This test's own process is alive and is no MariaDB server.
    const { pidFile, dataDir } = pidFileWith(`${process.pid}\n`);
    expect(serverPid(pidFile, dataDir)).toBeNull();
  });

  it('is the pid while the process was started on that data directory', async () => {
    const { pidFile, dataDir } = pidFileWith('');
    const child = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 30000)', `--datadir=${dataDir}`], { stdio: 'ignore' });
    children.push(child);
    await new Promise((r) => child.once('spawn', r));
    writeFileSync(pidFile, `${child.pid}\n`);
    expect(serverPid(pidFile, dataDir)).toBe(child.pid);
    expect(serverPid(pidFile, dataDir + '-other')).toBeNull();
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    expect(serverPid(pidFile, dataDir)).toBeNull();
  });
});
