/**
 * The Replay page's form, kept as typed text, and its zod schema: text in, validated replay
 * requests out (one per hedge, on the same position, paths and seed).
 */
import { z } from 'zod';
import type { FieldErrors } from 'react-hook-form';
import { firstFormError } from '../../../components/form-errors';
import type { Market, Model } from '../../../engine/core';
import {
  HEDGE_METHODS,
  isOptionHedge,
  replayRequestSchema,
  type HedgeSettings,
} from '../../../engine/replay';

const legRow = z.object({
  type: z.enum(['call', 'put']),
  side: z.enum(['long', 'short']),
  strike: z.string(),
  days: z.string(),
  quantity: z.string(),
});
export type LegRow = z.infer<typeof legRow>;

const hedgeForm = z.object({
  method: z.enum(HEDGE_METHODS),
  rebalancesPerDay: z.string(),
  costBps: z.string(),
  /** in percent; blank means each leg's implied vol at inception */
  hedgeVol: z.string(),
  /** the hedge option of a gamma or vega hedge */
  instrumentType: z.enum(['call', 'put']),
  instrumentStrike: z.string(),
  instrumentDays: z.string(),
});
export type HedgeForm = z.infer<typeof hedgeForm>;

export const replayFormFields = z.object({
  legs: z.array(legRow),
  /** options bought or sold at inception and held: the run is replayed without and with them */
  overlay: z.array(legRow),
  hedge: hedgeForm,
  compareOn: z.boolean(),
  compare: hedgeForm,
  paths: z.string(),
  seed: z.string(),
});
export type ReplayForm = z.infer<typeof replayFormFields>;

/** A hedge's form with the hedge option fields at their defaults (an ATM call of 30 days). */
export const hedgeFormDefaults = (method: HedgeForm['method'], spot: number): HedgeForm => ({
  method,
  rebalancesPerDay: '1',
  costBps: '1',
  hedgeVol: '',
  instrumentType: 'call',
  instrumentStrike: String(spot),
  instrumentDays: '30',
});

export const defaultReplayForm = (spot: number): ReplayForm => ({
  legs: [
    { side: 'short', type: 'put', strike: String(0.95 * spot), days: '7', quantity: '10' },
    { side: 'long', type: 'put', strike: String(0.9 * spot), days: '14', quantity: '10' },
  ],
  overlay: [],
  hedge: hedgeFormDefaults('model-delta', spot),
  compareOn: true,
  compare: hedgeFormDefaults('bs-delta', spot),
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
  if (isOptionHedge(h.method))
    out.instrument = {
      type: h.instrumentType,
      strike: num(h.instrumentStrike),
      expiry: num(h.instrumentDays) / 365,
    };
  return out;
}

const legFrom = (l: LegRow) => ({
  type: l.type,
  strike: num(l.strike),
  expiry: num(l.days) / 365,
  quantity: (l.side === 'short' ? -1 : 1) * num(l.quantity),
});

/** Runs per hedge: the position alone, then with the overlay when there is one. */
export const runsPerHedge = (requests: readonly { overlay?: unknown[] }[]) =>
  requests.some((r) => (r.overlay?.length ?? 0) > 0) ? 2 : 1;

/** The form as requests for the scenario's market and model, checked by the engine's schema. */
export const replayFormSchema = (market: Market, model: Model) =>
  replayFormFields
    .transform((form): z.input<typeof replayRequestSchema>[] => {
      const base = {
        market,
        model,
        position: form.legs.map(legFrom),
        paths: num(form.paths),
        seed: num(form.seed),
      };
      const overlay = form.overlay.map(legFrom);
      const hedges = form.compareOn ? [form.hedge, form.compare] : [form.hedge];
      // with an overlay, each hedge runs without it and with it, on the same paths
      return hedges.flatMap((h) => {
        const plain = { ...base, hedge: hedgeFrom(h) };
        return overlay.length > 0 ? [plain, { ...plain, overlay }] : [plain];
      });
    })
    .pipe(z.array(replayRequestSchema));

export interface FormIssues {
  /** a message per leg index (−1: the position as a whole) */
  legIssues: Record<number, string>;
  /** the same for the overlay's rows */
  overlayIssues: Record<number, string>;
  error: string | null;
}

/**
 * The first refusal, said where the user typed it: "Leg 2: strike must be …" beside the legs,
 * "hedge rebalancesPerDay: …" or "compared hedge …" for a hedge, the field path otherwise.
 */
export function formIssues(errors: FieldErrors, perHedge = 1): FormIssues {
  const none = { legIssues: {}, overlayIssues: {}, error: null };
  const first = firstFormError(errors);
  if (!first) return none;
  const [k, head, index, field] = first.path.split('.');
  const rows = head === 'position' ? 'legIssues' : head === 'overlay' ? 'overlayIssues' : null;
  if (rows && index !== undefined && /^\d+$/.test(index)) {
    const name = field === 'expiry' ? 'days' : field;
    return { ...none, [rows]: { [Number(index)]: `${name} ${first.message}` } };
  }
  if (rows) return { ...none, [rows]: { [-1]: first.message } };
  // the first request (or the first pair, with an overlay) is the hedge, the rest the compared one
  const where =
    head === 'hedge'
      ? `${Number(k) < perHedge ? 'hedge' : 'compared hedge'} ${first.path.split('.').slice(2).join(' ')}`
      : first.path.split('.').slice(1).join('.');
  return { ...none, error: `${where}: ${first.message}` };
}
