/**
 * The client sync engine against a scripted service (the real service is exercised in
 * tests/api/sync-simulation.test.ts): collapsing edits, conflicts and their three ways out,
 * refused edits and lost access keeping the user's work as a device-only copy.
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { newScenario, type ScenarioDocument } from '../../src/engine/core';
import { SaltationDb } from '../../src/store/db';
import { saveScenario } from '../../src/store/scenarios';
import { differingFields, keepBoth, keepMine, takeTheirs } from '../../src/sync/conflicts';
import type {
  MutationResult,
  PullAnswer,
  PushMutation,
  SyncTransport,
} from '../../src/sync/protocol';
import { syncOnce } from '../../src/sync/sync-engine';

const SET = '11111111-1111-4111-8111-111111111111';
const ID = '22222222-2222-4222-8222-222222222222';
const freshDb = () => new SaltationDb(`sync-${Math.random().toString(36).slice(2)}`);
const doc = (name: string, notes = ''): ScenarioDocument => ({
  ...newScenario(ID, name, '2026-12-02'),
  notes,
});
const emptyPull = (extra: Partial<PullAnswer> = {}): PullAnswer => ({
  cursor: 'c1',
  changes: [],
  sets: [],
  removed: [],
  removedSets: [],
  more: false,
  ...extra,
});

/** A service that answers pushes with `answer` and records what it was sent. */
function scripted(answer: (m: PushMutation) => MutationResult, pull: PullAnswer = emptyPull()) {
  const pushed: PushMutation[] = [];
  const transport: SyncTransport = {
    push: async (mutations) => {
      pushed.push(...mutations);
      return { results: mutations.map(answer) };
    },
    pull: async () => pull,
  };
  return { transport, pushed };
}

async function sharedScenario(db: SaltationDb, revision: number) {
  await db.scenarios.put({
    id: ID,
    name: 'Shared',
    document: doc('Shared'),
    setId: SET,
    revision,
    syncState: 'synced',
    updatedAt: 0,
  });
}

