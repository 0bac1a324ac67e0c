/** The Replay form survives reloads on this device; a saved run can be opened into it. */
import type { Leg, SavedReplayRun, HedgeSettings } from '../../../engine/replay';
import { hedgeFormDefaults, type HedgeForm, type LegRow, type ReplayForm } from './replay-form';

const KEY = 'saltation.replay.form';

/** A stored form from before a field existed gets that field's default. */
function withDefaults(form: ReplayForm): ReplayForm {
  const spot = Number(form.legs[0]?.strike) || 100;
  const hedge = (h: Partial<HedgeForm> | undefined, method: HedgeForm['method']) => ({
    ...hedgeFormDefaults(method, spot),
    ...h,
  });
  return {
    ...form,
    overlay: Array.isArray(form.overlay) ? form.overlay : [],
    hedge: hedge(form.hedge, 'model-delta'),
    compare: hedge(form.compare, 'bs-delta'),
  };
}

export function loadForm(): ReplayForm | null {
  try {
    const raw = localStorage.getItem(KEY);
    const parsed = raw ? (JSON.parse(raw) as ReplayForm) : null;
    return parsed && Array.isArray(parsed.legs) && parsed.hedge ? withDefaults(parsed) : null;
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

const days = (years: number) => String(Math.round(years * 365 * 1e6) / 1e6);

const hedgeForm = (h: HedgeSettings, spot: number): HedgeForm => ({
  ...hedgeFormDefaults(h.method, spot),
  rebalancesPerDay: String(h.rebalancesPerDay),
  costBps: String(h.costBps),
  hedgeVol: h.hedgeVol ? String(100 * h.hedgeVol) : '',
  ...(h.instrument
    ? {
        instrumentType: h.instrument.type,
        instrumentStrike: String(h.instrument.strike),
        instrumentDays: days(h.instrument.expiry),
      }
    : {}),
});

const legRow = (l: Leg): LegRow => ({
  side: l.quantity < 0 ? 'short' : 'long',
  type: l.type,
  strike: String(l.strike),
  days: days(l.expiry),
  quantity: String(Math.abs(l.quantity)),
});

/** A form for a leg list handed over from another page (the Book's wing hedge). */
export function formWithOverlay(
  form: ReplayForm,
  legs: Leg[],
  overlay: Leg[],
  seed?: number,
): ReplayForm {
  return {
    ...form,
    legs: legs.map(legRow),
    overlay: overlay.map(legRow),
    ...(seed !== undefined ? { seed: String(seed) } : {}),
  };
}

export function formFromRun(run: SavedReplayRun): ReplayForm {
  const r = run.request;
  const spot = r.market.spot;
  return {
    legs: r.position.map(legRow),
    overlay: (r.overlay ?? []).map(legRow),
    hedge: hedgeForm(r.hedge, spot),
    compareOn: Boolean(run.compare),
    compare: run.compare
      ? hedgeForm(run.compare, spot)
      : hedgeForm({ ...r.hedge, method: 'bs-delta' }, spot),
    paths: String(r.paths),
    seed: String(run.seed),
  };
}
