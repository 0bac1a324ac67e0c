/** A hedge replay request as JSON, shared by the Replay page, its worker and the CLI. */
import { z } from 'zod';
import { finite, optionTypeSchema, positiveUpTo, safeSeed, wholeNumber } from '../core/fields';
import { marketSchema, modelSchema } from '../core/schema';

/** The longest position a hedge replay takes, in years. */
export const MAX_REPLAY_YEARS = 2;
/** The most rebalances a replay takes (each one is a slice of the model's delta table). */
export const MAX_REPLAY_REBALANCES = 3000;

const replayExpiry = finite.refine(
  (x) => x > 0 && x <= MAX_REPLAY_YEARS,
  `must be above 0 and at most ${MAX_REPLAY_YEARS} years (the replay horizon)`,
);

const legSchema = z.object({
  type: optionTypeSchema,
  strike: positiveUpTo(1e12),
  expiry: replayExpiry,
  quantity: finite.refine(
    (q) => q !== 0 && Math.abs(q) <= 1e7,
    'must be non-zero and at most 1e7 in size',
  ),
});

export const HEDGE_METHODS = [
  'none',
  'bs-delta',
  'model-delta',
  'model-delta-gamma',
  'model-delta-vega',
] as const;

/** A hedge replay request, shared by the Replay page, its worker and the CLI. */
export const replayRequestSchema = z
  .object({
    market: marketSchema,
    model: modelSchema,
    position: z.array(legSchema).min(1, 'needs at least one leg').max(20, 'takes at most 20 legs'),
    overlay: z.array(legSchema).max(10, 'takes at most 10 options').optional(),
    hedge: z.object({
      method: z.enum(HEDGE_METHODS, {
        error: `must be ${HEDGE_METHODS.slice(0, -1).join(', ')} or ${HEDGE_METHODS.at(-1)}`,
      }),
      rebalancesPerDay: wholeNumber(1, 96),
      costBps: finite.refine((c) => c >= 0 && c <= 1000, 'must be from 0 to 1000'),
      hedgeVol: finite.refine((v) => v > 0 && v < 5, 'must be above 0 and below 5').optional(),
      instrument: z
        .object({ type: optionTypeSchema, strike: positiveUpTo(1e12), expiry: replayExpiry })
        .optional(),
    }),
    paths: wholeNumber(2, 1_000_000),
    seed: safeSeed,
  })
  .superRefine((r, ctx) => {
    const horizon = Math.max(...[...r.position, ...(r.overlay ?? [])].map((l) => l.expiry));
    const optionHedge =
      r.hedge.method === 'model-delta-gamma' || r.hedge.method === 'model-delta-vega';
    if (optionHedge && !r.hedge.instrument)
      ctx.addIssue({
        code: 'custom',
        path: ['hedge', 'instrument'],
        message: `is required for ${r.hedge.method}: the option {type, strike, expiry} to hedge with`,
      });
    if (optionHedge && r.hedge.instrument && r.hedge.instrument.expiry < horizon - 1e-10)
      ctx.addIssue({
        code: 'custom',
        path: ['hedge', 'instrument', 'expiry'],
        message: `must not be before the last leg's expiry (${(horizon * 365).toFixed(1)} days): the hedge option is held to the end`,
      });
    const rebalances = Math.max(1, Math.round(horizon * 365 * r.hedge.rebalancesPerDay));
    // the model's value and delta table holds one slice (about 54 kB) per rebalance
    if (rebalances > MAX_REPLAY_REBALANCES)
      ctx.addIssue({
        code: 'custom',
        path: ['hedge', 'rebalancesPerDay'],
        message: `gives ${rebalances} rebalances until the last expiry; at most ${MAX_REPLAY_REBALANCES} (fewer a day, or a shorter position)`,
      });
    const steps = rebalances * r.paths;
    if (steps > 5e8)
      ctx.addIssue({
        code: 'custom',
        path: ['paths'],
        message: `paths × rebalances is ${steps.toExponential(2)}; the limit is 5e8`,
      });
  });
