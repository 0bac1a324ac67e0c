/**
 * `npm start`: the whole product on one machine. Starts the project's PostgreSQL (unless
 * DATABASE_URL is set), migrates and seeds it, builds the client, and serves the PWA and `/api`
 * from one process on 127.0.0.1. Ctrl-C stops the server and the database cleanly.
 */
import type { Server } from 'node:http';
import { fileURLToPath } from 'node:url';
import { build } from 'vite';
import { createApp } from '../app';
import { startProjectCluster } from '../bootstrap/cluster-home';
import { portIsFree, SetupError, type EmbeddedPostgres } from '../bootstrap/postgres';
import { loadConfig } from '../config';
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
  let pg: EmbeddedPostgres | undefined;
  let url = config.databaseUrl;
  if (!url) {
    pg = await startProjectCluster(config, (l) => console.log(l));
    url = pg.url;
  }
  const db = createDb(url);
  let server: Server | undefined;
  let mail: MailSetup | undefined;
  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping Saltation…');
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    await db.destroy().catch(() => undefined);
    await mail?.close();
    pg?.stop();
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));
  try {
    const applied = await migrate(db);
    if (applied.length > 0) console.log(`Applied migrations: ${applied.join(', ')}`);
    await seed(db);
    if (process.env.SALTATION_SKIP_BUILD !== '1') {
      console.log('Building the client…');
      await build({ root, logLevel: 'warn' });
    }
    mail = await setUpMail(config);
    const app = createApp({
      db,
      jwtSecret: config.jwtSecret,
      staticDir: `${root}dist`,
      mailer: mail.mailer,
      appUrl: config.appUrl,
      mailboxDir: mail.mailboxDir,
    });
    server = app.listen(config.port, '127.0.0.1');
    await new Promise<void>((resolve, reject) => {
      server!.once('listening', () => resolve());
      server!.once('error', reject);
    });
  } catch (error) {
    console.error(`\n${(error as Error).message}`);
    await stop(1);
    return;
  }
  console.log(`\nSaltation is running at ${config.appUrl}/`);
  console.log(`Demo desk "${DEMO_DESK}" sign-ins:`);
  for (const u of DEMO_USERS)
    console.log(`  ${u.role.padEnd(8)} ${u.email.padEnd(24)} ${u.password}`);
  if (mail?.mailboxDir)
    console.log(`Invite and reset e-mails are kept locally: ${config.appUrl}/dev/mailbox`);
  console.log('Press Ctrl-C to stop.');
}

main().catch((error: unknown) => {
  if (error instanceof SetupError) console.error(`\n${error.message}`);
  else
    console.error('\nSaltation could not start:', error instanceof Error ? error.message : error);
  process.exit(1);
});
