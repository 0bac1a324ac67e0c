/**
 * Calibration of a model to implied-vol quotes: Levenberg-Marquardt on vol-point residuals
 * with bounds by transformation, from the best of a spread of Halton starting points plus the
 * caller's guess; parameters can be fixed. Trials use a lighter COS setting; the final report is
 * priced at full accuracy.
 */
import { modelSpec } from '../analytic/characteristic';
import {
  boundOf,
  coordinateValue,
  freeParameters,
  halton,
  onBound,
  toBounded,
  toUnbounded,
  withParameters,
} from './calibration-space';
import { cosStrip, DEFAULT_COS_SETTINGS, prepareCos, type CosSettings } from '../analytic/cos';
import { levenbergMarquardt } from './levenberg-marquardt';
import { eventSizeKey } from './event-sizes';
import { parameterErrors, type ParameterErrors } from './parameter-errors';
import { forwardPrice } from '../core/market';
import { normPdf } from '../analytic/normal';
import { stripImpliedVols } from '../analytic/pricing';
import type { Market, Model } from '../core/types';

export interface VolQuote {
  strike: number;
  expiry: number;
  impliedVol: number;
  /** relative weight (e.g. from the bid-ask spread); 1 when absent */
  weight?: number;
  /** the quote's own forward for its expiry, when the chain gives one (else the market's) */
  forward?: number;
}

export interface CalibrationRequest {
  market: Market;
  /** the kind to fit and the starting guess */
  model: Model;
  fixed?: string[];
  /** scheduled moves (indices into `model.events`) whose size is fitted too */
  fitEventSizes?: number[];
  /**
   * anchor the fit to an earlier one: a penalty √weight · (θ − θ_prev)/(box width) per fitted
   * coordinate joins the residuals (vol points); weight 0 is the plain fit
   */
  anchor?: { model: Model; weight: number };
  quotes: VolQuote[];
  weights?: 'uniform' | 'vega';
  /** multi-start: Halton points screened, and how many of the best are refined */
  screen?: number;
  refine?: number;
}

export interface Residual {
  strike: number;
  expiry: number;
  market: number;
  model: number | null;
}

export interface CalibrationResult {
  model: Model;
  sseVolPoints: number;
  rmseVolPoints: number;
  rmseByExpiry: { expiry: number; rmseVolPoints: number; count: number }[];
  iterations: number;
  evaluations: number;
  elapsedMs: number;
  feller: { holds: boolean; margin: number } | null;
  onBounds: string[];
  residuals: Residual[];
  /** how well the quotes pin each fitted coordinate down (from the Jacobian at the optimum) */
  errors: ParameterErrors;
  /** with an anchor: the penalty part of the cost at the optimum (vol points²) */
  anchorPenalty?: number;
}

// trial prices are coarse, and their finite-difference Jacobian wants them smooth in the
// parameters: whole blocks of terms
const TRIAL_COS: CosSettings = {
  ...DEFAULT_COS_SETTINGS,
  tailMass: 1e-11,
  tailTolerance: 1e-11,
  trimTerms: false,
};

/** Model implied vols at every quote, one COS preparation per expiry. */
export function modelVols(
  market: Market,
  model: Model,
  quotes: readonly VolQuote[],
  settings: CosSettings = DEFAULT_COS_SETTINGS,
): (number | null)[] {
  const spec = modelSpec(model);
  const out: (number | null)[] = new Array(quotes.length).fill(null);
  const byExpiry = new Map<number, number[]>();
  quotes.forEach((q, i) =>
    (byExpiry.get(q.expiry) ?? byExpiry.set(q.expiry, []).get(q.expiry)!).push(i),
  );
  for (const [T, idx] of byExpiry) {
    const F = forwardPrice(market, T);
    const ks = Float64Array.from(idx, (i) => Math.log(quotes[i].strike / (quotes[i].forward ?? F)));
    const n = idx.length;
    const call = new Float64Array(n);
    const put = new Float64Array(n);
    cosStrip(
      prepareCos(spec, T, settings),
      ks,
      call,
      put,
      new Float64Array(n),
      new Float64Array(n),
    );
    // exact roots: the Jacobian's finite differences would read their last bits as noise
    const vols = stripImpliedVols(call, put, ks, T, true);
    idx.forEach((qi, j) => (out[qi] = vols[j]));
  }
  return out;
}

function quoteWeights(
  market: Market,
  quotes: readonly VolQuote[],
  scheme: 'uniform' | 'vega',
): Float64Array {
  return Float64Array.from(quotes, (q) => {
    const base = q.weight ?? 1;
    if (scheme === 'uniform') return base;
    // normalised Black vega φ(d1)√T at the quote's vol, relative to its ATM value
    const s = q.impliedVol * Math.sqrt(q.expiry);
    const d1 = -Math.log(q.strike / (q.forward ?? forwardPrice(market, q.expiry))) / s + 0.5 * s;
    return (base * normPdf(d1)) / normPdf(0.5 * s);
  });
}

/** The coordinates a calibration moves: the free parameters, then the fitted event sizes. */
export function fittedCoordinates(
  req: Pick<CalibrationRequest, 'model' | 'fixed' | 'fitEventSizes'>,
): string[] {
  return [
    ...freeParameters(req.model.kind, req.fixed ?? []),
    ...(req.fitEventSizes ?? []).map(eventSizeKey),
  ];
}

