/**
 * Scenario files: a saltation/scenario@1 document, or a JSON array of them. Import validates
 * each one with the shared validator and names the bad field; export writes the same format.
 */
import { type ScenarioDocument, parseScenario } from '../engine/core';

export type ImportResult =
  { ok: true; documents: ScenarioDocument[] } | { ok: false; error: string };

export function parseScenarioFile(text: string): ImportResult {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { ok: false, error: `not JSON: ${(e as Error).message}` };
  }
  const items = Array.isArray(json) ? json : [json];
  if (items.length === 0) return { ok: false, error: 'the file holds no scenarios' };
  const documents: ScenarioDocument[] = [];
  for (const [i, item] of items.entries()) {
    const r = parseScenario(item);
    if (!r.ok) {
      const where = Array.isArray(json) ? `[${i}].` : '';
      return { ok: false, error: `${where}${r.issues[0].path}: ${r.issues[0].message}` };
    }
    documents.push(r.value);
  }
  return { ok: true, documents };
}

export function scenarioFileText(documents: ScenarioDocument[]): string {
  return JSON.stringify(documents.length === 1 ? documents[0] : documents, null, 2) + '\n';
}

export const scenarioFileName = (name: string) =>
  `${name.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '') || 'scenario'}.saltation.json`;
