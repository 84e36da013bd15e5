/** Finding and installing the Debian packages the start and test commands need. */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { childEnv, searchPath } from '@/server/config';

const SEARCH = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin', '/sbin', '/bin'];

/** Absolute path of a program, or null when it is not installed. */
export function findProgram(name: string): string | null {
  for (const dir of [...searchPath(), ...SEARCH]) {
    if (dir && existsSync(`${dir}/${name}`)) return `${dir}/${name}`;
  }
  return null;
}

let aptUpdated = false;

/**
 * Makes sure `program` exists, installing the Debian package `pkg` when running as root.
 * Stops with a sentence naming the package otherwise.
 */
export function ensureProgram(program: string, pkg: string): string {
  const found = findProgram(program);
  if (found) return found;
  aptInstall(pkg, program);
  const after = findProgram(program);
  if (!after) throw new Error(`installed ${pkg} but ${program} is still not on the PATH`);
  return after;
}

/** Makes sure the file `path` exists (a library without a program, e.g. Galera's), installing `pkg` like ensureProgram. */
export function ensurePackageFile(path: string, pkg: string): string {
  if (existsSync(path)) return path;
  aptInstall(pkg, path);
  if (!existsSync(path)) throw new Error(`installed ${pkg} but ${path} is still missing`);
  return path;
}

function aptInstall(pkg: string, what: string): void {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot || !findProgram('apt-get')) {
    throw new Error(`${what} is not installed. Install the Debian package "${pkg}" (sudo apt-get install ${pkg}) and run again.`);
  }
  console.log(`• ${what} not found: installing Debian package ${pkg} (one time, takes a little while)…`);
  const env = childEnv({ DEBIAN_FRONTEND: 'noninteractive' });
  if (!aptUpdated) {
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    aptUpdated = true;
  }
  const r = spawnSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', pkg], { stdio: 'inherit', env });
  if (r.status !== 0) throw new Error(`apt-get install ${pkg} failed (exit ${r.status})`);
}
