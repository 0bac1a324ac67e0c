/**
 * The scenario document `saltation/scenario@1` and its parts, as zod schemas shared by the
 * browser, the sync service and the command line; the types are derived from them. Objects
 * are loose: unknown fields are kept on a round trip. Bounds are the model's domain (where its
 * formulas hold, from the parameter table) plus generous practical limits that keep every
 * number finite.
 */
import { z } from 'zod';
import { isoDateSchema } from './dates';
import { bounded, inDomainOf, positiveUpTo } from './fields';
import {
  MODEL_KINDS,
  modelEntry,
  parametersOf,
  type ModelKind,
  type ParametersOf,
} from './model-registry';
import { PARAMETER_SPECS } from './parameters';
import { eventsSchema, intensityScheduleSchema } from './scheduled-moves';
import type { StressField } from './stress-fields';

export const SCENARIO_FORMAT = 'saltation/scenario@1';

const curve = z
  .array(z.tuple([bounded(0, 100), bounded(-1, 1)]), { error: 'must be a list of [t, rate] pairs' })
  .min(1, 'needs at least one [t, rate] pair')
  .refine(
    (pts) => pts.every((p, i) => i === 0 || p[0] > pts[i - 1][0]),
    'times must be strictly increasing',
  );

export const marketSchema = z.looseObject({
  /** the underlying's name: a book never adds up P&L of scenarios on different underlyings */
  underlying: z
    .string()
    .trim()
    .min(1, 'must not be empty')
    .max(60, 'at most 60 characters')
    .optional(),
  /** the currency prices are quoted in (ISO 4217) */
  currency: z
    .string()
    .regex(/^[A-Z]{3}$/, 'must be a three-letter currency code such as EUR')
    .optional(),
  spot: positiveUpTo(1e9),
  rate: bounded(-1, 1).optional(),
  dividendYield: bounded(-1, 1).optional(),
  rateCurve: curve.optional(),
  dividendCurve: curve.optional(),
});

/** Dated risk any kind may carry: scheduled moves, and (kinds with jumps) an intensity schedule. */
interface DatedFields {
  events: z.ZodOptional<typeof eventsSchema>;
  jumpIntensitySchedule: z.ZodOptional<typeof intensityScheduleSchema>;
}

type KindSchema<K extends ModelKind> = z.ZodObject<
  { kind: z.ZodLiteral<K> } & { [P in ParametersOf<K>]: z.ZodType<number> } & DatedFields,
  z.core.$loose
>;

type AnyKindSchema = { [K in ModelKind]: KindSchema<K> }[ModelKind];

function kindSchema(kind: ModelKind): AnyKindSchema {
  const fields = Object.fromEntries(
    parametersOf(kind).map((p) => [p, inDomainOf(PARAMETER_SPECS[p].domain)]),
  );
  const takesSchedule = parametersOf(kind).includes('jumpIntensity');
  const schedule = takesSchedule
    ? intensityScheduleSchema.optional()
    : z.undefined({ error: 'only a model with jumps takes a jump-intensity schedule' }).optional();
  const check = modelEntry(kind).check;
  const object = z.looseObject({
    kind: z.literal(kind),
    ...fields,
    events: eventsSchema.optional(),
    jumpIntensitySchedule: schedule,
  });
  const schema: z.ZodType = check
    ? object.superRefine((value, ctx) => {
        const issue = check(value);
        if (issue) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
      })
    : object;
  return schema as AnyKindSchema;
}

/** One object schema per registry entry, told apart by `kind`. */
export const modelSchema = z.discriminatedUnion(
  'kind',
  MODEL_KINDS.map(kindSchema) as [AnyKindSchema, ...AnyKindSchema[]],
  { error: `must be one of ${MODEL_KINDS.join(', ')}` },
);

/** The stress's fields (`stress-fields.ts`), each within a practical range. */
export const stressSchema = z.looseObject({
  jumpIntensityScale: bounded(0, 100).optional(),
  jumpMeanShift: bounded(-5, 5).optional(),
  jumpStdevScale: bounded(0, 100).optional(),
  spotShift: bounded(-0.99, 10).optional(),
  volOfVolScale: bounded(0, 100).optional(),
  v0Scale: bounded(0, 100).optional(),
  eventSizeScale: bounded(0, 10).optional(),
  varianceJumpScale: bounded(0, 100).optional(),
  jumpCorrelationShift: bounded(-5, 5).optional(),
} satisfies Record<StressField, z.ZodType>);

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
  /**
   * How each expiry's strikes are placed: the `moneyness` list for every expiry (the default,
   * and what documents without the field always had) or 41 points over ±4 ATM standard
   * deviations of that expiry.
   */
  strikeSpacing: z
    .enum(['log-moneyness', 'standard-deviations'], {
      error: 'must be "log-moneyness" or "standard-deviations"',
    })
    .optional(),
});

export const scenarioSchema = z.looseObject({
  format: z.literal(SCENARIO_FORMAT, { error: `must be "${SCENARIO_FORMAT}"` }),
  id: z.string().min(1, 'must not be empty').max(100),
  name: z.string().trim().min(1, 'must not be empty').max(200, 'at most 200 characters'),
  notes: z.string().max(20000).optional(),
  valuationDate: isoDateSchema,
  market: marketSchema,
  model: modelSchema,
  stress: stressSchema.optional(),
  grid: gridSchema,
  runs: z.array(z.looseObject({})).optional(),
});

/** A validated scenario document; unknown fields ride along untouched. */
export type ScenarioDocument = z.infer<typeof scenarioSchema>;
