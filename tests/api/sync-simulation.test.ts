/**
 * Randomized sync simulation (promises 1, 3, 5 of src/contracts/sync.ts) on one service that
 * is restarted mid-run (the loop itself is in tests/support/sync-simulation.ts).
 */
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { freePort } from '../../server/bootstrap/postgres';
import { testDb } from '../support/database';
import { testMail, type TestMail } from '../support/mail';
import { runSyncSimulation } from '../support/sync-simulation';

let port: number;
let server: Server | null = null;
let closeDb: (() => Promise<void>) | null = null;
let mail: TestMail;

async function startService() {
  const db = testDb();
  const app = createApp({
    db,
    jwtSecret: 'sim-secret',
    log: () => undefined,
    rateLimitScope: `test-${Math.random().toString(36).slice(2)}:`,
    mailer: mail.mailer,
    appUrl: `http://127.0.0.1:${port}`,
  });
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  closeDb = () => db.destroy();
}
async function stopService() {
  server?.closeAllConnections();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await closeDb?.();
  server = null;
}

beforeAll(async () => {
  mail = await testMail();
  port = await freePort();
  await startService();
});
afterAll(async () => {
  await stopService();
  await mail.close();
});

let conflictsResolved = 0;

describe('randomized sync simulation', () => {
  for (const seed of [1, 2, 3])
    it(`seed ${seed}: three clients, random offline periods and edits, a service restart: no edit lost, all converge`, async () => {
      conflictsResolved += await runSyncSimulation({
        seed,
        mail,
        baseFor: () => `http://127.0.0.1:${port}`,
        restart: async (whileDown) => {
          await stopService();
          await whileDown();
          await startService();
        },
      });
    }, 120000);

  it('the runs above met conflicts (so the no-loss check covered them)', () => {
    expect(conflictsResolved).toBeGreaterThan(0);
  });
});
