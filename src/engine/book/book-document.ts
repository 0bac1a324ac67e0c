/**
 * A book of positions as a document: what a device keeps and what a desk's set holds on the
 * sync service. It names the scenarios it is revalued under and the one that is its base.
 */
import { z } from 'zod';
import { bookPositionsSchema } from './schema';
import { zodIssues, type Validated } from '../core/validate';

export const BOOK_FORMAT = 'saltation.book/1';

const uuid = z.string().uuid('must be a UUID');

export const bookDocumentSchema = z.looseObject({
  format: z.literal(BOOK_FORMAT, { error: `must be "${BOOK_FORMAT}"` }),
  id: uuid,
  name: z.string().trim().min(1, 'must not be empty').max(200, 'at most 200 characters'),
  scenarioIds: z.array(uuid).max(500, 'at most 500 scenarios'),
  /** the scenario whose unstressed parameters are the book's base */
  baseScenarioId: uuid.nullable(),
  positions: bookPositionsSchema,
});

export type BookDocument = z.infer<typeof bookDocumentSchema>;

export function parseBook(doc: unknown): Validated<BookDocument> {
  if (doc === null || typeof doc !== 'object' || Array.isArray(doc)) {
    return { ok: false, issues: [{ path: '(document)', message: 'must be a JSON object' }] };
  }
  const r = bookDocumentSchema.safeParse(doc);
  return r.success ? { ok: true, value: r.data } : { ok: false, issues: zodIssues(r.error) };
}
