/**
 * Puts the demo desk's scenarios on a device once, the first time the app opens there, and the
 * demo book on the demo index's scenarios, so that a first visit shows the product working.
 */
import { demoBookPositions } from './demo-book';
import { appDb } from './db';
import { demoScenarios } from './demo-scenarios';
import { saveScenario } from './scenarios';

const FLAG = 'saltation.demo-scenarios';
const BOOK_FLAG = 'saltation.demo-book';
export const DEMO_BOOK_NAME = 'LKX 40 demo book (invented)';

let seeding: Promise<boolean> | null = null;

/** The demo scenarios, once; callers at the same moment (the shell and Sketch) share one run. */
export function seedDemoScenariosOnce(): Promise<boolean> {
  seeding ??= seedScenarios().finally(() => (seeding = null));
  return seeding;
}

async function seedScenarios(): Promise<boolean> {
  if (localStorage.getItem(FLAG)) return false;
  const db = appDb();
  if ((await db.scenarios.count()) === 0) {
    const today = new Date().toISOString().slice(0, 10);
    for (const d of [...demoScenarios(today)].reverse()) await saveScenario(db, d);
  }
  localStorage.setItem(FLAG, 'seeded');
  return true;
}

/** The demo book, once, on a device that has no book yet and still has the index scenarios. */
export async function seedDemoBookOnce(): Promise<boolean> {
  if (localStorage.getItem(BOOK_FLAG)) return false;
  const db = appDb();
  const index = demoScenarios('2026-01-01')
    .filter((d) => d.name.startsWith('LKX 40'))
    .map((d) => d.id);
  const present = (await db.scenarios.bulkGet(index)).filter(Boolean).length === index.length;
  if ((await db.sets.count()) === 0 && present) {
    await db.sets.add({
      id: crypto.randomUUID(),
      name: DEMO_BOOK_NAME,
      scenarioIds: index,
      baseScenarioId: index[0],
      positions: demoBookPositions(),
      updatedAt: Date.now(),
    });
  }
  localStorage.setItem(BOOK_FLAG, 'seeded');
  return true;
}
