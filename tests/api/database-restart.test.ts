/**
 * The service while its database restarts (an idle pool client receiving
 * 57P01 must not crash the process; answer 503 quickly while the database is down; recover on
 * its own). A cluster of its own, so the shared test database keeps running.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { EmbeddedPostgres, freePort } from '../../server/bootstrap/postgres';
import { createDb } from '../../server/db';
import { DEMO_USERS } from '../../server/demo';
import { testMail } from '../support/mail';

const dir = mkdtempSync(join(tmpdir(), 'saltation-restart-'));
let pg: EmbeddedPostgres | undefined;
afterAll(() => {
  pg?.stop();
  rmSync(dir, { recursive: true, force: true });
});

describe('a database restart', () => {
  it('answers 503 fast while PostgreSQL is down and serves again once it is back, without a restart of the service', async () => {
    pg = new EmbeddedPostgres({
      dir,
      port: await freePort(),
      database: 'restart',
      throwaway: true,
      log: () => undefined,
    });
    await pg.start();
    const migrated = spawnSync(process.execPath, ['--import', 'tsx', 'tests/support/migrate.ts'], {
      cwd: fileURLToPath(new URL('../..', import.meta.url)),
      env: { ...process.env, DATABASE_URL: pg.url },
      encoding: 'utf8',
    });
    expect(migrated.status, migrated.stderr).toBe(0);
    const db = createDb(pg.url);
    const mail = await testMail();
    const app = createApp({
      db,
      jwtSecret: 'restart',
      log: () => undefined,
      rateLimitScope: `test-${Math.random().toString(36).slice(2)}:`,
      mailer: mail.mailer,
      appUrl: 'http://app.test',
    });
    const lead = DEMO_USERS[0];
    const { body } = await request(app)
      .post('/api/auth/signin')
      .send({ email: lead.email, password: lead.password });
    const me = () => request(app).get('/api/me').set('Authorization', `Bearer ${body.token}`);
    expect((await me()).status).toBe(200);

    pg.stop(); // the pool's idle connections are terminated (57P01)
    for (let i = 0; i < 3; i++) {
      const started = performance.now();
      const down = await me();
      expect(down.status).toBe(503);
      expect(down.body.error.code).toBe('database-unavailable');
      expect(performance.now() - started).toBeLessThan(6000); // within the pool's acquire time-out
    }
    expect((await request(app).get('/api/health')).body).toEqual({ ok: false, database: 'down' });

    await pg.start();
    let back = 0;
    for (let i = 0; i < 50 && back !== 200; i++) {
      back = (await me()).status;
      if (back !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(back).toBe(200);
    await db.destroy();
    await mail.close();
  }, 120000);
});