export function calibrate(
  req: CalibrationRequest,
  progress?: (fraction: number) => boolean | void,
): CalibrationResult {
  const started = performance.now();
  const names = fittedCoordinates(req);
  const bounds = names.map(boundOf);
  const w = quoteWeights(req.market, req.quotes, req.weights ?? 'uniform');
  const sqrtW = w.map(Math.sqrt);
  const toModel = (z: ArrayLike<number>) =>
    withParameters(
      req.model,
      names,
      Array.from(z, (v, i) => toBounded(v, bounds[i])),
    );
  const anchored = req.anchor && req.anchor.weight > 0 ? req.anchor : null;
  const anchorValues = anchored ? names.map((n) => coordinateValue(anchored.model, n)) : [];
  const anchorScale = anchored ? Math.sqrt(anchored.weight) : 0;
  const residualsOf = (z: Float64Array) => {
    const vols = modelVols(req.market, toModel(z), req.quotes, TRIAL_COS);
    // an undefined model vol counts as zero vol
    const r = Float64Array.from({ length: req.quotes.length + anchorValues.length }, (_, i) => {
      if (i < req.quotes.length)
        return 100 * ((vols[i] ?? 0) - req.quotes[i].impliedVol) * sqrtW[i];
      const j = i - req.quotes.length;
      const b = bounds[j];
      return (anchorScale * (toBounded(z[j], b) - anchorValues[j])) / (b.hi - b.lo);
    });
    return r;
  };
  const cost = (z: Float64Array) => residualsOf(z).reduce((a, r) => a + r * r, 0);
  const guess = Float64Array.from(names, (n, i) =>
    toUnbounded(coordinateValue(anchored ? anchored.model : req.model, n), bounds[i]),
  );
  const screen = req.screen ?? 24;
  const starts: Float64Array[] = [guess];
  for (let s = 1; s <= screen; s++) {
    const u = halton(s, names.length);
    starts.push(
      Float64Array.from(u, (v, i) =>
        toUnbounded(bounds[i].startLo + v * (bounds[i].startHi - bounds[i].startLo), bounds[i]),
      ),
    );
  }
  const ranked = starts.map((z) => ({ z, c: cost(z) })).sort((a, b) => a.c - b.c);
  const refine = Math.min(req.refine ?? 3, ranked.length);
  let best: ReturnType<typeof levenbergMarquardt> | null = null;
  let iterations = 0;
  let evaluations = starts.length;
  let stopped = false;
  for (let k = 0; k < refine && !stopped; k++) {
    const r = levenbergMarquardt(residualsOf, ranked[k].z, {
      maxIterations: 60,
      onIteration: (it) => {
        const go = progress?.((k + Math.min(it / 30, 0.95)) / refine);
        if (go === false) stopped = true;
        return go === false ? false : undefined;
      },
    });
    iterations += r.iterations;
    evaluations += r.evaluations;
    if (!best || r.cost < best.cost) best = r;
  }
  const model = toModel(best!.x);
  const theta = names.map((n) => coordinateValue(model, n));
  const errors = parameterErrors(
    names,
    theta,
    // a step of 1e-4 of the box
    bounds.map((b) => 1e-4 * (b.hi - b.lo) || 1e-6),
    (th) => {
      const vols = modelVols(req.market, withParameters(req.model, names, th), req.quotes);
      return Float64Array.from(
        req.quotes,
        (q, i) => 100 * ((vols[i] ?? 0) - q.impliedVol) * sqrtW[i],
      );
    },
    bounds,
  );
  const quality = report(req, model);
  return {
    ...quality,
    ...(anchored
      ? {
          anchorPenalty:
            anchorScale ** 2 *
            names.reduce((acc, _, j) => {
              const d = (theta[j] - anchorValues[j]) / (bounds[j].hi - bounds[j].lo);
              return acc + d * d;
            }, 0),
        }
      : {}),
    errors,
    iterations,
    evaluations,
    elapsedMs: performance.now() - started,
  };
}

/** Fit quality of a model against quotes, at full pricing accuracy. */
export function report(
  req: Pick<CalibrationRequest, 'market' | 'quotes' | 'model' | 'fixed' | 'fitEventSizes'>,
  model: Model,
) {
  const vols = modelVols(req.market, model, req.quotes);
  const residuals: Residual[] = req.quotes.map((q, i) => ({
    strike: q.strike,
    expiry: q.expiry,
    market: q.impliedVol,
    model: vols[i],
  }));
  const sq = residuals.map((r) => (100 * ((r.model ?? 0) - r.market)) ** 2);
  const sseVolPoints = sq.reduce((a, b) => a + b, 0);
  const byExpiry = new Map<number, number[]>();
  residuals.forEach((r, i) =>
    (byExpiry.get(r.expiry) ?? byExpiry.set(r.expiry, []).get(r.expiry)!).push(sq[i]),
  );
  const names = fittedCoordinates({ ...req, model });
  const d = modelSpec(model).diffusion;
  const hasHeston = d.type === 'heston';
  const margin = hasHeston ? 2 * d.kappa * d.theta - d.volOfVol ** 2 : 0;
  return {
    model,
    sseVolPoints,
    rmseVolPoints: Math.sqrt(sseVolPoints / Math.max(1, sq.length)),
    rmseByExpiry: [...byExpiry.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([expiry, s]) => ({
        expiry,
        rmseVolPoints: Math.sqrt(s.reduce((a, b) => a + b, 0) / s.length),
        count: s.length,
      })),
    feller: hasHeston ? { holds: margin >= 0, margin } : null,
    onBounds: names.filter((n) => onBound(coordinateValue(model, n), boundOf(n))),
    residuals,
  };
}
