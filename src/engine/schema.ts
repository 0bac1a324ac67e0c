/**
 * The scenario document `saltation/scenario@1` and its parts, as zod schemas shared by the
 * browser, the sync service and the command line. Objects are loose: unknown fields are
 * kept on a round trip. Bounds are the model's domain (where its formulas hold) plus generous
 * practical limits that keep every number finite.
 */
import { z } from 'zod';
import type { Stress } from './stress';
import type { Market, Model } from './types';

export const SCENARIO_FORMAT = 'saltation/scenario@1';

// A missing field reads "is required" rather than zod's type message.
z.config({
  customError: (issue) =>
    issue.code === 'invalid_type' && issue.input === undefined ? 'is required' : undefined,
});

const finite = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be finite');
const bounded = (lo: number, hi: number, what = '') =>
  finite.refine((x) => x >= lo && x <= hi, `must be between ${lo} and ${hi}${what}`);
const positiveUpTo = (hi: number) =>
  finite.refine((x) => x > 0 && x <= hi, `must be above 0 and at most ${hi}`);

const curve = z
  .array(z.tuple([bounded(0, 100), bounded(-1, 1)]), { error: 'must be a list of [t, rate] pairs' })
  .min(1, 'needs at least one [t, rate] pair')
  .refine(
    (pts) => pts.every((p, i) => i === 0 || p[0] > pts[i - 1][0]),
    'times must be strictly increasing',
  );

export const marketSchema = z.looseObject({
  spot: positiveUpTo(1e9),
  rate: bounded(-1, 1).optional(),
  dividendYield: bounded(-1, 1).optional(),
  rateCurve: curve.optional(),
  dividendCurve: curve.optional(),
});

const hestonFields = {
  v0: bounded(0, 5),
  kappa: positiveUpTo(100),
  theta: positiveUpTo(5),
  volOfVol: bounded(0, 10),
  rho: bounded(-1, 1),
};
const lognormalJumpFields = {
  jumpIntensity: bounded(0, 1000),
  jumpMean: bounded(-5, 5),
  jumpStdev: bounded(0, 5),
};

export const modelSchema = z.discriminatedUnion(
  'kind',
  [
    z.looseObject({ kind: z.literal('black-scholes'), sigma: positiveUpTo(5) }),
    z.looseObject({ kind: z.literal('heston'), ...hestonFields }),
    z.looseObject({ kind: z.literal('merton'), sigma: positiveUpTo(5), ...lognormalJumpFields }),
    z.looseObject({ kind: z.literal('bates'), ...hestonFields, ...lognormalJumpFields }),
    z.looseObject({
      kind: z.literal('heston-kou'),
      ...hestonFields,
      jumpIntensity: bounded(0, 1000),
      upProbability: bounded(0, 1),
      upMean: finite.refine((x) => x >= 0 && x < 1, 'must be at least 0 and below 1 (η1 > 1)'),
      downMean: bounded(0, 5),
    }),
  ],
  { error: 'must be one of black-scholes, heston, merton, bates, heston-kou' },
);

export const stressSchema = z.looseObject({
  jumpIntensityScale: bounded(0, 100).optional(),
  jumpMeanShift: bounded(-5, 5).optional(),
  jumpStdevScale: bounded(0, 100).optional(),
  spotShift: bounded(-0.99, 10).optional(),
  volOfVolScale: bounded(0, 100).optional(),
  v0Scale: bounded(0, 100).optional(),
});

export const MAX_EXPIRY_YEARS = 50;

export const gridSchema = z.looseObject({
  expiries: z
    .array(positiveUpTo(MAX_EXPIRY_YEARS), { error: 'must be a list of year fractions' })
    .min(1, 'needs at least one expiry')
    .max(64, 'at most 64 expiries'),
  moneyness: z
    .array(bounded(-5, 5), { error: 'must be a list of log-moneyness values' })
    .min(1, 'needs at least one point')
    .max(401, 'at most 401 points'),
});

export const scenarioSchema = z.looseObject({
  format: z.literal(SCENARIO_FORMAT, { error: `must be "${SCENARIO_FORMAT}"` }),
  id: z.string().min(1, 'must not be empty').max(100),
  name: z.string().trim().min(1, 'must not be empty').max(200, 'at most 200 characters'),
  notes: z.string().max(20000).optional(),
  valuationDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD'),
  market: marketSchema,
  model: modelSchema,
  stress: stressSchema.optional(),
  grid: gridSchema,
  runs: z.array(z.looseObject({})).optional(),
});

