/** The Replay form survives reloads on this device; a saved run can be opened into it. */
import type { SavedReplayRun, HedgeSettings } from '../../../engine/replay';
import type { HedgeForm, ReplayForm } from './replay-form';

const KEY = 'saltation.replay.form';

export function loadForm(): ReplayForm | null {
  try {
    const raw = localStorage.getItem(KEY);
    const parsed = raw ? (JSON.parse(raw) as ReplayForm) : null;
    return parsed && Array.isArray(parsed.legs) && parsed.hedge ? parsed : null;
  } catch {
    return null;
  }
}

export function storeForm(form: ReplayForm): void {
  try {
    localStorage.setItem(KEY, JSON.stringify(form));
  } catch {
    // storage full or disabled: the form still works for this visit
  }
}

const hedgeForm = (h: HedgeSettings): HedgeForm => ({
  method: h.method,
  rebalancesPerDay: String(h.rebalancesPerDay),
  costBps: String(h.costBps),
  hedgeVol: h.hedgeVol ? String(100 * h.hedgeVol) : '',
});

export function formFromRun(run: SavedReplayRun): ReplayForm {
  const r = run.request;
  return {
    legs: r.position.map((l) => ({
      side: l.quantity < 0 ? 'short' : 'long',
      type: l.type,
      strike: String(l.strike),
      days: String(Math.round(l.expiry * 365 * 1e6) / 1e6),
      quantity: String(Math.abs(l.quantity)),
    })),
    hedge: hedgeForm(r.hedge),
    compareOn: Boolean(run.compare),
    compare: run.compare ? hedgeForm(run.compare) : hedgeForm({ ...r.hedge, method: 'bs-delta' }),
    paths: String(r.paths),
    seed: String(run.seed),
  };
}
