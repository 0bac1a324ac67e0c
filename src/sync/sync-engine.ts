/**
 * One round of sync between this device's Dexie store and the service: push the outbox, then
 * pull everything since the device's cursor. The network calls run outside Dexie
 * transactions; each answer is applied in one transaction, so a crash between the two leaves
 * the outbox entry in place and the push is retried under the same mutation id.
 *
 * Several edits of one item (a scenario or a desk's book) collapse into one mutation: its
 * current document on top of the revision this copy is based on, named by its newest outbox
 * entry's id.
 */
import type { OutboxEntry, SaltationDb } from '../store/db';
import type { MutationResult, PullAnswer, PushMutation, SyncTransport } from './protocol';
import { fromServer, itemTable, keepOnDevice, kindOf, syncTables } from './synced-items';

export interface SyncReport {
  pushed: number;
  applied: number;
  conflicts: number;
  denied: number;
  invalid: number;
  pulled: number;
  removed: number;
}

const PUSH_BATCH = 100;
const COUNTED_AS = {
  applied: 'applied',
  conflict: 'conflicts',
  denied: 'denied',
  invalid: 'invalid',
} as const satisfies Record<MutationResult['status'], keyof SyncReport>;
/** v2: the cursor of pulls that carry books (a device from before books pulls once in full) */
export const cursorKey = (userId: string) => `cursor:v2:${userId}`;

export async function syncOnce(
  db: SaltationDb,
  transport: SyncTransport,
  userId: string,
): Promise<SyncReport> {
  const report: SyncReport = {
    pushed: 0,
    applied: 0,
    conflicts: 0,
    denied: 0,
    invalid: 0,
    pulled: 0,
    removed: 0,
  };
  const pending = await pendingMutations(db);
  for (let i = 0; i < pending.length; i += PUSH_BATCH) {
    const batch = pending.slice(i, i + PUSH_BATCH);
    const { results } = await transport.push(batch.map((p) => p.mutation));
    report.pushed += batch.length;
    for (const [k, result] of results.entries()) {
      report[COUNTED_AS[result.status]]++;
      await applyResult(db, batch[k], result);
    }
  }
  let more = true;
  while (more) {
    const cursor = (await db.meta.get(cursorKey(userId)))?.value ?? '0';
    const answer = await transport.pull(cursor);
    await applyPull(db, userId, answer, report);
    more = answer.more;
  }
  return report;
}

interface Pending {
  mutation: PushMutation;
  /** the outbox entries this mutation carries (all of the item's up to the newest) */
  lastSeq: number;
}

/** One mutation per item with pushable edits: in a set, not in conflict, not refused. */
export async function pendingMutations(db: SaltationDb): Promise<Pending[]> {
  const entries = await db.outbox.orderBy('seq').toArray();
  const newest = new Map<string, OutboxEntry>();
  for (const e of entries) newest.set(e.scenarioId, e);
  const out: Pending[] = [];
  for (const [scenarioId, entry] of newest) {
    const kind = kindOf(entry);
    // scenario mutations stay as they were before books (no kind field)
    const tagged = kind === 'book' ? { kind } : {};
    const s = await itemTable(db, kind).get(scenarioId);
    if (s) {
      if (s.setId === null || s.syncState === 'conflict' || s.syncError) continue;
      out.push({
        lastSeq: entry.seq!,
        mutation: {
          mutationId: entry.mutationId,
          scenarioId,
          ...tagged,
          setId: s.setId,
          baseRevision: s.revision,
          document: s.document,
        },
      });
    } else if (entry.deleted && entry.setId) {
      out.push({
        lastSeq: entry.seq!,
        mutation: {
          mutationId: entry.mutationId,
          scenarioId,
          ...tagged,
          setId: entry.setId,
          baseRevision: entry.baseRevision,
          deleted: true,
        },
      });
    } else {
      // a device-only item deleted before it was ever shared: nothing to tell anyone
      await db.outbox.where('scenarioId').equals(scenarioId).delete();
    }
  }
  return out;
}

