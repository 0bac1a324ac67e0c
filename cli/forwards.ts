/** `forwards`: each expiry's forward and discount read off a chain by put–call parity. */
import { z } from 'zod';
import { MAX_EXPIRY_YEARS } from '../src/engine/core';
import { chainForwards } from '../src/engine/fit';
import { CliError } from './io';

const positive = z.number().refine((x) => Number.isFinite(x) && x > 0, 'must be a positive number');
const nonNegative = z
  .number()
  .refine((x) => Number.isFinite(x) && x >= 0, 'must be a number of at least 0');

const forwardsRequest = z.object({
  quotes: z
    .array(
      z.object({
        expiry: positive.refine((x) => x <= MAX_EXPIRY_YEARS, `at most ${MAX_EXPIRY_YEARS} years`),
        strike: positive,
        type: z.enum(['call', 'put'], { error: 'must be "call" or "put"' }),
        bid: nonNegative,
        ask: nonNegative,
      }),
    )
    .min(1, 'needs at least one quote')
    .max(20000, 'at most 20,000 quotes'),
  rate: z
    .number()
    .refine((x) => Number.isFinite(x) && x >= -1 && x <= 1, 'must be between -1 and 1')
    .optional(),
});

export function forwards(request: unknown) {
  const r = forwardsRequest.safeParse(request);
  if (!r.success) {
    const issue = r.error.issues[0];
    const path = issue.path.map(String).join('.') || '(request)';
    throw new CliError('invalid-input', `${path}: ${issue.message}`, path);
  }
  const started = performance.now();
  const expiries = chainForwards(r.data.quotes, r.data.rate);
  return { expiries, elapsedMs: performance.now() - started };
}
