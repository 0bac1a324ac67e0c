/** Puts the demo desk's scenarios on a device once, the first time the app opens there. */
import { appDb } from './db';
import { demoScenarios } from './demo-scenarios';
import { saveScenario } from './scenarios';

const FLAG = 'saltation.demo-scenarios';

export async function seedDemoScenariosOnce(): Promise<boolean> {
  if (localStorage.getItem(FLAG)) return false;
  const db = appDb();
  if ((await db.scenarios.count()) === 0) {
    const today = new Date().toISOString().slice(0, 10);
    for (const d of [...demoScenarios(today)].reverse()) await saveScenario(db, d);
  }
  localStorage.setItem(FLAG, 'seeded');
  return true;
}
