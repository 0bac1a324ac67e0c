/**
 * Randomized sync simulation (promises 1, 3, 5 of src/contracts/sync.ts): three clients of one desk, each
 * with its own IndexedDB (fake-indexeddb) and the real client sync engine, edit shared
 * scenarios while going offline and online at random; the service is restarted mid-run. At
 * the end every edit is in the server's revision history (conflicts are resolved by keeping
 * both versions, so a conflict never drops an edit), and every client equals the server.
 */
import 'fake-indexeddb/auto';
import type { Server } from 'node:http';
import { randomUUID } from 'node:crypto';
import seedrandom from 'seedrandom';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { canonicalJson, type ScenarioDocument } from '../../src/engine/core';
import { freePort } from '../../server/bootstrap/postgres';
import { SaltationDb } from '../../src/store/db';
import { deleteScenario, saveScenario } from '../../src/store/scenarios';
import { keepBoth } from '../../src/sync/conflicts';
import type { SyncTransport } from '../../src/sync/protocol';
import { syncOnce } from '../../src/sync/sync-engine';
import { testDb } from '../support/database';
import { testMail, type TestMail } from '../support/mail';
import { scenarioDoc } from '../support/scenario-doc';

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

async function call<T>(
  token: string | null,
  method: string,
  path: string,
  body?: unknown,
): Promise<T> {
  const res = await fetch(`http://127.0.0.1:${port}/api${path}`, {
    method,
    headers: {
      'Content-Type': 'application/json',
      ...(token ? { Authorization: `Bearer ${token}` } : {}),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const json = (await res.json()) as T;
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(json)}`);
  return json;
}

const transport = (token: string): SyncTransport => ({
  push: (mutations) => call(token, 'POST', '/sync/push', { mutations }),
  pull: (since) => call(token, 'GET', `/sync/pull?since=${encodeURIComponent(since)}`),
});

async function signUp(label: string) {
  const email = `${label}-${randomUUID().slice(0, 8)}@example.test`;
  const password = `${label}-password-1`;
  const { user } = await call<{ user: { id: string } }>(null, 'POST', '/auth/register', {
    email,
    password,
    name: label,
  });
  const { token } = await call<{ token: string }>(null, 'POST', '/auth/signin', {
    email,
    password,
  });
  return { id: user.id, email, token };
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
      const random = seedrandom(`saltation-sync-sim-${seed}`);
      const lead = await signUp('sim-lead');
      const traders = [await signUp('sim-a'), await signUp('sim-b')];
      const { desk } = await call<{ desk: { id: string } }>(lead.token, 'POST', '/desks', {
        name: 'Sim desk',
      });
      for (const t of traders) {
        await call(lead.token, 'POST', `/desks/${desk.id}/invites`, {
          email: t.email,
          role: 'trader',
        });
        const token = new URL(await mail.linkFor(t.email, /invites you/)).searchParams.get('token');
        await call(t.token, 'POST', '/invites/accept', { token });
      }
      const { set } = await call<{ set: { id: string } }>(lead.token, 'POST', '/sets', {
        name: 'Sim set',
        deskId: desk.id,
      });
      const clients = [lead, ...traders].map((u, i) => ({
        user: u,
        db: new SaltationDb(`sim-${i}-${randomUUID()}`),
        online: true,
        edits: 0,
      }));
      const tokens: string[] = [];
      const discarded = new Set<string>();
      let restarted = false;
      let unreachable = 0;

      const trySync = async (c: (typeof clients)[number]) => {
        if (!c.online) return;
        try {
          await syncOnce(c.db, transport(c.user.token), c.user.id);
        } catch {
          unreachable++; // the service is down: the outbox keeps everything
        }
      };

      for (let tick = 0; tick < 80; tick++) {
        if (tick === 40 && !restarted) {
          await stopService();
          for (const c of clients) await trySync(c); // while it is down
          await startService();
          restarted = true;
        }
        const c = clients[Math.floor(random() * clients.length)];
        const roll = random();
        if (roll < 0.15) c.online = !c.online;
        else if (roll < 0.3) {
          const id = randomUUID();
          const token = `new:${tokens.length}`;
          tokens.push(token);
          await saveScenario(c.db, scenarioDoc(id, `Scenario ${tokens.length}`, token), set.id);
        } else if (roll < 0.35 && c === clients[0]) {
          const mine = await c.db.scenarios.where('setId').equals(set.id).toArray();
          if (mine.length > 3) {
            const victim = mine[Math.floor(random() * mine.length)];
            // deleting discards the deleter's own unpushed edits of it, by intent
            for (const t of (victim.document.notes ?? '').split(' ')) discarded.add(t);
            await deleteScenario(c.db, victim.id);
          }
        } else {
          const mine = await c.db.scenarios.where('setId').equals(set.id).toArray();
          if (mine.length > 0) {
            const s = mine[Math.floor(random() * mine.length)];
            const token = `edit:${tokens.length}`;
            tokens.push(token);
            const doc: ScenarioDocument = {
              ...s.document,
              notes: `${s.document.notes ?? ''} ${token}`.trim(),
            };
            await saveScenario(c.db, doc);
          }
        }
        await trySync(c);
      }

      // everyone back online; conflicts resolved by keeping both; sync until nothing moves
      for (const c of clients) c.online = true;
      for (let round = 0; round < 12; round++) {
        for (const c of clients) {
          const conflicted = await c.db.scenarios.where('syncState').equals('conflict').toArray();
          for (const s of conflicted) await keepBoth(c.db, s.id, true);
          conflictsResolved += conflicted.length;
          await trySync(c);
        }
      }
      for (const c of clients) {
        expect(await c.db.outbox.count()).toBe(0);
        expect(await c.db.scenarios.where('syncState').anyOf('conflict', 'pending').count()).toBe(
          0,
        );
      }

      // every edit is in some revision on the server
      const everything = await call<{
        changes: { scenarioId: string; document: ScenarioDocument | null }[];
      }>(lead.token, 'GET', '/sync/pull?since=0');
      const history = new Set<string>();
      for (const ch of everything.changes) {
        const { revisions } = await call<{ revisions: { document: ScenarioDocument | null }[] }>(
          lead.token,
          'GET',
          `/scenarios/${ch.scenarioId}/revisions`,
        );
        for (const r of revisions)
          for (const t of (r.document?.notes ?? '').split(' ')) history.add(t);
      }
      expect(tokens.length).toBeGreaterThan(30);
      expect(tokens.filter((t) => !history.has(t) && !discarded.has(t))).toEqual([]);
      expect(unreachable).toBeGreaterThan(0);

      // convergence: each client holds exactly the server's live scenarios of the set
      const live = new Map(
        everything.changes
          .filter((ch) => ch.document)
          .map((ch) => [ch.scenarioId, canonicalJson(ch.document)]),
      );
      for (const c of clients) {
        const local = await c.db.scenarios.where('setId').equals(set.id).toArray();
        expect(new Map(local.map((s) => [s.id, canonicalJson(s.document)]))).toEqual(live);
        c.db.close();
      }
    }, 120000);

  it('the runs above met conflicts (so the no-loss check covered them)', () => {
    expect(conflictsResolved).toBeGreaterThan(0);
  });
});
