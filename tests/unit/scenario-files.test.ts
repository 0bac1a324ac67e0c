import { describe, expect, it } from 'vitest';
import { newScenario } from '../../src/engine/core';
import {
  parseScenarioFile,
  scenarioFileName,
  scenarioFileText,
} from '../../src/store/scenario-files';

const doc = newScenario(
  '55555555-5555-4555-8555-555555555555',
  'Weekly crash ladder',
  '2026-12-02',
);

describe('scenario files (the saltation/scenario@1 format of src/engine/core/schema.ts)', () => {
  it('round-trips one scenario and a list, keeping unknown fields', () => {
    const one = parseScenarioFile(scenarioFileText([{ ...doc, deskTag: 'kept' } as typeof doc]));
    expect(one).toMatchObject({
      ok: true,
      documents: [{ name: 'Weekly crash ladder', deskTag: 'kept' }],
    });
    const two = parseScenarioFile(scenarioFileText([doc, { ...doc, name: 'Second' }]));
    expect(two.ok && two.documents.map((d) => d.name)).toEqual(['Weekly crash ladder', 'Second']);
    expect(scenarioFileName('Weekly crash / ladder')).toBe('Weekly-crash-ladder.saltation.json');
  });

  it('refuses a bad file with the path of the bad field', () => {
    expect(parseScenarioFile('{ not json')).toMatchObject({
      ok: false,
      error: expect.stringMatching(/^not JSON/),
    });
    const bad = parseScenarioFile(JSON.stringify({ ...doc, market: { ...doc.market, spot: -1 } }));
    expect(bad).toMatchObject({ ok: false, error: expect.stringMatching(/^market\.spot: /) });
    const inList = parseScenarioFile(
      JSON.stringify([doc, { ...doc, model: { kind: 'nonsense' } }]),
    );
    expect(inList).toMatchObject({ ok: false, error: expect.stringMatching(/^\[1\]\.model/) });
    expect(parseScenarioFile('[]')).toEqual({ ok: false, error: 'the file holds no scenarios' });
  });
});
