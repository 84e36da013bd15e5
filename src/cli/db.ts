/**
 * npm run db:up | db:stop | db:migrate | db:status
 * Manages the private MariaDB server and the app's database (see src/cli/mariadb.ts).
 */
import { databaseUrl, loadDotEnv, parseDatabaseUrl, testDatabaseUrl } from '@/server/config';
import { migrateDatabase } from '@/db/migrate';
import { isMain } from './is-main';
import { ensureDatabase, ensureInstalled, serverPaths, startServer, stopServer } from './mariadb';

/** Installs if needed, starts the server and makes sure `url`'s database and user exist. */
export async function dbUp(url: string): Promise<void> {
  const paths = serverPaths();
  const db = parseDatabaseUrl(url);
  if (db.host !== '127.0.0.1' && db.host !== 'localhost') {
    // A remote database (hosted setup): nothing to start here.
    return;
  }
  ensureInstalled(paths);
  await startServer(paths, db.port);
  await ensureDatabase(paths, db);
}

async function main(): Promise<void> {
  loadDotEnv();
  const cmd = process.argv[2] ?? 'up';
  const url = process.argv.includes('--test') ? testDatabaseUrl() : databaseUrl();
  switch (cmd) {
    case 'up':
      await dbUp(url);
      await migrateDatabase(url);
      console.log(`• MariaDB is up: ${parseDatabaseUrl(url).database} on 127.0.0.1:${parseDatabaseUrl(url).port}, migrated`);
      break;
    case 'migrate':
      await dbUp(url);
      await migrateDatabase(url);
      console.log('• migrations applied');
      break;
    case 'stop':
      console.log((await stopServer(serverPaths())) ? '• MariaDB stopped' : '• MariaDB was not running');
      break;
    default:
      throw new Error(`unknown command "${cmd}"; use up, migrate or stop`);
  }
}

if (isMain(import.meta.url)) {
  main().catch((e: unknown) => {
    console.error(`db: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
