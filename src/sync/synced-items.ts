/**
 * The two kinds of item the sync engine carries, scenarios and the desk's books: where each
 * is kept on this device, how a server copy becomes a local one, and where the user's own
 * version goes when it cannot stay on the service (a device-only scenario or book).
 */
import type { Table } from 'dexie';
import type { ItemKind } from '../contracts';
import type { BookDocument } from '../engine/book';
import type { ScenarioDocument } from '../engine/core';
import type { OutboxEntry, SaltationDb, SyncedItem } from '../store/db';

export const kindOf = (e: Pick<OutboxEntry, 'kind'>): ItemKind => e.kind ?? 'scenario';

export function itemTable(db: SaltationDb, kind: ItemKind): Table<SyncedItem, string> {
  return (kind === 'book' ? db.deskBooks : db.scenarios) as unknown as Table<SyncedItem, string>;
}

/** Every table a sync step may write, for one Dexie transaction. */
export const syncTables = (db: SaltationDb) => [
  db.scenarios,
  db.deskBooks,
  db.sets,
  db.outbox,
  db.remoteSets,
  db.meta,
];

export function fromServer(
  c: { revision: number; document: unknown; setId: string },
  id: string,
): SyncedItem {
  return {
    id,
    name: (c.document as { name: string }).name,
    document: c.document,
    setId: c.setId,
    revision: c.revision,
    syncState: 'synced',
    updatedAt: Date.now(),
  };
}

/** The user's version kept on this device only, under a new id (nothing typed is thrown away). */
export async function keepOnDevice(
  db: SaltationDb,
  kind: ItemKind,
  item: SyncedItem,
  why: string,
): Promise<void> {
  const id = crypto.randomUUID();
  const name = `${item.name} (${why})`;
  const updatedAt = Date.now();
  if (kind === 'book') {
    const book = item.document as BookDocument;
    await db.sets.put({
      id,
      name,
      scenarioIds: book.scenarioIds,
      baseScenarioId: book.baseScenarioId,
      positions: book.positions,
      updatedAt,
    });
    return;
  }
  await db.scenarios.put({
    id,
    name,
    document: { ...(item.document as ScenarioDocument), id, name },
    setId: null,
    revision: 0,
    syncState: 'local',
    updatedAt,
  });
}
