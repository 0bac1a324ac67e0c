/**
 * Books kept in the desk's sets on the service. Each save writes the book and its outbox entry
 * in one transaction, as a scenario's does; the sync engine pushes it with `kind: "book"`.
 */
import { BOOK_FORMAT, parseBook, type BookDocument } from '../engine/book';
import type { SaltationDb, StoredDeskBook } from './db';

export function listDeskBooks(db: SaltationDb): Promise<StoredDeskBook[]> {
  return db.deskBooks.orderBy('setId').toArray();
}

/** A new, empty book in a desk set, revalued under the given scenarios. */
export function newDeskBook(name: string, scenarioIds: string[]): BookDocument {
  return {
    format: BOOK_FORMAT,
    id: crypto.randomUUID(),
    name: name.trim(),
    scenarioIds,
    baseScenarioId: scenarioIds[0] ?? null,
    positions: [],
  };
}

export async function saveDeskBook(
  db: SaltationDb,
  document: BookDocument,
  setId: string,
): Promise<StoredDeskBook> {
  const parsed = parseBook(document);
  if (!parsed.ok) throw new Error(`${parsed.issues[0].path}: ${parsed.issues[0].message}`);
  return db.transaction('rw', db.deskBooks, db.outbox, async () => {
    const existing = await db.deskBooks.get(document.id);
    const revision = existing?.revision ?? 0;
    const inSet = existing ? existing.setId : setId;
    const stored: StoredDeskBook = {
      ...existing,
      id: document.id,
      name: parsed.value.name,
      document: parsed.value,
      setId: inSet,
      revision,
      // an edit made during a conflict stays in the conflict until the user resolves it
      syncState: existing?.syncState === 'conflict' ? 'conflict' : 'pending',
      updatedAt: Date.now(),
    };
    delete stored.syncError;
    await db.deskBooks.put(stored);
    await db.outbox.where('scenarioId').equals(document.id).delete();
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: document.id,
      kind: 'book',
      baseRevision: revision,
      deleted: false,
      createdAt: Date.now(),
      setId: inSet,
    });
    return stored;
  });
}

export async function deleteDeskBook(db: SaltationDb, id: string): Promise<void> {
  await db.transaction('rw', db.deskBooks, db.outbox, async () => {
    const existing = await db.deskBooks.get(id);
    if (!existing) return;
    await db.deskBooks.delete(id);
    await db.outbox.where('scenarioId').equals(id).delete();
    if (existing.revision > 0)
      await db.outbox.add({
        mutationId: crypto.randomUUID(),
        scenarioId: id,
        kind: 'book',
        baseRevision: existing.revision,
        deleted: true,
        createdAt: Date.now(),
        setId: existing.setId,
      });
  });
}