/** A validated scenario document; unknown fields ride along untouched. */
export interface ScenarioDocument {
  format: typeof SCENARIO_FORMAT;
  id: string;
  name: string;
  notes?: string;
  valuationDate: string;
  market: Market;
  model: Model;
  stress?: Partial<Stress>;
  grid: { expiries: number[]; moneyness: number[]; [key: string]: unknown };
  runs?: Record<string, unknown>[];
  [key: string]: unknown;
}

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
  })
  .superRefine((p, ctx) => {
    if (p.type === 'underlying') return;
    if (p.strike === undefined)
      ctx.addIssue({ code: 'custom', path: ['strike'], message: 'is required for an option' });
    if (p.expiry === undefined)
      ctx.addIssue({ code: 'custom', path: ['expiry'], message: 'is required for an option' });
  });

export const positionsSchema = z
  .array(positionSchema)
  .min(1, 'needs at least one position')
  .max(20000, 'at most 20000 positions')
  .superRefine((ps, ctx) => {
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
  });

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

const wholeNumber = (lo: number, hi: number) =>
  finite.refine(
    (n) => Number.isInteger(n) && n >= lo && n <= hi,
    `must be a whole number from ${lo} to ${hi}`,
  );

/** Monte Carlo settings, shared by the Paths page, its worker and the CLI. */
export const simulationSettingsSchema = z
  .object({
    horizon: positiveUpTo(30),
    stepsPerYear: wholeNumber(1, 100000),
    paths: wholeNumber(2, 10_000_000),
    seed: finite.refine((n) => Number.isSafeInteger(n), 'must be a whole number (a safe integer)'),
    antithetic: z.boolean().optional(),
    scheme: z.enum(['qe', 'euler'], { error: 'must be "qe" or "euler"' }).optional(),
    options: z
      .array(
        z.object({
          type: z.enum(['call', 'put'], { error: 'must be "call" or "put"' }),
          strike: positiveUpTo(1e12),
          expiry: positiveUpTo(30),
        }),
      )
      .max(200)
      .optional(),
  })
  .superRefine((s, ctx) => {
    const steps = Math.max(1, Math.round(s.horizon * s.stepsPerYear)) * s.paths;
    if (steps > 2e9)
      ctx.addIssue({
        code: 'custom',
        path: ['paths'],
        message: `paths × steps is ${steps.toExponential(2)}; the limit is 2e9 (about ${Math.round(steps / 25e6)} s of work)`,
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

/** The longest position a hedge replay takes, in years. */
export const MAX_REPLAY_YEARS = 2;
/** The most rebalances a replay takes (each one is a slice of the model's delta table). */
export const MAX_REPLAY_REBALANCES = 3000;

/** A hedge replay request, shared by the Replay page, its worker and the CLI. */
export const replayRequestSchema = z
  .object({
    market: marketSchema,
    model: modelSchema,
    position: z
      .array(
        z.object({
          type: z.enum(['call', 'put'], { error: 'must be "call" or "put"' }),
          strike: positiveUpTo(1e12),
          expiry: finite.refine(
            (x) => x > 0 && x <= MAX_REPLAY_YEARS,
            `must be above 0 and at most ${MAX_REPLAY_YEARS} years (the replay horizon)`,
          ),
          quantity: finite.refine(
            (q) => q !== 0 && Math.abs(q) <= 1e7,
            'must be non-zero and at most 1e7 in size',
          ),
        }),
      )
      .min(1, 'needs at least one leg')
      .max(20, 'takes at most 20 legs'),
    hedge: z.object({
      method: z.enum(['none', 'bs-delta', 'model-delta'], {
        error: 'must be none, bs-delta or model-delta',
      }),
      rebalancesPerDay: wholeNumber(1, 96),
      costBps: finite.refine((c) => c >= 0 && c <= 1000, 'must be from 0 to 1000'),
      hedgeVol: finite.refine((v) => v > 0 && v < 5, 'must be above 0 and below 5').optional(),
    }),
    paths: wholeNumber(2, 1_000_000),
    seed: finite.refine((n) => Number.isSafeInteger(n), 'must be a whole number (a safe integer)'),
  })
  .superRefine((r, ctx) => {
    const horizon = Math.max(...r.position.map((l) => l.expiry));
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
