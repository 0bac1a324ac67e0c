import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { apiFixture, type TestUser } from '../support/api';
import { scenarioDoc } from '../support/scenario-doc';

const api = apiFixture();

async function personalSet(user: TestUser) {
  const res = await api.as(user).post('/api/sets', { name: 'My set' });
  expect(res.status).toBe(201);
  return res.body.set.id as string;
}

const push = (user: TestUser, mutations: object[]) =>
  api.as(user).post('/api/sync/push', { mutations });

describe('sync (the push and pull contract and promises 2–4 of src/contracts/sync.ts)', () => {
  it('creates, updates, refuses a stale base with the server document, and lists the revisions', async () => {
    const u = await api.user('sync-basic');
    const setId = await personalSet(u);
    const id = randomUUID();
    const create = await push(u, [
      {
        mutationId: randomUUID(),
        scenarioId: id,
        setId,
        baseRevision: 0,
        document: scenarioDoc(id, 'v1'),
      },
    ]);
    expect(create.status).toBe(200);
    expect(create.body.results[0]).toMatchObject({ status: 'applied', revision: 1 });
    const update = await push(u, [
      {
        mutationId: randomUUID(),
        scenarioId: id,
        setId,
        baseRevision: 1,
        document: scenarioDoc(id, 'v2'),
      },
    ]);
    expect(update.body.results[0]).toMatchObject({ status: 'applied', revision: 2 });
    // someone still on revision 1
    const stale = await push(u, [
      {
        mutationId: randomUUID(),
        scenarioId: id,
        setId,
        baseRevision: 1,
        document: scenarioDoc(id, 'v2-other'),
      },
    ]);
    expect(stale.body.results[0].status).toBe('conflict');
    expect(stale.body.results[0].current).toMatchObject({ revision: 2, document: { name: 'v2' } });
    const history = await api.as(u).get(`/api/scenarios/${id}/revisions`);
    expect(history.status).toBe(200);
    expect(
      history.body.revisions.map((r: { revision: number; document: { name: string } }) => [
        r.revision,
        r.document.name,
      ]),
    ).toEqual([
      [2, 'v2'],
      [1, 'v1'],
    ]);
    expect(history.body.revisions[0].author).toBe('sync-basic');
  });

  it('applies a retried mutation once and answers the retry with the first result', async () => {
    const u = await api.user('sync-retry');
    const setId = await personalSet(u);
    const id = randomUUID();
    const m = {
      mutationId: randomUUID(),
      scenarioId: id,
      setId,
      baseRevision: 0,
      document: scenarioDoc(id),
    };
    const [a, b] = await Promise.all([push(u, [m]), push(u, [m])]);
    const again = await push(u, [m]);
    for (const r of [a, b, again])
      expect(r.body.results[0]).toMatchObject({ status: 'applied', revision: 1 });
    const history = await api.as(u).get(`/api/scenarios/${id}/revisions`);
    expect(history.body.revisions).toHaveLength(1);
  });

  it('pulls changes since a cursor, tombstones after a delete, and nothing new after the last cursor', async () => {
    const u = await api.user('sync-pull');
    const setId = await personalSet(u);
    const first = await api.as(u).get('/api/sync/pull?since=0');
    expect(first.body.sets.map((s: { id: string }) => s.id)).toContain(setId);
    const ids = [randomUUID(), randomUUID()];
    await push(
      u,
      ids.map((id) => ({
        mutationId: randomUUID(),
        scenarioId: id,
        setId,
        baseRevision: 0,
        document: scenarioDoc(id),
      })),
    );
    const second = await api.as(u).get(`/api/sync/pull?since=${first.body.cursor}`);
    expect(second.body.changes.map((c: { scenarioId: string }) => c.scenarioId).sort()).toEqual(
      [...ids].sort(),
    );
    const del = await push(u, [
      { mutationId: randomUUID(), scenarioId: ids[0], setId, baseRevision: 1, deleted: true },
    ]);
    expect(del.body.results[0]).toMatchObject({ status: 'applied', revision: 2 });
    const third = await api.as(u).get(`/api/sync/pull?since=${second.body.cursor}`);
    expect(third.body.changes).toEqual([
      expect.objectContaining({ scenarioId: ids[0], revision: 2, document: null }),
    ]);
    const fourth = await api.as(u).get(`/api/sync/pull?since=${third.body.cursor}`);
    expect(fourth.body.changes).toEqual([]);
    expect(fourth.body.cursor).toBe(third.body.cursor);
  });

  it('never skips a change behind the cursor when writes to one desk interleave (cursor-skip trap)', async () => {
    const u = await api.user('sync-race');
    const setId = await personalSet(u);
    let cursor = '0';
    const seen = new Set<string>();
    const written: string[] = [];
    for (let round = 0; round < 5; round++) {
      const ids = Array.from({ length: 8 }, () => randomUUID());
      written.push(...ids);
      // eight concurrent pushes and a pull racing them
      const pulls = api.as(u).get(`/api/sync/pull?since=${cursor}`);
      await Promise.all(
        ids.map((id) =>
          push(u, [
            {
              mutationId: randomUUID(),
              scenarioId: id,
              setId,
              baseRevision: 0,
              document: scenarioDoc(id),
            },
          ]),
        ),
      );
      const p = await pulls;
      for (const c of p.body.changes) seen.add(c.scenarioId);
      cursor = p.body.cursor;
    }
    const last = await api.as(u).get(`/api/sync/pull?since=${cursor}`);
    for (const c of last.body.changes) seen.add(c.scenarioId);
    expect(written.filter((id) => !seen.has(id))).toEqual([]);
  });

  it('refuses bad input with a 400 naming the field, and an invalid document inside a push', async () => {
    const u = await api.user('sync-bad');
    const setId = await personalSet(u);
    const noList = await api.as(u).post('/api/sync/push', { mutations: [] });
    expect(noList.status).toBe(400);
    expect(noList.body.error.path).toBe('body.mutations');
    const badCursor = await api.as(u).get('/api/sync/pull?since=not-a-cursor');
    expect(badCursor.status).toBe(400);
    expect(badCursor.body.error.path).toBe('query.since');
    const id = randomUUID();
    const doc = { ...scenarioDoc(id), market: { spot: -1, rate: 0.01, dividendYield: 0 } };
    const invalid = await push(u, [
      { mutationId: randomUUID(), scenarioId: id, setId, baseRevision: 0, document: doc },
    ]);
    expect(invalid.body.results[0].status).toBe('invalid');
    expect(invalid.body.results[0].error).toMatch(/^document\.market\.spot/);
  });
});
