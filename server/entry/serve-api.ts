/**
 * One instance of the API on a database that runs elsewhere (DATABASE_URL): migrate (once,
 * under an advisory lock, however many instances start together), seed the demo desk outside
 * production, listen on HOST and SALTATION_API_PORT (else PORT + 1), drain on SIGTERM. Used by
 * `npm run dev` (restarted by tsx on change) and for several instances behind a balancer.
 */
import { createApp } from '../app';
import { ConfigError, loadConfig, readPort } from '../config';
import { createDb, migrate, seed } from '../db';
import { createLogger } from '../logging';
import { setUpMail } from '../mail/setup';
import { drain, listen } from '../serve';
import { ChangeEvents } from '../sync/events';

async function main() {
  const config = loadConfig();
  const url = config.databaseUrl;
  if (!url) throw new ConfigError('DATABASE_URL is not set (npm run dev sets it).');
  const logger = createLogger();
  const db = createDb(url);
  await migrate(db);
  if (!config.production) await seed(db);
  const port = readPort(process.env.SALTATION_API_PORT, config.port + 1);
  const mail = await setUpMail(config);
  const events = await ChangeEvents.start(url, db, logger);
  // in development, links point at the Vite dev server, which proxies /api here
  const app = createApp({
    db,
    jwtSecret: config.jwtSecret,
    mailer: mail.mailer,
    appUrl: config.appUrl,
    mailboxDir: mail.mailboxDir,
    production: config.production,
    trustProxy: config.trustProxy,
    logger,
    events,
  });
  const server = await listen(app, config.host, port);
  logger.info({ host: config.host, port }, 'API listening');
  let stopping = false;
  const stop = () => {
    if (stopping) return;
    stopping = true;
    logger.info('draining');
    void drain(server, db, events, mail.close).then(() => process.exit(0));
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
