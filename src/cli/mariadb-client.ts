/**
 * How the MariaDB command-line tools (mariadb-dump, mariadb) reach the app's database: the private
 * server (DATABASE_URL on 127.0.0.1 or localhost) as root over its socket, from src/cli/mariadb.ts;
 * any other server over TCP as the URL's user, the password passed in MYSQL_PWD (never on the
 * command line, where `ps` would show it).
 */
import { childEnv, type DbUrlParts } from '@/server/config';
import { dbUp } from './db';
import { serverPaths } from './mariadb';
import { ensureProgram } from './system';

export interface ClientCall {
  /** Connection arguments, to put after the program's own. */
  args: string[];
  env: NodeJS.ProcessEnv;
}

export function isPrivateServer(db: DbUrlParts): boolean {
  return db.host === '127.0.0.1' || db.host === 'localhost';
}

/** Starts the private server when it is the target (and creates the database and user), then the connection arguments. */
export async function clientCall(url: string, db: DbUrlParts): Promise<ClientCall> {
  // Debian's mariadb-client comes with mariadb-server, which the start and test commands install.
  ensureProgram('mariadb', 'mariadb-client');
  if (isPrivateServer(db)) {
    await dbUp(url);
    return { args: ['--no-defaults', `--socket=${serverPaths().socket}`, '--user=root', '--default-character-set=utf8mb4'], env: childEnv() };
  }
  return {
    args: ['--no-defaults', `--host=${db.host}`, `--port=${db.port}`, `--user=${db.user}`, '--default-character-set=utf8mb4'],
    env: childEnv({ MYSQL_PWD: db.password }),
  };
}