describe('the client sync engine', () => {
  it('collapses several offline edits into one mutation on the revision it started from', async () => {
    const db = freshDb();
    await sharedScenario(db, 3);
    await saveScenario(db, doc('Shared', 'one'));
    await saveScenario(db, doc('Shared', 'two'));
    const s = scripted((m) => ({ mutationId: m.mutationId, status: 'applied', revision: 4 }));
    const report = await syncOnce(db, s.transport, 'u1');
    expect(s.pushed).toHaveLength(1);
    expect(s.pushed[0]).toMatchObject({
      scenarioId: ID,
      setId: SET,
      baseRevision: 3,
      document: { notes: 'two' },
    });
    expect(report.applied).toBe(1);
    expect(await db.scenarios.get(ID)).toMatchObject({ revision: 4, syncState: 'synced' });
    expect(await db.outbox.count()).toBe(0);
    expect((await db.meta.get('cursor:v2:u1'))?.value).toBe('c1');
  });

  it('a conflict keeps my edit and the server copy; keep mine rebases, take theirs and keep both lose nothing', async () => {
    for (const how of ['mine', 'theirs', 'both'] as const) {
      const db = freshDb();
      await sharedScenario(db, 3);
      await saveScenario(db, doc('Shared', 'mine'));
      const theirs = { ...doc('Shared', 'theirs'), name: 'Shared (renamed)' };
      const conflict = scripted((m) => ({
        mutationId: m.mutationId,
        status: 'conflict',
        current: { revision: 5, document: theirs, setId: SET, deleted: false },
      }));
      await syncOnce(db, conflict.transport, 'u1');
      const s = await db.scenarios.get(ID);
      expect(s).toMatchObject({
        syncState: 'conflict',
        document: { notes: 'mine' },
        conflict: { revision: 5 },
      });
      expect(differingFields(s!.document, s!.conflict!.document).map((d) => d.path)).toEqual([
        'name',
        'notes',
      ]);
      if (how === 'mine') {
        await keepMine(db, ID);
        const again = scripted((m) => ({
          mutationId: m.mutationId,
          status: 'applied',
          revision: 6,
        }));
        await syncOnce(db, again.transport, 'u1');
        expect(again.pushed[0]).toMatchObject({ baseRevision: 5, document: { notes: 'mine' } });
        expect(await db.scenarios.get(ID)).toMatchObject({ revision: 6, syncState: 'synced' });
      } else if (how === 'theirs') {
        await takeTheirs(db, ID);
        expect(await db.scenarios.get(ID)).toMatchObject({
          revision: 5,
          syncState: 'synced',
          document: { notes: 'theirs' },
        });
        expect(await db.outbox.count()).toBe(0);
      } else {
        await keepBoth(db, ID, true);
        const all = await db.scenarios.toArray();
        expect(all.map((x) => x.document.notes).sort()).toEqual(['mine', 'theirs']);
        const copy = all.find((x) => x.id !== ID)!;
        expect(copy).toMatchObject({
          setId: SET,
          revision: 0,
          syncState: 'pending',
          name: 'Shared (my version)',
        });
      }
      db.close();
    }
  });

  it('an edit the service refuses becomes a device-only copy and the shared scenario returns to the server copy', async () => {
    const db = freshDb();
    await sharedScenario(db, 2);
    await saveScenario(db, doc('Shared', 'analyst edit'));
    const s = scripted((m) => ({
      mutationId: m.mutationId,
      status: 'denied',
      error: 'an analyst may not change scenarios in this set',
      current: { revision: 2, document: doc('Shared', 'server'), setId: SET, deleted: false },
    }));
    const report = await syncOnce(db, s.transport, 'u1');
    expect(report.denied).toBe(1);
    const all = await db.scenarios.toArray();
    expect(all.find((x) => x.id === ID)).toMatchObject({
      syncState: 'synced',
      document: { notes: 'server' },
    });
    expect(all.find((x) => x.id !== ID)).toMatchObject({
      setId: null,
      syncState: 'local',
      name: 'Shared (my edit)',
      document: { notes: 'analyst edit' },
    });
    expect(await db.outbox.count()).toBe(0);
  });

  it('losing access removes shared scenarios, but unpushed edits stay as a device-only copy; tombstones delete', async () => {
    const db = freshDb();
    await sharedScenario(db, 2);
    const other = '33333333-3333-4333-8333-333333333333';
    await db.scenarios.put({
      id: other,
      name: 'Gone',
      document: { ...doc('Gone'), id: other },
      setId: SET,
      revision: 1,
      syncState: 'synced',
      updatedAt: 0,
    });
    const tomb = '44444444-4444-4444-8444-444444444444';
    await db.scenarios.put({
      id: tomb,
      name: 'Tomb',
      document: { ...doc('Tomb'), id: tomb },
      setId: SET,
      revision: 1,
      syncState: 'synced',
      updatedAt: 0,
    });
    await saveScenario(db, doc('Shared', 'unpushed'));
    // the push fails (access already lost: no such set), then the pull says what went away
    const s = scripted(
      (m) => ({ mutationId: m.mutationId, status: 'denied', error: 'no such scenario set' }),
      emptyPull({
        removed: [ID, other],
        removedSets: [SET],
        changes: [
          {
            scenarioId: tomb,
            setId: SET,
            revision: 2,
            document: null,
            updatedBy: 'Lead',
            updatedAt: '2026-12-02T00:00:00Z',
          },
        ],
      }),
    );
    await syncOnce(db, s.transport, 'u1');
    const all = await db.scenarios.toArray();
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({
      setId: null,
      syncState: 'local',
      document: { notes: 'unpushed' },
    });
  });

  it('a scenario in conflict when access is lost is kept as a device-only copy', async () => {
    const db = freshDb();
    await db.scenarios.put({
      id: ID,
      name: 'Shared',
      document: doc('Shared', 'my side of a conflict'),
      setId: SET,
      revision: 2,
      syncState: 'conflict',
      conflict: {
        revision: 3,
        document: doc('Shared', 'theirs'),
        setId: SET,
        deleted: false,
        at: 0,
      },
      updatedAt: 0,
    });
    const s = scripted(
      (m) => ({ mutationId: m.mutationId, status: 'applied' }),
      emptyPull({ removed: [ID] }),
    );
    await syncOnce(db, s.transport, 'u1');
    expect(s.pushed).toEqual([]); // a conflict waits for the user; it is never pushed
    const all = await db.scenarios.toArray();
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({
      setId: null,
      name: 'Shared (kept after losing access)',
      document: { notes: 'my side of a conflict' },
    });
  });
});
