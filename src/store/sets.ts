/** Local scenario sets and their books. */
import type { Position } from '../engine/book';
import type { LocalScenarioSet, SaltationDb } from './db';

export function listSets(db: SaltationDb): Promise<LocalScenarioSet[]> {
  return db.sets.orderBy('name').toArray();
}

export async function createSet(
  db: SaltationDb,
  name: string,
  scenarioIds: string[],
): Promise<LocalScenarioSet> {
  const trimmed = name.trim();
  if (!trimmed) throw new Error('Give the set a name.');
  const set: LocalScenarioSet = {
    id: crypto.randomUUID(),
    name: trimmed,
    scenarioIds,
    baseScenarioId: scenarioIds[0] ?? null,
    positions: [],
    updatedAt: Date.now(),
  };
  await db.sets.add(set);
  return set;
}

export async function updateSet(
  db: SaltationDb,
  id: string,
  change: Partial<Pick<LocalScenarioSet, 'name' | 'scenarioIds' | 'baseScenarioId' | 'positions'>>,
): Promise<void> {
  await db.sets.update(id, { ...change, updatedAt: Date.now() });
}

export function setPositions(db: SaltationDb, id: string, positions: Position[]): Promise<void> {
  return updateSet(db, id, { positions });
}

export async function deleteSet(db: SaltationDb, id: string): Promise<void> {
  await db.sets.delete(id);
}
