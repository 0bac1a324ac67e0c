/** Monte Carlo settings as JSON, shared by the Paths page, its worker and the CLI. */
import { z } from 'zod';
import { optionTypeSchema, positiveUpTo, safeSeed, wholeNumber } from '../core/fields';

/** The most path-steps (paths × steps) one simulation takes. */
export const MAX_PATH_STEPS = 2e9;

/** Monte Carlo settings, shared by the Paths page, its worker and the CLI. */
export const simulationSettingsSchema = z
  .object({
    horizon: positiveUpTo(30),
    stepsPerYear: wholeNumber(1, 100000),
    paths: wholeNumber(2, 10_000_000),
    seed: safeSeed,
    antithetic: z.boolean().optional(),
    scheme: z.enum(['qe', 'euler'], { error: 'must be "qe" or "euler"' }).optional(),
    options: z
      .array(
        z.object({
          type: optionTypeSchema,
          strike: positiveUpTo(1e12),
          expiry: positiveUpTo(30),
        }),
      )
      .max(200)
      .optional(),
  })
  .superRefine((s, ctx) => {
    const steps = Math.max(1, Math.round(s.horizon * s.stepsPerYear)) * s.paths;
    if (steps > MAX_PATH_STEPS)
      ctx.addIssue({
        code: 'custom',
        path: ['paths'],
        message: `paths × steps is ${steps.toExponential(2)}; the limit is ${MAX_PATH_STEPS.toExponential(0).replace('+', '')} (about ${Math.round(steps / 25e6)} s of work)`,
      });
    (s.options ?? []).forEach((o, i) => {
      if (o.expiry > s.horizon + 1e-12)
        ctx.addIssue({
          code: 'custom',
          path: ['options', i, 'expiry'],
          message: 'is beyond the simulation horizon',
        });
    });
  });
