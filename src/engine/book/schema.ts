/** Book positions and the gap ladder as JSON, shared by the Book page, its worker and the CLI. */
import { z } from 'zod';
import { bounded, finite, positiveUpTo } from '../core/fields';
import { MAX_EXPIRY_YEARS } from '../core/schema';

/** A book position as JSON (expiry in years); the same model as the CSV upload. */
export const positionSchema = z
  .object({
    id: z.string().trim().min(1, 'must not be empty').max(100),
    type: z.enum(['call', 'put', 'underlying'], { error: 'must be call, put or underlying' }),
    strike: positiveUpTo(1e12).optional(),
    expiry: positiveUpTo(MAX_EXPIRY_YEARS).optional(),
    quantity: finite.refine(
      (q) => q !== 0 && Math.abs(q) <= 1e9,
      'must be non-zero and at most 1e9 in size',
    ),
    tradePrice: bounded(0, 1e12).optional(),
    /** units of the underlying per contract (1 when not given); value and Greeks scale by it */
    multiplier: positiveUpTo(1e6).optional(),
    /** the currency the leg is booked in (ISO 4217); totals are kept per currency */
    currency: z
      .string()
      .regex(/^[A-Z]{3}$/, 'must be a three-letter currency code such as EUR')
      .optional(),
  })
  .superRefine((p, ctx) => {
    if (p.type === 'underlying') return;
    if (p.strike === undefined)
      ctx.addIssue({ code: 'custom', path: ['strike'], message: 'is required for an option' });
    if (p.expiry === undefined)
      ctx.addIssue({ code: 'custom', path: ['expiry'], message: 'is required for an option' });
  });

/** Each position id at most once. */
function uniqueIds(ps: { id: string }[], ctx: z.RefinementCtx) {
  const seen = new Set<string>();
  ps.forEach((p, i) => {
    if (seen.has(p.id))
      ctx.addIssue({
        code: 'custom',
        path: [i, 'id'],
        message: `"${p.id}" appears more than once`,
      });
    seen.add(p.id);
  });
}

export const positionsSchema = z
  .array(positionSchema)
  .min(1, 'needs at least one position')
  .max(20000, 'at most 20000 positions')
  .superRefine(uniqueIds);

/** A book's positions as stored: may be empty (a book starts with none). */
export const bookPositionsSchema = z
  .array(positionSchema)
  .max(20000, 'at most 20000 positions')
  .superRefine(uniqueIds);

export const ladderSchema = z
  .object({
    from: bounded(-0.99, 10),
    to: bounded(-0.99, 10),
    steps: finite.refine(
      (n) => Number.isInteger(n) && n >= 1 && n <= 401,
      'must be a whole number from 1 to 401',
    ),
  })
  .refine((l) => l.to >= l.from, { message: 'to must not be below from', path: ['to'] });

/** A position of the book: an option leg or a holding of the underlying. */
export type Position = z.infer<typeof positionSchema>;
export type PositionType = Position['type'];

/** A wing-hedge request's choices: 1 to 8 options, a premium budget, the down moves covered. */
export const wingHedgeSchema = z
  .object({
    instruments: z
      .array(
        z.object({
          type: z.enum(['call', 'put'], { error: 'must be call or put' }),
          strike: positiveUpTo(1e12),
          expiry: positiveUpTo(MAX_EXPIRY_YEARS),
        }),
      )
      .min(1, 'needs at least one option to choose from')
      .max(8, 'takes at most 8 options'),
    budget: bounded(0, 1e12),
    from: bounded(-0.99, 0).optional(),
    to: bounded(-0.99, 0).optional(),
    steps: finite
      .refine(
        (n) => Number.isInteger(n) && n >= 2 && n <= 201,
        'must be a whole number from 2 to 201',
      )
      .optional(),
  })
  .refine((w) => (w.to ?? -0.05) > (w.from ?? -0.3), {
    message: 'to must be above from',
    path: ['to'],
  });
