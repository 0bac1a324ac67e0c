/**
 * "Are the jumps worth it?": Heston and Bates fitted to the same quotes, RMSE by expiry bucket
 * (under 1 month, 1–6 months, beyond), and information criteria that charge for parameters:
 * AIC = n ln(SSE/n) + 2k (Akaike 1974) and BIC = n ln(SSE/n) + k ln n (Schwarz 1978).
 * Optionally a third candidate: Heston with one scheduled normal move on a given date, its size
 * fitted (one parameter against the jumps' three), for a short end shaped by a known date.
 */
import { calibrate, type CalibrationRequest, type CalibrationResult } from './calibrate';
import type { Model } from '../core/types';

export interface BucketRmse {
  bucket: 'under 1M' | '1M–6M' | 'over 6M';
  heston: number | null;
  bates: number | null;
  /** Heston with the scheduled move, when it was tried */
  move?: number | null;
  svcj: number | null;
  count: number;
}

export interface JumpsVerdict {
  heston: CalibrationResult;
  bates: CalibrationResult;
  /** SVCJ: Bates with jumps in the variance too (two more parameters) */
  svcj: CalibrationResult;
  /** Heston plus one scheduled normal move, when a move date was given */
  move?: CalibrationResult;
  buckets: BucketRmse[];
  aic: { heston: number; bates: number; svcj: number; move?: number };
  bic: { heston: number; bates: number; svcj: number; move?: number };
  /** BIC falls by more than 10 with the jumps: strong evidence for them (Kass & Raftery 1995) */
  jumpsEarnTheirKeep: boolean;
  summary: string;
}

const BUCKETS: [BucketRmse['bucket'], number, number][] = [
  ['under 1M', 0, 1 / 12],
  ['1M–6M', 1 / 12, 0.5],
  ['over 6M', 0.5, Infinity],
];

function bucketRmse(
  r: CalibrationResult,
  lo: number,
  hi: number,
): { rmse: number | null; count: number } {
  const sq = r.residuals
    .filter((x) => x.expiry >= lo && x.expiry < hi)
    .map((x) => (100 * ((x.model ?? 0) - x.market)) ** 2);
  return {
    rmse: sq.length ? Math.sqrt(sq.reduce((a, b) => a + b, 0) / sq.length) : null,
    count: sq.length,
  };
}

function criteria(r: CalibrationResult, k: number) {
  const n = r.residuals.length;
  const base = n * Math.log(Math.max(r.sseVolPoints, 1e-300) / n);
  return { aic: base + 2 * k, bic: base + k * Math.log(n) };
}

export function jumpsVerdict(
  req: Omit<CalibrationRequest, 'model'> & {
    hestonGuess: Model & { kind: 'heston' };
    /** try Heston with one scheduled normal move at this time (years) too */
    moveTime?: number;
    progress?: (f: number) => boolean | void;
  },
): JumpsVerdict {
  const g = req.hestonGuess;
  const withMove = req.moveTime !== undefined;
  // progress: each fit's share of the whole, in order heston, bates, svcj, move
  const share = withMove ? [0.2, 0.3, 0.35, 0.15] : [0.25, 0.35, 0.4, 0];
  const from = (i: number) => share.slice(0, i).reduce((a, b) => a + b, 0);
  const stage = (i: number) => (f: number) => req.progress?.(from(i) + share[i] * f);
  const heston = calibrate({ ...req, model: g }, stage(0));
  const batesGuess: Model = {
    ...(heston.model as Model & { kind: 'heston' }),
    kind: 'bates',
    jumpIntensity: 0.3,
    jumpMean: -0.08,
    jumpStdev: 0.1,
  };
  const bates = calibrate({ ...req, model: batesGuess }, stage(1));
  const svcjGuess = {
    ...bates.model,
    kind: 'svcj',
    varianceJumpMean: 0.04,
    jumpCorrelation: -0.5,
  } as Model;
  const svcj = calibrate({ ...req, model: svcjGuess }, stage(2));
  let move: CalibrationResult | undefined;
  if (withMove) {
    const events = [...(heston.model.events ?? [])];
    events.push({ time: req.moveTime!, law: 'normal', stdev: 0.03, name: 'fitted move' });
    move = calibrate(
      { ...req, model: { ...heston.model, events } as Model, fitEventSizes: [events.length - 1] },
      stage(3),
    );
  }
  const kH =
    5 -
    (req.fixed?.filter((p) => ['v0', 'kappa', 'theta', 'volOfVol', 'rho'].includes(p)).length ?? 0);
  const kB =
    kH +
    3 -
    (req.fixed?.filter((p) => ['jumpIntensity', 'jumpMean', 'jumpStdev'].includes(p)).length ?? 0);
  const kS =
    kB +
    2 -
    (req.fixed?.filter((p) => ['varianceJumpMean', 'jumpCorrelation'].includes(p)).length ?? 0);
  const cH = criteria(heston, kH);
  const cB = criteria(bates, kB);
  const cS = criteria(svcj, kS);
  const cM = move ? criteria(move, kH + 1) : undefined;
  const buckets = BUCKETS.map(([bucket, lo, hi]) => {
    const h = bucketRmse(heston, lo, hi);
    const b = bucketRmse(bates, lo, hi);
    const row: BucketRmse = {
      bucket,
      heston: h.rmse,
      bates: b.rmse,
      svcj: bucketRmse(svcj, lo, hi).rmse,
      count: h.count,
    };
    if (move) row.move = bucketRmse(move, lo, hi).rmse;
    return row;
  });
  const earn = cH.bic - cB.bic > 10;
  const short = buckets[0];
  const summary = earn
    ? `The jumps earn their three parameters: BIC falls by ${(cH.bic - cB.bic).toFixed(1)}${short.count ? `, and the under-1M RMSE goes from ${short.heston!.toFixed(2)} to ${short.bates!.toFixed(2)} vol points` : ''}.`
    : `Heston is enough here: the jumps lower BIC by only ${(cH.bic - cB.bic).toFixed(1)} (more than 10 would be strong evidence).`;
  const versusMove =
    cM === undefined
      ? ''
      : cM.bic < cB.bic
        ? ` One scheduled move (${(100 * (move!.model.events!.at(-1) as { stdev: number }).stdev).toFixed(2)} % s.d.) explains the quotes better than the jumps: BIC ${cM.bic.toFixed(1)} against ${cB.bic.toFixed(1)}.`
        : ` The jumps beat one scheduled move: BIC ${cB.bic.toFixed(1)} against ${cM.bic.toFixed(1)}.`;
  const versusSvcj =
    cB.bic - cS.bic > 10
      ? ` Jumps in the variance earn their ${kS - kB} parameters too: BIC falls by ${(cB.bic - cS.bic).toFixed(1)} from Bates to SVCJ.`
      : cS.bic > cB.bic
        ? ` Jumps in the variance do not pay here: BIC rises by ${(cS.bic - cB.bic).toFixed(1)} from Bates to SVCJ.`
        : ` Jumps in the variance add little: BIC falls by only ${(cB.bic - cS.bic).toFixed(1)} from Bates to SVCJ.`;
  return {
    heston,
    bates,
    svcj,
    ...(move ? { move } : {}),
    buckets,
    aic: { heston: cH.aic, bates: cB.aic, svcj: cS.aic, ...(cM ? { move: cM.aic } : {}) },
    bic: { heston: cH.bic, bates: cB.bic, svcj: cS.bic, ...(cM ? { move: cM.bic } : {}) },
    jumpsEarnTheirKeep: earn,
    summary: summary + versusSvcj + versusMove,
  };
}
