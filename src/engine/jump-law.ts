/**
 * How likely an instant gap of each ladder size is over a horizon: the probability of at least
 * one jump, 1 − e^{−λh}, times the chance that a jump's size falls in the ladder point's bin
 * (single-jump approximation, fine for the day and week horizons it is drawn for).
 */
import { normCdf } from './normal';
import type { Model } from './types';

function logJumpCdf(model: Model, y: number): number {
  if (model.kind === 'merton' || model.kind === 'bates') {
    if (model.jumpStdev === 0) return y >= model.jumpMean ? 1 : 0;
    return normCdf((y - model.jumpMean) / model.jumpStdev);
  }
  if (model.kind === 'heston-kou') {
    const { upProbability: p, upMean: m1, downMean: m2 } = model;
    if (y < 0) return m2 > 0 ? (1 - p) * Math.exp(y / m2) : 0;
    return 1 - (m1 > 0 ? p * Math.exp(-y / m1) : 0);
  }
  return y >= 0 ? 1 : 0;
}

function jumpIntensity(model: Model): number {
  return model.kind === 'merton' || model.kind === 'bates' || model.kind === 'heston-kou'
    ? model.jumpIntensity
    : 0;
}

/** Probability, per horizon, that a jump lands in the bin around each move (moves ascending). */
export function jumpMoveProbabilities(
  model: Model,
  moves: readonly number[],
  horizonYears: number,
): number[] {
  const lambda = jumpIntensity(model);
  if (lambda === 0 || moves.length === 0) return moves.map(() => 0);
  const atLeastOne = -Math.expm1(-lambda * horizonYears);
  return moves.map((m, i) => {
    const lo = i === 0 ? -0.9999 : 0.5 * (moves[i - 1] + m);
    const hi =
      i === moves.length - 1 ? m + (m - (moves[i - 1] ?? m - 0.01)) / 2 : 0.5 * (m + moves[i + 1]);
    const yLo = Math.log(Math.max(1 + lo, 1e-12));
    const yHi = Math.log(Math.max(1 + hi, 1e-12));
    return atLeastOne * Math.max(0, logJumpCdf(model, yHi) - logJumpCdf(model, yLo));
  });
}
