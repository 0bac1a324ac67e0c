/** The Express application: `/api` routes and, when built, the PWA from `dist/`. */
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Knex } from 'knex';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { errorHandler, HttpError } from './errors';
import { authRouter } from './routes/auth';
import { healthRouter } from './routes/health';

export interface AppOptions {
  db: Knex;
  jwtSecret: string;
  /** folder of the built client; omitted in API-only and test setups */
  staticDir?: string;
  secureCookies?: boolean;
  log?: (line: string) => void;
}

export function createApp(opts: AppOptions): Express {
  const log = opts.log ?? ((line: string) => console.log(line));
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', false);
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
  app.use((req, res, next) => {
    const started = process.hrtime.bigint();
    res.on('finish', () => {
      if (!req.path.startsWith('/api')) return;
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      log(
        JSON.stringify({
          at: new Date().toISOString(),
          method: req.method,
          path: req.path,
          status: res.statusCode,
          ms: Math.round(ms * 10) / 10,
        }),
      );
    });
    next();
  });

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(cookieParser());
  api.use(healthRouter(opts.db));
  api.use(authRouter(opts.db, opts.jwtSecret, opts.secureCookies ?? false));
  api.use((req, _res, next) =>
    next(new HttpError(404, 'not-found', `no route ${req.method} /api${req.path}`)),
  );
  app.use('/api', api);

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
  app.use(errorHandler(log));
  return app;
}
