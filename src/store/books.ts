/** The device-only books: named groups of local scenarios with the positions they revalue. */
import type { LocalBook, SaltationDb } from './db';

export function listBooks(db: SaltationDb): Promise<LocalBook[]> {
  return db.sets.orderBy('name').toArray();
}

export async function createBook(
  db: SaltationDb,
  name: string,
  scenarioIds: string[],
): Promise<LocalBook> {
  const trimmed = name.trim();
  if (!trimmed) throw new Error('Give the set a name.');
  const set: LocalBook = {
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

export async function updateBook(
  db: SaltationDb,
  id: string,
  change: Partial<Pick<LocalBook, 'name' | 'scenarioIds' | 'baseScenarioId' | 'positions'>>,
): Promise<void> {
  await db.sets.update(id, { ...change, updatedAt: Date.now() });
}
