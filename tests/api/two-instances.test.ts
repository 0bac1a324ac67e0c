/**
 * Two service processes on one PostgreSQL, on two ports, as behind a load balancer: the
 * randomized sync simulation with clients spread across both and one instance restarted
 * mid-run; a sign-out on one ends the session on the other; failed sign-ins split across both
 * trip the account limit exactly as on one; an edit pushed through one reaches a client
 * streaming events from the other within 2 s (PostgreSQL LISTEN/NOTIFY).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../server/bootstrap/postgres';
import { testDatabaseUrl } from '../support/database';
import { testMail, type TestMail } from '../support/mail';
import { startInstance, type Instance } from '../support/instance';
import { scenarioDoc } from '../support/scenario-doc';
import { call, runSyncSimulation, signUp } from '../support/sync-simulation';

let mail: TestMail;
let dataDir: string;
const ports: number[] = [];
const instances: (Instance | null)[] = [null, null];
const base = (i: number) => `http://127.0.0.1:${ports[i]}`;

async function start(i: number): Promise<void> {
  instances[i] = await startInstance(ports[i], {
    DATABASE_URL: testDatabaseUrl(),
    SALTATION_DATA_DIR: dataDir,
    JWT_SECRET: 'two-instances-secret-0123456789abcdef',
    SMTP_URL: mail.url,
    APP_URL: 'http://app.saltation.test',
  });
}

async function stop(i: number): Promise<void> {
  await instances[i]?.stop();
  instances[i] = null;
}

beforeAll(async () => {
  mail = await testMail();
  dataDir = mkdtempSync(join(tmpdir(), 'saltation-two-'));
  ports.push(await freePort(), await freePort());
  // both at once: the advisory lock makes them migrate and seed once
  await Promise.all([start(0), start(1)]);
}, 120000);

afterAll(async () => {
  await Promise.all([stop(0), stop(1)]);
  await mail.close();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('two instances on one database', () => {
  it('the sync simulation with clients on both and instance 2 restarted mid-run loses nothing, and every client converges', async () => {
    // the simulation asserts no loss and convergence itself
    await runSyncSimulation({
      seed: 4,
      mail,
      baseFor: (client) => base(client === 0 ? 0 : 1),
      restart: async (whileDown) => {
        await stop(1);
        await whileDown();
        await start(1);
      },
    });
  }, 180000);

  it('a sign-out on one instance ends the session on the other', async () => {
    const u = await signUp(base(0), 'two-signout');
    await call(base(1), u.token, 'GET', '/me');
    await call(base(0), u.token, 'POST', '/auth/signout');
    const after = await fetch(`${base(1)}/api/me`, {
      headers: { Authorization: `Bearer ${u.token}` },
    });
    expect(after.status).toBe(401);
  });

  it('ten failed sign-ins for one account, split across both, trip the account limit as on one instance', async () => {
    const u = await signUp(base(0), 'two-limit');
    const attempt = (i: number, password: string) =>
      fetch(`${base(i)}/api/auth/signin`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: u.email, password }),
      }).then((r) => r.status);
    const statuses: number[] = [];
    for (let k = 0; k < 10; k++) statuses.push(await attempt(k % 2, 'wrong-password-1'));
    expect(statuses).toEqual(new Array(10).fill(401));
    // the eleventh is refused on either instance, even with the right password
    expect(await attempt(0, u.password)).toBe(429);
    expect(await attempt(1, u.password)).toBe(429);
  });

  it('an edit pushed through one instance reaches a client streaming events from the other within 2 s', async () => {
    const u = await signUp(base(0), 'two-events');
    const { set } = await call<{ set: { id: string } }>(base(0), u.token, 'POST', '/sets', {
      name: 'Events set',
    });
    const controller = new AbortController();
    const stream = await fetch(`${base(1)}/api/sync/events`, {
      headers: { Authorization: `Bearer ${u.token}` },
      signal: controller.signal,
    });
    expect(stream.headers.get('content-type')).toMatch(/text\/event-stream/);
    const reader = stream.body!.getReader();
    const decoder = new TextDecoder();
    let text = '';
    const next = async (pattern: RegExp) => {
      while (!pattern.test(text)) {
        const { value, done } = await reader.read();
        if (done) throw new Error('the stream ended');
        text += decoder.decode(value);
      }
    };
    await next(/event: ready/);
    text = '';
    const id = randomUUID();
    const pushedAt = performance.now();
    await call(base(0), u.token, 'POST', '/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: id,
          setId: set.id,
          baseRevision: 0,
          document: scenarioDoc(id, 'Pushed through instance 1', 'live'),
        },
      ],
    });
    await next(/event: change\ndata: \{"space":"user:/);
    const delay = performance.now() - pushedAt;
    controller.abort();
    expect(delay).toBeLessThan(2000);
  });
});
