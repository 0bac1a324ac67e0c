/** The Express application: `/api` routes and, when built, the PWA from `dist/`. */
import cookieParser from 'cookie-parser';
import cors from 'cors';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Knex } from 'knex';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { errorHandler, HttpError } from './errors';
import { mailboxPage } from './mail/mailbox-page';
import { requireUser } from './auth/session';
import type { Mailer } from './mail/mailer';
import { authRouter, setSessionCookie } from './routes/auth';
import { desksRouter } from './routes/desks';
import { healthRouter } from './routes/health';
import { passwordRouter } from './routes/password';
import { setsRouter } from './routes/sets';
import { syncRouter } from './routes/sync';
import { postgresLimitStores } from './auth/rate-limit-store';
import { createLogger, requestLogger, type Logger } from './logging';
import type { ChangeEvents } from './sync/events';

export interface AppOptions {
  db: Knex;
  jwtSecret: string;
  /** folder of the built client; omitted in API-only and test setups */
  staticDir?: string;
  secureCookies?: boolean;
  /** where log lines go when no logger is given (JSON lines; tests pass a sink) */
  log?: (line: string) => void;
  logger?: Logger;
  /** production: no mailbox page (404 at /dev/mailbox) */
  production?: boolean;
  /** Express's `trust proxy` (false: forwarded headers are ignored) */
  trustProxy?: boolean | number | string;
  /** the live-updates hub; without it /api/sync/events answers 503 and clients poll */
  events?: ChangeEvents;
  /** a prefix for this app's rate-limit counters (tests keep theirs apart; instances share "") */
  rateLimitScope?: string;
  /** invite and reset mail */
  mailer: Mailer;
  /** the public URL invite and reset links are built from */
  appUrl: string;
  /** the fake SMTP server's mailbox, shown at /dev/mailbox when set (development only) */
  mailboxDir?: string;
}

export function createApp(opts: AppOptions): Express {
  const logger = opts.logger ?? createLogger(opts.log);
  const log = (line: string) => logger.info(line);
  const limitStore = postgresLimitStores(opts.db, opts.rateLimitScope);
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', opts.trustProxy ?? false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Plotly sets inline styles on the elements it draws
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          workerSrc: ["'self'", 'blob:'],
          connectSrc: ["'self'"],
          fontSrc: ["'self'", 'data:'],
        },
      },
    }),
  );
  app.use(requestLogger(logger));

  const api = express.Router();
  const appOrigin = new URL(opts.appUrl).origin;
  // CORS only for the app's own origin; a cross-site browser request gets no CORS headers
  api.use(cors({ origin: [appOrigin], credentials: true }));
  api.use(express.json({ limit: '1mb' }));
  api.use(cookieParser());
  api.use(refuseForeignOrigins(appOrigin));
  const auth = requireUser(opts.db, opts.jwtSecret);
  const secure = opts.secureCookies ?? opts.appUrl.startsWith('https:');
  api.use(healthRouter(opts.db));
  api.use(authRouter(opts.db, opts.jwtSecret, secure, limitStore));
  api.use(
    passwordRouter(
      opts.db,
      opts.jwtSecret,
      auth,
      opts.mailer,
      opts.appUrl,
      (res, token) => setSessionCookie(res, token, secure),
      log,
      limitStore,
    ),
  );
  api.use(desksRouter(opts.db, auth, opts.mailer, opts.appUrl));
  api.use(setsRouter(opts.db, auth));
  api.use(syncRouter(opts.db, auth, opts.events));
  api.use((req, _res, next) =>
    next(new HttpError(404, 'not-found', `no route ${req.method} /api${req.path}`)),
  );
  app.use('/api', api);
  if (opts.mailboxDir && !opts.production) app.get('/dev/mailbox', mailboxPage(opts.mailboxDir));
  // never the app's page either: a reachable service must not look as if it had a mailbox
  else
    app.get('/dev/mailbox', (_req, res) => {
      res.status(404).type('text/plain').send('Not found');
    });

  if (opts.staticDir && existsSync(join(opts.staticDir, 'index.html'))) {
    const dir = opts.staticDir;
    app.use(
      express.static(dir, {
        index: false,
        setHeaders: (res, file) => {
          if (file.endsWith('sw.js') || file.endsWith('.html') || file.endsWith('.webmanifest')) {
            res.setHeader('Cache-Control', 'no-cache');
          } else if (file.includes(`${join(dir, 'assets')}`)) {
            res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          }
        },
      }),
    );
    app.get(/^(?!\/api\/).*/, (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(join(dir, 'index.html'));
    });
  }
  app.use(errorHandler((line) => logger.error(line)));
  return app;
}

/**
 * CSRF defence in depth beside the SameSite=Strict cookie: a state-changing request that
 * names a foreign Origin is refused. Same-origin requests (Origin equal to the app's or to
 * this server's own host) and scripts without an Origin pass.
 */
function refuseForeignOrigins(appOrigin: string): express.RequestHandler {
  return (req, _res, next) => {
    const origin = req.get('origin');
    if (!origin || req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS')
      return next();
    const own = `${req.protocol}://${req.get('host')}`;
    if (origin === appOrigin || origin === own) return next();
    next(new HttpError(403, 'foreign-origin', 'requests from other sites are refused'));
  };
}
