/**
 * Resolving a conflict between this device's edit and the server's revision, for a scenario or
 * a desk's book: keep mine (put my document on top of the server's revision), take theirs, or
 * keep both (mine becomes a copy).
 */
import type { ItemKind } from '../contracts';
import type { BookDocument } from '../engine/book';
import type { SaltationDb, StoredScenario, SyncedItem } from '../store/db';
import { saveDeskBook } from '../store/desk-books';
import { saveCopy } from '../store/scenarios';
import { itemTable, keepOnDevice } from './synced-items';

async function inConflict(db: SaltationDb, id: string, kind: ItemKind) {
  const s = await itemTable(db, kind).get(id);
  if (!s?.conflict) throw new Error(`That ${kind} has no conflict to resolve.`);
  return s as SyncedItem & { conflict: NonNullable<SyncedItem['conflict']> };
}

export async function keepMine(
  db: SaltationDb,
  id: string,
  kind: ItemKind = 'scenario',
): Promise<void> {
  const table = itemTable(db, kind);
  await db.transaction('rw', table, db.outbox, async () => {
    const s = await inConflict(db, id, kind);
    const next: SyncedItem = { ...s, revision: s.conflict.revision, syncState: 'pending' };
    delete next.conflict;
    await table.put(next);
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: id,
      ...(kind === 'book' ? { kind } : {}),
      baseRevision: s.conflict.revision,
      deleted: false,
      createdAt: Date.now(),
      setId: s.setId,
    });
  });
}

export async function takeTheirs(
  db: SaltationDb,
  id: string,
  kind: ItemKind = 'scenario',
): Promise<void> {
  const table = itemTable(db, kind);
  await db.transaction('rw', table, db.outbox, async () => {
    const s = await inConflict(db, id, kind);
    await db.outbox.where('scenarioId').equals(id).delete();
    if (s.conflict.deleted || s.conflict.document === null) {
      await table.delete(id);
      return;
    }
    const document = s.conflict.document as { name: string };
    const next: SyncedItem = {
      ...s,
      name: document.name,
      document,
      revision: s.conflict.revision,
      syncState: 'synced',
      updatedAt: Date.now(),
    };
    delete next.conflict;
    await table.put(next);
  });
}

/**
 * Mine goes into a copy (in the same set when the caller may write there; a book otherwise
 * stays on this device only), theirs stays.
 */
export async function keepBoth(
  db: SaltationDb,
  id: string,
  canWriteSet: boolean,
  kind: ItemKind = 'scenario',
): Promise<void> {
  const s = await inConflict(db, id, kind);
  const name = `${s.name} (my version)`;
  if (kind === 'scenario') {
    const mine = (s as StoredScenario).document;
    await saveCopy(db, mine, canWriteSet ? s.setId : null, name);
  } else if (canWriteSet && s.setId) {
    const mine = s.document as BookDocument;
    await saveDeskBook(db, { ...mine, id: crypto.randomUUID(), name }, s.setId);
  } else {
    await db.transaction('rw', db.sets, () => keepOnDevice(db, 'book', s, 'my version'));
  }
  await takeTheirs(db, id, kind);
}

export interface FieldDifference {
  path: string;
  mine: unknown;
  theirs: unknown;
}

/** The leaf fields where two documents differ, by dotted path (arrays compared whole). */
export function differingFields(mine: unknown, theirs: unknown, prefix = ''): FieldDifference[] {
  const isObject = (v: unknown): v is Record<string, unknown> =>
    typeof v === 'object' && v !== null && !Array.isArray(v);
  if (isObject(mine) && isObject(theirs)) {
    const keys = [...new Set([...Object.keys(mine), ...Object.keys(theirs)])].sort();
    return keys.flatMap((k) => differingFields(mine[k], theirs[k], prefix ? `${prefix}.${k}` : k));
  }
  return JSON.stringify(mine) === JSON.stringify(theirs)
    ? []
    : [{ path: prefix || '(document)', mine, theirs }];
}
