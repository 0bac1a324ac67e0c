/**
 * Resolving a conflict between this device's edit and the server's revision: keep mine (put my
 * document on top of the server's revision), take theirs, or keep both (mine becomes a copy).
 */
import type { ScenarioDocument } from '../engine/core';
import type { SaltationDb, StoredScenario } from '../store/db';
import { saveCopy } from '../store/scenarios';

async function inConflict(db: SaltationDb, id: string) {
  const s = await db.scenarios.get(id);
  if (!s?.conflict) throw new Error('That scenario has no conflict to resolve.');
  return s as StoredScenario & { conflict: NonNullable<StoredScenario['conflict']> };
}

export async function keepMine(db: SaltationDb, id: string): Promise<void> {
  await db.transaction('rw', db.scenarios, db.outbox, async () => {
    const s = await inConflict(db, id);
    const next: StoredScenario = { ...s, revision: s.conflict.revision, syncState: 'pending' };
    delete next.conflict;
    await db.scenarios.put(next);
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: id,
      baseRevision: s.conflict.revision,
      deleted: false,
      createdAt: Date.now(),
      setId: s.setId,
    });
  });
}

export async function takeTheirs(db: SaltationDb, id: string): Promise<void> {
  await db.transaction('rw', db.scenarios, db.outbox, async () => {
    const s = await inConflict(db, id);
    await db.outbox.where('scenarioId').equals(id).delete();
    if (s.conflict.deleted || s.conflict.document === null) {
      await db.scenarios.delete(id);
      return;
    }
    const document = s.conflict.document as ScenarioDocument;
    const next: StoredScenario = {
      ...s,
      name: document.name,
      document,
      revision: s.conflict.revision,
      syncState: 'synced',
      updatedAt: Date.now(),
    };
    delete next.conflict;
    await db.scenarios.put(next);
  });
}

/** Mine goes into a copy (in the same set when the caller may write there), theirs stays. */
export async function keepBoth(db: SaltationDb, id: string, canWriteSet: boolean): Promise<void> {
  const s = await inConflict(db, id);
  await saveCopy(db, s.document, canWriteSet ? s.setId : null, `${s.name} (my version)`);
  await takeTheirs(db, id);
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