async function applyResult(db: SaltationDb, p: Pending, result: MutationResult) {
  const id = p.mutation.scenarioId;
  const kind = p.mutation.kind ?? 'scenario';
  const table = itemTable(db, kind);
  await db.transaction('rw', syncTables(db), async () => {
    const carried = await db.outbox
      .where('scenarioId')
      .equals(id)
      .filter((e) => e.seq! <= p.lastSeq)
      .primaryKeys();
    await db.outbox.bulkDelete(carried);
    const left = await db.outbox.where('scenarioId').equals(id).count();
    const s = await table.get(id);
    if (result.status === 'applied') {
      if (s) {
        await table.put({
          ...s,
          revision: result.revision ?? s.revision,
          syncState: left > 0 ? 'pending' : 'synced',
        });
      }
      return;
    }
    if (result.status === 'conflict') {
      const current = result.current;
      if (!s) {
        // deleted here, changed there: the server's edit is kept (nothing is lost)
        if (current && !current.deleted) await table.put(fromServer(current, id));
        return;
      }
      await table.put({
        ...s,
        syncState: 'conflict',
        conflict: {
          revision: current?.revision ?? 0,
          document: current?.document ?? null,
          setId: current?.setId ?? s.setId!,
          deleted: current?.deleted ?? false,
          at: Date.now(),
        },
      });
      return;
    }
    if (result.status === 'denied') {
      // not allowed to change it: keep the local edit on this device only, restore theirs
      if (s) await keepOnDevice(db, kind, s, 'my edit');
      await db.outbox.where('scenarioId').equals(id).delete();
      const current = result.current;
      if (current && !current.deleted) await table.put(fromServer(current, id));
      else await table.delete(id);
      return;
    }
    // invalid: leave it for the user, with the service's reason
    if (s) await table.put({ ...s, syncError: result.error ?? 'refused as invalid' });
  });
}

async function applyPull(db: SaltationDb, userId: string, a: PullAnswer, report: SyncReport) {
  await db.transaction('rw', syncTables(db), async () => {
    for (const set of a.sets) {
      if (set.deleted) await db.remoteSets.delete(set.id);
      else
        await db.remoteSets.put({
          id: set.id,
          name: set.name,
          deskId: set.deskId,
          canWrite: set.canWrite,
          canManage: set.canManage,
        });
    }
    await db.remoteSets.bulkDelete(a.removedSets);
    for (const c of a.changes) {
      const table = itemTable(db, c.kind ?? 'scenario');
      const local = await table.get(c.scenarioId);
      const unpushed = await db.outbox.where('scenarioId').equals(c.scenarioId).count();
      if (local?.conflict) {
        // a conflict waiting for the user: resolve it against the newest server copy
        if (c.revision > local.conflict.revision)
          await table.put({
            ...local,
            conflict: {
              revision: c.revision,
              document: c.document,
              setId: c.setId,
              deleted: c.document === null,
              at: Date.now(),
            },
          });
        continue;
      }
      // local edits not yet pushed win locally; their push meets this revision as a conflict
      if (unpushed > 0) continue;
      if (local && local.revision >= c.revision) continue;
      report.pulled++;
      if (c.document === null) await table.delete(c.scenarioId);
      else
        await table.put({
          ...fromServer(
            { revision: c.revision, document: c.document, setId: c.setId },
            c.scenarioId,
          ),
          updatedBy: c.updatedBy,
          // when it was written on the service, not when this device heard of it
          updatedAt: Date.parse(c.updatedAt) || Date.now(),
        });
    }
    for (const id of a.removed) {
      for (const kind of ['scenario', 'book'] as const) {
        const table = itemTable(db, kind);
        const local = await table.get(id);
        if (!local) continue;
        report.removed++;
        const unpushed = await db.outbox.where('scenarioId').equals(id).count();
        if (unpushed > 0 || local.syncState === 'conflict')
          await keepOnDevice(db, kind, local, 'kept after losing access');
        await db.outbox.where('scenarioId').equals(id).delete();
        await table.delete(id);
      }
    }
    await db.meta.put({ key: cursorKey(userId), value: a.cursor });
  });
}
