/**
 * The command line answers a fixed set of requests (every command, every model kind, and the
 * refusals) exactly as the committed snapshot says, to the last bit of every number. The
 * snapshot was recorded before the engine was reorganised into layers; a change here is a
 * change of behaviour and needs `ENGINE_VERSION` bumped and the snapshot recorded again
 * (`npm run snapshot:cli`).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runAll, type CliOutcome } from '../cli-snapshot/cli-outputs';

const snapshot: CliOutcome[] = JSON.parse(
  readFileSync(new URL('../cli-snapshot/snapshot.json', import.meta.url), 'utf8'),
);

describe('the command line against its recorded answers', () => {
  it('answers every recorded request identically apart from elapsedMs', async () => {
    const outcomes = await runAll();
    expect(outcomes.map((o) => o.name)).toEqual(snapshot.map((o) => o.name));
    for (const [i, outcome] of outcomes.entries()) {
      // stringify compares numbers by their shortest round-trip form: bit for bit
      expect(JSON.stringify(outcome), outcome.name).toBe(JSON.stringify(snapshot[i]));
    }
  }, 240_000);

  it('covers every command and every model kind', () => {
    const requests = snapshot.map((o) => o.name);
    for (const command of ['price', 'smile', 'revalue', 'calibrate', 'simulate', 'replay'])
      expect(requests.some((n) => n.startsWith(command))).toBe(true);
    expect(snapshot.filter((o) => o.exit === 2).length).toBeGreaterThanOrEqual(4);
  });
});
