/** The Replay page's form, kept as typed text, and its translation into validated requests. */
import type { LegRow } from '../components/LegsTable';
import {
  type HedgeSettings,
  type ReplayRequest,
  replayRequestSchema,
} from '../../../engine/replay';
import type { Market, Model } from '../../../engine/core';

export interface HedgeForm {
  method: HedgeSettings['method'];
  rebalancesPerDay: string;
  costBps: string;
  /** in percent; blank means each leg's implied vol at inception */
  hedgeVol: string;
}

export interface ReplayForm {
  legs: LegRow[];
  hedge: HedgeForm;
  compareOn: boolean;
  compare: HedgeForm;
  paths: string;
  seed: string;
}

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

export type FormCheck =
  | { ok: true; requests: ReplayRequest[] }
  | { ok: false; legIssues: Record<number, string>; error: string | null };

export function requestsFromForm(form: ReplayForm, market: Market, model: Model): FormCheck {
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
  const requests: ReplayRequest[] = [];
  for (const [k, h] of hedges.entries()) {
    const request = { ...base, hedge: hedgeFrom(h) };
    const r = replayRequestSchema.safeParse(request);
    if (!r.success) {
      const issue = r.error.issues[0];
      const [head, index, field] = issue.path;
      if (head === 'position' && typeof index === 'number') {
        const name = field === 'expiry' ? 'days' : String(field);
        return {
          ok: false,
          legIssues: { [index]: `${name} ${issue.message}` },
          error: null,
        };
      }
      if (head === 'position')
        return { ok: false, legIssues: { [-1]: issue.message }, error: null };
      const where =
        head === 'hedge'
          ? `${k === 0 ? 'hedge' : 'compared hedge'} ${String(index)}`
          : issue.path.join('.');
      return { ok: false, legIssues: {}, error: `${where}: ${issue.message}` };
    }
    requests.push(request);
  }
  return { ok: true, requests };
}
