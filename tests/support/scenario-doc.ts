/** Scenario documents for API tests: the default scenario under a given id and name. */
import { newScenario, type ScenarioDocument } from '../../src/engine/core';

export const scenarioDoc = (id: string, name = 'Test scenario', notes = ''): ScenarioDocument => ({
  ...newScenario(id, name, '2026-12-02'),
  notes,
});
