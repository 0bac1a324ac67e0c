/**
 * Dated risk that a Poisson jump at one constant rate cannot say: scheduled moves (an earnings
 * day, a central-bank decision) and a piecewise-constant jump intensity. A scheduled move at
 * time t adds X to ln S, independent of everything else and compensated so that E[e^X] = 1; it
 * touches options expiring strictly after t. The schedule's intensity λ1 holds on (0, t1], λ2 on
 * (t1, t2], …, and the model's own intensity after the last point. European prices depend on
 * the schedule only through the integrated intensity Λ(T) = ∫₀ᵀ λ(s) ds.
 */
import { z } from 'zod';
import { bounded, finite } from './fields';

export const MAX_EVENTS = 50;
export const MAX_SCHEDULE_POINTS = 50;
/** The latest time an event or schedule point may take (years), as for expiries. */
export const MAX_EVENT_YEARS = 50;

const eventTime = finite.refine(
  (t) => t > 0 && t <= MAX_EVENT_YEARS,
  `must be above 0 and at most ${MAX_EVENT_YEARS} (years from valuation)`,
);
const eventName = z.string().max(80, 'at most 80 characters').optional();

export const normalMoveSchema = z.looseObject({
  time: eventTime,
  law: z.literal('normal'),
  /** standard deviation of the log-move; X ~ N(−s²/2, s²) */
  stdev: bounded(0, 2),
  name: eventName,
});

export const twoPointMoveSchema = z.looseObject({
  time: eventTime,
  law: z.literal('two-point'),
  /** relative move up (0.04 is +4 %) and down (−0.05 is −5 %) */
  up: finite.refine((u) => u > 0 && u <= 10, 'must be above 0 and at most 10'),
  down: finite.refine((d) => d > -1 && d < 0, 'must be above -1 and below 0'),
  upProbability: bounded(0, 1),
  name: eventName,
});

export const scheduledMoveSchema = z.discriminatedUnion(
  'law',
  [normalMoveSchema, twoPointMoveSchema],
  {
    error: 'law must be "normal" or "two-point"',
  },
);

export const eventsSchema = z
  .array(scheduledMoveSchema, { error: 'must be a list of scheduled moves' })
  .max(MAX_EVENTS, `at most ${MAX_EVENTS} events`);

export const intensityScheduleSchema = z
  .array(z.tuple([eventTime, bounded(0, 1000)], { error: 'must be a [time, intensity] pair' }), {
    error: 'must be a list of [time, intensity] pairs',
  })
  .max(MAX_SCHEDULE_POINTS, `at most ${MAX_SCHEDULE_POINTS} points`)
  .refine(
    (pts) => pts.every((p, i) => i === 0 || p[0] > pts[i - 1][0]),
    'times must be strictly increasing',
  );

export type ScheduledMove = z.infer<typeof scheduledMoveSchema>;
export type NormalMove = z.infer<typeof normalMoveSchema>;
export type TwoPointMove = z.infer<typeof twoPointMoveSchema>;
/** [t, λ] pairs: λ on the interval that ends at t. */
export type IntensitySchedule = ReadonlyArray<readonly [number, number]>;

/** The two log-move outcomes of a two-point move and its compensating shift c: X = ln(1+u)+c or ln(1+d)+c. */
export function twoPointOutcomes(e: Pick<TwoPointMove, 'up' | 'down' | 'upProbability'>): {
  up: number;
  down: number;
  p: number;
} {
  const p = e.upProbability;
  const shift = -Math.log(p * (1 + e.up) + (1 - p) * (1 + e.down));
  return { up: Math.log1p(e.up) + shift, down: Math.log1p(e.down) + shift, p };
}

/** Variance of a scheduled move's log-move X. */
export function moveVariance(e: ScheduledMove): number {
  if (e.law === 'normal') return e.stdev * e.stdev;
  const { up, down, p } = twoPointOutcomes(e);
  return p * (1 - p) * (up - down) ** 2;
}

/** Whether a move at `time` touches an option expiring at `expiry` (strictly after the move). */
export const touches = (time: number, expiry: number): boolean => time < expiry;

/** Λ(T) = ∫₀ᵀ λ(s) ds for the schedule, with `base` after its last point. */
export function integratedIntensity(
  base: number,
  schedule: IntensitySchedule | undefined,
  T: number,
): number {
  if (!schedule || schedule.length === 0) return base * T;
  let total = 0;
  let start = 0;
  for (const [end, rate] of schedule) {
    if (T <= end) return total + rate * Math.max(0, T - start);
    total += rate * (end - start);
    start = end;
  }
  return total + base * (T - start);
}

/** The intensity in force just after time t. */
export function intensityAt(
  base: number,
  schedule: IntensitySchedule | undefined,
  t: number,
): number {
  if (schedule) for (const [end, rate] of schedule) if (t < end) return rate;
  return base;
}

/**
 * The schedule as seen from `dt` years later (dt may be negative): times move by −dt and the
 * intervals that have ended are dropped; a negative dt stretches the first interval back.
 */
export function shiftSchedule(schedule: IntensitySchedule, dt: number): IntensitySchedule {
  return schedule.map(([t, l]) => [t - dt, l] as const).filter(([t]) => t > 0);
}
