/**
 * Liveness (`/api/health`: the process answers and says whether the database does) and
 * readiness (`/api/ready`: the database answers and every migration is applied), for a load
 * balancer or systemd to ask.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { databaseIsUp, pendingMigrations } from '../db';

export function healthRouter(db: Knex): Router {
  const r = Router();
  r.get('/health', async (_req, res) => {
    const up = await databaseIsUp(db);
    res.status(up ? 200 : 503).json({ ok: up, database: up ? 'up' : 'down' });
  });
  r.get('/ready', async (_req, res) => {
    const up = await databaseIsUp(db);
    const pending = up ? await pendingMigrations(db).catch(() => null) : null;
    const ready = up && pending !== null && pending.length === 0;
    res.status(ready ? 200 : 503).json({
      ready,
      database: up ? 'up' : 'down',
      pendingMigrations: pending,
    });
  });
  return r;
}
