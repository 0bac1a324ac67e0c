/**
 * `npm start`: the whole product on one machine. Starts the project's PostgreSQL (unless
 * DATABASE_URL is set), migrates it and (outside production) seeds the demo desk, builds the
 * client, and serves the PWA and `/api` from one process on HOST (127.0.0.1; 0.0.0.0 in
 * production). Ctrl-C or SIGTERM drains requests and stops the server and the database cleanly.
 */
import type { Server } from 'node:http';
import { fileURLToPath } from 'node:url';
import { build } from 'vite';
import { createApp } from '../app';
import { startProjectCluster } from '../bootstrap/cluster-home';
import { portIsFree, SetupError, type EmbeddedPostgres } from '../bootstrap/postgres';
import { ConfigError, loadConfig } from '../config';
import { createLogger } from '../logging';
import { drain, listen } from '../serve';
import { ChangeEvents } from '../sync/events';
import { createDb, migrate, seed } from '../db';
import { DEMO_DESK, DEMO_USERS } from '../demo';
import { setUpMail, type MailSetup } from '../mail/setup';

const root = fileURLToPath(new URL('../..', import.meta.url));

async function main() {
  const config = loadConfig();
  if (!(await portIsFree(config.port))) {
    throw new SetupError(
      `Port ${config.port} on 127.0.0.1 is in use. Stop what holds it, or run: PORT=4320 npm start`,
    );
  }
  const logger = createLogger();
  let pg: EmbeddedPostgres | undefined;
  let url = config.databaseUrl;
  if (!url) {
    pg = await startProjectCluster(config, (l) => console.log(l));
    url = pg.url;
  }
  const db = createDb(url);
  let server: Server | undefined;
  let mail: MailSetup | undefined;
  let events: ChangeEvents | undefined;
  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping Saltation…');
    await drain(server, db, events, () => mail?.close());
    pg?.stop();
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));
  try {
    const applied = await migrate(db);
    if (applied.length > 0) console.log(`Applied migrations: ${applied.join(', ')}`);
    if (!config.production) await seed(db);
    if (process.env.SALTATION_SKIP_BUILD !== '1') {
      console.log('Building the client…');
      await build({ root, logLevel: 'warn' });
    }
    mail = await setUpMail(config);
    events = await ChangeEvents.start(url, db, logger);
    const app = createApp({
      db,
      jwtSecret: config.jwtSecret,
      staticDir: `${root}dist`,
      mailer: mail.mailer,
      appUrl: config.appUrl,
      mailboxDir: mail.mailboxDir,
      production: config.production,
      trustProxy: config.trustProxy,
      logger,
      events,
    });
    server = await listen(app, config.host, config.port);
  } catch (error) {
    console.error(`\n${(error as Error).message}`);
    await stop(1);
    return;
  }
  console.log(
    `\nSaltation is running at ${config.appUrl}/ (listening on ${config.host}:${config.port})`,
  );
  if (!config.production) {
    console.log(`Demo desk "${DEMO_DESK}" sign-ins:`);
    for (const u of DEMO_USERS)
      console.log(`  ${u.role.padEnd(8)} ${u.email.padEnd(24)} ${u.password}`);
  }
  if (mail?.mailboxDir)
    console.log(`Invite and reset e-mails are kept locally: ${config.appUrl}/dev/mailbox`);
  console.log('Press Ctrl-C to stop.');
}

main().catch((error: unknown) => {
  if (error instanceof SetupError || error instanceof ConfigError)
    console.error(`\n${error.message}`);
  else
    console.error('\nSaltation could not start:', error instanceof Error ? error.message : error);
  process.exit(1);
});
