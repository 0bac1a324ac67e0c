/** Validation results in one shape everywhere: the path of the bad field and a reason. */
import type { z } from 'zod';
import { modelSchema, scenarioSchema, type ScenarioDocument } from './schema';

export interface FieldIssue {
  path: string;
  message: string;
}

/** A bad row of an uploaded file: its 1-based line (the header is line 1), field and reason. */
export interface RowIssue {
  line: number;
  field: string;
  message: string;
}

export function zodIssues(error: z.ZodError, prefix = ''): FieldIssue[] {
  return error.issues.map((i) => {
    const path = [prefix, ...i.path.map(String)].filter((p) => p !== '').join('.');
    return { path: path || '(document)', message: i.message };
  });
}

export type Validated<T> = { ok: true; value: T } | { ok: false; issues: FieldIssue[] };

export function validateModel(model: unknown): FieldIssue[] {
  const r = modelSchema.safeParse(model);
  return r.success ? [] : zodIssues(r.error);
}

export function parseScenario(doc: unknown): Validated<ScenarioDocument> {
  if (doc === null || typeof doc !== 'object' || Array.isArray(doc)) {
    return { ok: false, issues: [{ path: '(document)', message: 'must be a JSON object' }] };
  }
  const r = scenarioSchema.safeParse(doc);
  return r.success ? { ok: true, value: r.data } : { ok: false, issues: zodIssues(r.error) };
}
