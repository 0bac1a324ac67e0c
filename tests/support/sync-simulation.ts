/**
 * The randomized sync simulation shared by the one-instance and two-instance tests: three
 * clients of one desk, each with its own IndexedDB (fake-indexeddb) and the real client sync
 * engine, edit shared scenarios while going offline and online at random; the service (or one
 * instance of it) is restarted mid-run. At the end every edit is in the server's revision
 * history (conflicts are resolved by keeping both versions, so a conflict never drops an edit),
 * and every client equals the server.
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import seedrandom from 'seedrandom';
import { expect } from 'vitest';
import { canonicalJson, type ScenarioDocument } from '../../src/engine/core';
import { SaltationDb } from '../../src/store/db';
import { deleteScenario, saveScenario } from '../../src/store/scenarios';
import { keepBoth } from '../../src/sync/conflicts';
import type { SyncTransport } from '../../src/sync/protocol';
import { syncOnce } from '../../src/sync/sync-engine';
import type { TestMail } from './mail';
import { scenarioDoc } from './scenario-doc';

export async function call<T>(
  base: string,
  token: string | null,
  method: string,
  path: string,
  body?: unknown,
): Promise<T> {
  const res = await fetch(`${base}/api${path}`, {
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

const transport = (base: string, token: string): SyncTransport => ({
  push: (mutations) => call(base, token, 'POST', '/sync/push', { mutations }),
  pull: (since) => call(base, token, 'GET', `/sync/pull?since=${encodeURIComponent(since)}`),
});

export async function signUp(base: string, label: string) {
  const email = `${label}-${randomUUID().slice(0, 8)}@example.test`;
  const password = `${label}-password-1`;
  const { user } = await call<{ user: { id: string } }>(base, null, 'POST', '/auth/register', {
    email,
    password,
    name: label,
  });
  const { token } = await call<{ token: string }>(base, null, 'POST', '/auth/signin', {
    email,
    password,
  });
  return { id: user.id, email, password, token };
}

export interface SimulationSetup {
  seed: number;
  mail: TestMail;
  /** the service each of the three clients talks to (the same for all on one instance) */
  baseFor: (client: number) => string;
  /** stops the service (or an instance); `whileDown` runs before it starts again */
  restart: (whileDown: () => Promise<void>) => Promise<void>;
}

/** Runs one seed; answers how many conflicts were resolved on the way. */
export async function runSyncSimulation({ seed, mail, baseFor, restart }: SimulationSetup) {
  const admin = baseFor(0);
  let conflictsResolved = 0;
  const random = seedrandom(`saltation-sync-sim-${seed}`);
  const lead = await signUp(admin, 'sim-lead');
  const traders = [await signUp(baseFor(1), 'sim-a'), await signUp(baseFor(2), 'sim-b')];
  const { desk } = await call<{ desk: { id: string } }>(admin, lead.token, 'POST', '/desks', {
    name: 'Sim desk',
  });
  for (const t of traders) {
    await call(admin, lead.token, 'POST', `/desks/${desk.id}/invites`, {
      email: t.email,
      role: 'trader',
    });
    const token = new URL(await mail.linkFor(t.email, /invites you/)).searchParams.get('token');
    await call(admin, t.token, 'POST', '/invites/accept', { token });
  }
  const { set } = await call<{ set: { id: string } }>(admin, lead.token, 'POST', '/sets', {
    name: 'Sim set',
    deskId: desk.id,
  });
  const clients = [lead, ...traders].map((u, i) => ({
    base: baseFor(i),
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
      await syncOnce(c.db, transport(c.base, c.user.token), c.user.id);
    } catch {
      unreachable++; // the service is down: the outbox keeps everything
    }
  };

  for (let tick = 0; tick < 80; tick++) {
    if (tick === 40 && !restarted) {
      await restart(async () => {
        for (const c of clients) await trySync(c); // while it is down
      });
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
    expect(await c.db.scenarios.where('syncState').anyOf('conflict', 'pending').count()).toBe(0);
  }

  // every edit is in some revision on the server
  const everything = await call<{
    changes: { scenarioId: string; document: ScenarioDocument | null }[];
  }>(admin, lead.token, 'GET', '/sync/pull?since=0');
  const history = new Set<string>();
  for (const ch of everything.changes) {
    const { revisions } = await call<{ revisions: { document: ScenarioDocument | null }[] }>(
      admin,
      lead.token,
      'GET',
      `/scenarios/${ch.scenarioId}/revisions`,
    );
    for (const r of revisions) for (const t of (r.document?.notes ?? '').split(' ')) history.add(t);
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
  return conflictsResolved;
}
