/**
 * The fit history of an underlying: each saved fit's date, a digest of its quotes, its
 * parameters and their standard errors, so that fits over days can be drawn as lines with error
 * bands and today's fit can be anchored to yesterday's. Kept in the scenario document
 * (`fitHistory`), so it syncs with the desk like the rest of the scenario.
 */
import { parametersOf, type Market, type Model, type ModelKind } from '../core';
import { addDays } from '../core/dates';
import { modelFrom } from '../core/models';
import { type CalibrationResult, type VolQuote, calibrate } from './calibrate';
import { demoChainCsv } from './demo-chain';
import { parseQuotesCsv } from './quotes-csv';

export interface FitHistoryEntry {
  /** the valuation date of the quotes */
  date: string;
  kind: ModelKind;
  /** FNV-1a of the quotes (expiry, strike, vol), to tell a refit of the same quotes */
  quotesDigest: string;
  quoteCount: number;
  rmseVolPoints: number;
  parameters: Record<string, number>;
  standardErrors: Record<string, number | null>;
}

/** FNV-1a (32-bit) over the quotes' numbers, as hex. */
export function quotesDigest(quotes: readonly VolQuote[]): string {
  let h = 0x811c9dc5;
  const text = quotes.map((q) => `${q.expiry}|${q.strike}|${q.impliedVol}`).join(';');
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return (h >>> 0).toString(16).padStart(8, '0');
}

export function historyEntry(
  date: string,
  result: CalibrationResult,
  quotes: readonly VolQuote[],
): FitHistoryEntry {
  const kind = result.model.kind;
  const names = parametersOf(kind);
  return {
    date,
    kind,
    quotesDigest: quotesDigest(quotes),
    quoteCount: quotes.length,
    rmseVolPoints: result.rmseVolPoints,
    parameters: Object.fromEntries(names.map((n) => [n, result.model[n as keyof Model] as number])),
    standardErrors: Object.fromEntries(
      names.map((n) => {
        const i = result.errors.names.indexOf(n);
        return [n, i < 0 ? null : result.errors.standardErrors[i]];
      }),
    ),
  };
}

/** The history with an entry added; a later fit of the same kind on the same date replaces it. */
export function withEntry(
  history: readonly FitHistoryEntry[],
  entry: FitHistoryEntry,
): FitHistoryEntry[] {
  return [...history.filter((h) => !(h.date === entry.date && h.kind === entry.kind)), entry].sort(
    (a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0),
  );
}

/** The well-formed entries of a document's `fitHistory` (anything else is skipped). */
export function fitHistoryOf(doc: Record<string, unknown>): FitHistoryEntry[] {
  const raw = doc.fitHistory;
  if (!Array.isArray(raw)) return [];
  return raw.filter(
    (e): e is FitHistoryEntry =>
      typeof e === 'object' &&
      e !== null &&
      typeof (e as FitHistoryEntry).date === 'string' &&
      typeof (e as FitHistoryEntry).kind === 'string' &&
      typeof (e as FitHistoryEntry).parameters === 'object',
  );
}

/** The latest entry of a kind dated before `date`: the fit a new one may be anchored to. */
export function anchorFor(
  history: readonly FitHistoryEntry[],
  kind: ModelKind,
  date: string,
): FitHistoryEntry | null {
  const earlier = history.filter((h) => h.kind === kind && h.date < date);
  return earlier.at(-1) ?? null;
}

/** An entry's parameters as a model of its kind (the rest filled from a starting model). */
export const entryModel = (entry: FitHistoryEntry, fill: Model): Model =>
  modelFrom(entry.kind, entry.parameters, (p) => fill[p as keyof Model] as number);

/**
 * An invented history for the demo: the demo chain on each of the last `days` days, from the
 * scenario's model with its jump intensity, mean jump and initial variance drifting day by day
 * (a fixed, invented pattern), each fitted with the scenario's kind.
 */
export function buildDemoHistory(
  req: { market: Market; model: Model; valuationDate: string; days: number },
  progress?: (fraction: number) => void,
): FitHistoryEntry[] {
  const drift = [0.9, 1.15, 0.95, 1.3, 1.05, 1.2, 0.85];
  let history: FitHistoryEntry[] = [];
  for (let d = req.days - 1; d >= 0; d--) {
    const date = addDays(req.valuationDate, -d);
    const f = drift[d % drift.length];
    const day: Record<string, unknown> = { ...req.model };
    for (const [key, scale] of [
      ['jumpIntensity', f],
      ['v0', 2 - f],
      ['jumpMean', 0.5 + 0.5 * f],
    ] as const)
      if (typeof day[key] === 'number') day[key] = (day[key] as number) * scale;
    const csv = demoChainCsv({
      market: req.market,
      model: day as Model,
      valuationDate: date,
      seed: d + 1,
    });
    const { quotes } = parseQuotesCsv(csv, req.market, date);
    const result = calibrate({
      market: req.market,
      model: req.model,
      quotes,
      screen: 6,
      refine: 1,
    });
    history = withEntry(history, historyEntry(date, result, quotes));
    progress?.((req.days - d) / req.days);
  }
  return history;
}
