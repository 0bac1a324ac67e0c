/** The API alone (used by `npm run dev`, restarted by tsx on change): migrate, seed, listen. */
import { createApp } from '../app';
import { loadConfig, readPort } from '../config';
import { createDb, migrate, seed } from '../db';
import { setUpMail } from '../mail/setup';

const config = loadConfig();
const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set (npm run dev sets it).');
  process.exit(1);
}
const db = createDb(url);
await migrate(db);
await seed(db);
const port = readPort(process.env.SALTATION_API_PORT, config.port + 1);
const mail = await setUpMail(config);
// links point at the Vite dev server, which proxies /api here
createApp({
  db,
  jwtSecret: config.jwtSecret,
  mailer: mail.mailer,
  appUrl: config.appUrl,
  mailboxDir: mail.mailboxDir,
}).listen(port, '127.0.0.1', () => console.log(`API on http://127.0.0.1:${port}/api`));
