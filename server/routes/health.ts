import { Router } from 'express';
import type { Knex } from 'knex';
import { databaseIsUp } from '../db';

export function healthRouter(db: Knex): Router {
  const r = Router();
  r.get('/health', async (_req, res) => {
    const up = await databaseIsUp(db);
    res.status(up ? 200 : 503).json({ ok: up, database: up ? 'up' : 'down' });
  });
  return r;
}
