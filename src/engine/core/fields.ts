/** Number fields for the zod schemas of every layer, with the product's refusal wording. */
import { z } from 'zod';
import { domainMessage, inDomain, type Domain } from './parameters';

// A missing field reads "is required" rather than zod's type message.
z.config({
  customError: (issue) =>
    issue.code === 'invalid_type' && issue.input === undefined ? 'is required' : undefined,
});

export const finite = z
  .number({ error: 'must be a number' })
  .refine(Number.isFinite, 'must be finite');

export const bounded = (lo: number, hi: number, what = '') =>
  finite.refine((x) => x >= lo && x <= hi, `must be between ${lo} and ${hi}${what}`);

export const positiveUpTo = (hi: number) =>
  finite.refine((x) => x > 0 && x <= hi, `must be above 0 and at most ${hi}`);

export const inDomainOf = (d: Domain) => finite.refine((x) => inDomain(x, d), domainMessage(d));

export const wholeNumber = (lo: number, hi: number) =>
  finite.refine(
    (n) => Number.isInteger(n) && n >= lo && n <= hi,
    `must be a whole number from ${lo} to ${hi}`,
  );

export const safeSeed = finite.refine(
  (n) => Number.isSafeInteger(n),
  'must be a whole number (a safe integer)',
);

export const optionTypeSchema = z.enum(['call', 'put'], { error: 'must be "call" or "put"' });
