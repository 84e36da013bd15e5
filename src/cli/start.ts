/**
 * npm start: brings up the private MariaDB, migrates, loads the reference foods when not yet
 * loaded, builds and serves the app on http://127.0.0.1:4321 (HOST and PORT override).
 * Seeds the demo account and household on first start and, when SMTP_URL is empty, runs the local
 * fake SMTP server (mail readable at /dev/mail). Ctrl-C stops the app, the fake and the database
 * server if this command started it.
 */
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { bindHost, bindPort, childEnv, databaseUrl, hasAuthSecret, loadDotEnv, mailConfig, outDir, publicOrigin, serverNodeFlags } from '@/server/config';
import { serverPaths, stopServer } from './mariadb';
import { importFoods } from './import-foods';
import { startMailFake, type MailFake } from './mail-fake';
import { demoAccountLines, seedDemo } from './seed-demo';
import { run, startService, stopService, waitForHttp } from './processes';

async function main(): Promise<void> {
  loadDotEnv();
  const root = process.cwd();
  const url = databaseUrl();
  // Stop at the end only a database server this command started (another may be using it).
  const dbWasRunning = existsSync(serverPaths().pidFile);
  await importFoods(url); // also starts MariaDB and migrates
  await seedDemo(url);
  // No SMTP_URL: mail goes to the local fake, readable at /dev/mail.
  const mail = mailConfig();
  let mailFake: MailFake | null = null;
  if (mail.fake) {
    mailFake = await startMailFake({ port: mail.fakePort, dir: mail.mailDir, log: (l) => console.log(l) });
    console.log(`• fake SMTP on 127.0.0.1:${mail.fakePort}; mail is kept in ${mail.mailDir} and shown at /dev/mail`);
  }
  const env = childEnv({
    HOST: bindHost(),
    PORT: bindPort(),
    NODE_ENV: 'production',
    // A single-household install on loopback may run with the development secret.
    SELFSOWN_ALLOW_DEV_SECRET: hasAuthSecret() ? '0' : '1',
    ...(mail.fake ? { SMTP_URL: '', FAKE_SMTP_PORT: String(mail.fakePort), MAIL_DIR: mail.mailDir } : {}),
  });
  console.log('• building the app');
  const built = await run(resolve(root, 'node_modules/.bin/astro'), ['build'], env);
  if (built !== 0) throw new Error('the build failed');

  const services = [startService('node', [...serverNodeFlags(), resolve(outDir(root), 'server/entry.mjs')], env)];
  const app = services[0]!;
  let stopping = false;
  const stopAll = async () => {
    if (stopping) return;
    stopping = true;
    for (const s of services.reverse()) await stopService(s);
    if (mailFake) await mailFake.close();
    if (!dbWasRunning) await stopServer(serverPaths());
    process.exit(0);
  };
  process.on('SIGINT', stopAll);
  process.on('SIGTERM', stopAll);
  await waitForHttp(`http://${env.HOST}:${env.PORT}/`, 30_000, app);
  console.log(`\n  Selfsown is running at ${publicOrigin()}  (Ctrl-C to stop)`);
  console.log(`  Demo household: sign in at ${publicOrigin()}/sign-in as one of (npm run demo:reset rebuilds it)`);
  for (const line of demoAccountLines()) console.log(`    ${line}`);
  if (mail.fake) console.log(`  Local mail: ${publicOrigin()}/dev/mail`);
  console.log('');
  app.on('exit', (code) => {
    if (!stopping) {
      console.error(`the app server exited (code ${code})`);
      void stopAll();
    }
  });
}

main().catch((e: unknown) => {
  console.error(`start: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
});
