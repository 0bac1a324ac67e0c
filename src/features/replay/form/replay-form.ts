/**
 * The Replay page's form, kept as typed text, and its zod schema: text in, validated replay
 * requests out (one per hedge, on the same position, paths and seed).
 */
import { z } from 'zod';
import type { FieldErrors } from 'react-hook-form';
import { firstFormError } from '../../../components/form-errors';
import type { Market, Model } from '../../../engine/core';
import { replayRequestSchema, type HedgeSettings } from '../../../engine/replay';

const legRow = z.object({
  type: z.enum(['call', 'put']),
  side: z.enum(['long', 'short']),
  strike: z.string(),
  days: z.string(),
  quantity: z.string(),
});
export type LegRow = z.infer<typeof legRow>;

const hedgeForm = z.object({
  method: z.enum(['none', 'bs-delta', 'model-delta']),
  rebalancesPerDay: z.string(),
  costBps: z.string(),
  /** in percent; blank means each leg's implied vol at inception */
  hedgeVol: z.string(),
});
export type HedgeForm = z.infer<typeof hedgeForm>;

export const replayFormFields = z.object({
  legs: z.array(legRow),
  hedge: hedgeForm,
  compareOn: z.boolean(),
  compare: hedgeForm,
  paths: z.string(),
  seed: z.string(),
});
export type ReplayForm = z.infer<typeof replayFormFields>;

export const defaultReplayForm = (spot: number): ReplayForm => ({
  legs: [
    { side: 'short', type: 'put', strike: String(0.95 * spot), days: '7', quantity: '10' },
    { side: 'long', type: 'put', strike: String(0.9 * spot), days: '14', quantity: '10' },
  ],
  hedge: { method: 'model-delta', rebalancesPerDay: '1', costBps: '1', hedgeVol: '' },
  compareOn: true,
  compare: { method: 'bs-delta', rebalancesPerDay: '1', costBps: '1', hedgeVol: '' },
  paths: '10000',
  seed: '20261202',
});

const num = (s: string) => (s.trim() === '' ? NaN : Number(s));

function hedgeFrom(h: HedgeForm): HedgeSettings {
  const out: HedgeSettings = {
    method: h.method,
    rebalancesPerDay: num(h.rebalancesPerDay),
    costBps: num(h.costBps),
  };
  if (h.method === 'bs-delta' && h.hedgeVol.trim() !== '') out.hedgeVol = num(h.hedgeVol) / 100;
  return out;
}

/** The form as requests for the scenario's market and model, checked by the engine's schema. */
export const replayFormSchema = (market: Market, model: Model) =>
  replayFormFields
    .transform((form): z.input<typeof replayRequestSchema>[] => {
      const base = {
        market,
        model,
        position: form.legs.map((l) => ({
          type: l.type,
          strike: num(l.strike),
          expiry: num(l.days) / 365,
          quantity: (l.side === 'short' ? -1 : 1) * num(l.quantity),
        })),
        paths: num(form.paths),
        seed: num(form.seed),
      };
      const hedges = form.compareOn ? [form.hedge, form.compare] : [form.hedge];
      return hedges.map((h) => ({ ...base, hedge: hedgeFrom(h) }));
    })
    .pipe(z.array(replayRequestSchema));

export interface FormIssues {
  /** a message per leg index (−1: the position as a whole) */
  legIssues: Record<number, string>;
  error: string | null;
}

/**
 * The first refusal, said where the user typed it: "Leg 2: strike must be …" beside the legs,
 * "hedge rebalancesPerDay: …" or "compared hedge …" for a hedge, the field path otherwise.
 */
export function formIssues(errors: FieldErrors): FormIssues {
  const first = firstFormError(errors);
  if (!first) return { legIssues: {}, error: null };
  const [k, head, index, field] = first.path.split('.');
  if (head === 'position' && index !== undefined && /^\d+$/.test(index)) {
    const name = field === 'expiry' ? 'days' : field;
    return { legIssues: { [Number(index)]: `${name} ${first.message}` }, error: null };
  }
  if (head === 'position') return { legIssues: { [-1]: first.message }, error: null };
  const where =
    head === 'hedge'
      ? `${k === '0' ? 'hedge' : 'compared hedge'} ${index}`
      : first.path.split('.').slice(1).join('.');
  return { legIssues: {}, error: `${where}: ${first.message}` };
}
