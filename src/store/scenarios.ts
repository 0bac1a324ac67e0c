/** Scenario persistence: each save writes the scenario and its outbox entry in one transaction. */
import type { ScenarioDocument } from '../engine/schema';
import { parseScenario } from '../engine/validate-model';
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
    const stored: StoredScenario = {
      id: document.id,
      name: document.name,
      document: parsed.value,
      setId: existing?.setId ?? setId,
      revision,
      syncState: revision === 0 ? 'local' : 'pending',
      updatedAt: Date.now(),
    };
    await db.scenarios.put(stored);
    await db.outbox.add({
      mutationId: crypto.randomUUID(),
      scenarioId: document.id,
      baseRevision: revision,
      deleted: false,
      createdAt: Date.now(),
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
    if (existing.revision > 0) {
      await db.outbox.add({
        mutationId: crypto.randomUUID(),
        scenarioId: id,
        baseRevision: existing.revision,
        deleted: true,
        createdAt: Date.now(),
      });
    } else {
      await db.outbox.where('scenarioId').equals(id).delete();
    }
  });
}
