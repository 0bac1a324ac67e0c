/** `npm run snapshot:cli`: records the CLI's answers to `requests.json` into `snapshot.json`. */
import { writeFileSync } from 'node:fs';
import { runAll } from './cli-outputs';

const outcomes = await runAll();
writeFileSync(
  new URL('./snapshot.json', import.meta.url),
  JSON.stringify(outcomes, null, 1) + '\n',
);
console.log(`recorded ${outcomes.length} answers`);
