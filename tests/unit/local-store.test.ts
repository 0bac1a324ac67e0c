import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { newScenario } from '../../src/engine/core';
import { SaltationDb } from '../../src/store/db';
import {
  deleteScenario,
  listScenarios,
  saveScenario,
  ScenarioValidationError,
} from '../../src/store/scenarios';

const freshDb = () => new SaltationDb(`test-${Math.random().toString(36).slice(2)}`);

describe('the local scenario store', () => {
  it('writes the scenario and its outbox entry together, and a second save replaces the entry', async () => {
    const db = freshDb();
    const doc = newScenario('a5b1c2d3-0000-4000-8000-000000000001', 'Local one', '2026-12-01');
    await saveScenario(db, doc);
    await saveScenario(db, { ...doc, name: 'Local one, edited' });
    const all = await listScenarios(db);
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({ name: 'Local one, edited', syncState: 'local', revision: 0 });
    const entries = await db.outbox.where('scenarioId').equals(doc.id).toArray();
    expect(entries).toHaveLength(1);
    expect(entries[0].deleted).toBe(false);
    db.close();
  });

  it('refuses an invalid document and writes nothing', async () => {
    const db = freshDb();
    const doc = newScenario('a5b1c2d3-0000-4000-8000-000000000002', 'Bad one', '2026-12-01');
    await expect(saveScenario(db, { ...doc, market: { spot: 0 } })).rejects.toBeInstanceOf(
      ScenarioValidationError,
    );
    expect(await db.scenarios.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    db.close();
  });

  it('deleting a never-pushed scenario leaves nothing in the outbox', async () => {
    const db = freshDb();
    const doc = newScenario('a5b1c2d3-0000-4000-8000-000000000003', 'Short-lived', '2026-12-01');
    await saveScenario(db, doc);
    await deleteScenario(db, doc.id);
    expect(await db.scenarios.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    db.close();
  });
});
