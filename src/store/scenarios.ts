/** Scenario persistence: each save writes the scenario and its outbox entry in one transaction. */
import { type ScenarioDocument, parseScenario } from '../engine/core';
import type { SaltationDb, StoredScenario } from './db';

export class ScenarioValidationError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(`${path}: ${message}`);
  }
}

export async function saveScenario(
  db: SaltationDb,
  document: ScenarioDocument,
  setId: string | null = null,
): Promise<StoredScenario> {
  const parsed = parseScenario(document);
  if (!parsed.ok)
    throw new ScenarioValidationError(parsed.issues[0].path, parsed.issues[0].message);
  return db.transaction('rw', db.scenarios, db.outbox, async () => {
    const existing = await db.scenarios.get(document.id);
    const revision = existing?.revision ?? 0;
    const inSet = existing ? existing.setId : setId;
    const stored: StoredScenario = {
      ...existing,
      id: document.id,
      name: document.name,
      document: parsed.value,
      setId: inSet,
      revision,
      // an edit made during a conflict stays in the conflict until the user resolves it
      syncState:
        existing?.syncState === 'conflict' ? 'conflict' : inSet === null ? 'local' : 'pending',
      updatedAt: Date.now(),
    };
    delete stored.syncError;
    await db.scenarios.put(stored);
    // one entry per scenario: the newest edit stands for all before it (the push sends the
    // scenario's current document on top of the revision it started from)
    await db.outbox.where('scenarioId').equals(document.id).delete();
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: document.id,
      baseRevision: revision,
      deleted: false,
      createdAt: Date.now(),
      setId: inSet,
    });
    return stored;
  });
}

export function listScenarios(db: SaltationDb): Promise<StoredScenario[]> {
  return db.scenarios.orderBy('updatedAt').reverse().toArray();
}

export function getScenario(db: SaltationDb, id: string): Promise<StoredScenario | undefined> {
  return db.scenarios.get(id);
}

export async function deleteScenario(db: SaltationDb, id: string): Promise<void> {
  await db.transaction('rw', db.scenarios, db.outbox, async () => {
    const existing = await db.scenarios.get(id);
    if (!existing) return;
    await db.scenarios.delete(id);
    await db.outbox.where('scenarioId').equals(id).delete();
    if (existing.revision > 0) {
      await db.outbox.add({
        mutationId: crypto.randomUUID(),
        scenarioId: id,
        baseRevision: existing.revision,
        deleted: true,
        createdAt: Date.now(),
        setId: existing.setId,
      });
    }
  });
}

/** Shares a device-only scenario by putting it in a set of the service (pushed on next sync). */
export async function putInSet(db: SaltationDb, id: string, setId: string): Promise<void> {
  await db.transaction('rw', db.scenarios, db.outbox, async () => {
    const s = await db.scenarios.get(id);
    if (!s) throw new Error('That scenario is not on this device.');
    if (s.setId !== null)
      throw new Error('That scenario is in a set already; save a copy instead.');
    await db.scenarios.put({ ...s, setId, syncState: 'pending', updatedAt: Date.now() });
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: id,
      baseRevision: 0,
      deleted: false,
      createdAt: Date.now(),
      setId,
    });
  });
}

/** A copy under a new id, in the given set (null: this device only). */
export async function saveCopy(
  db: SaltationDb,
  document: ScenarioDocument,
  setId: string | null,
  name = `${document.name} (copy)`,
): Promise<StoredScenario> {
  return saveScenario(db, { ...document, id: crypto.randomUUID(), name }, setId);
}
