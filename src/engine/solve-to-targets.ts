/**
 * Fit to a sketch: solve a scenario's jump parameters (and optionally ρ and v0) so its smiles
 * pass through target vols, starting from the scenario; the answer is expressed as a stress on
 * the scenario's base parameters where the stress can say it.
 */
import { calibrate, type CalibrationResult } from './calibrate';
import { PARAMETERS } from './calibration-space';
import { forwardPrice } from './market';
import { applyStress, NO_STRESS, type Stress } from './stress';
import type { Market, Model } from './types';

export interface TargetVol {
  expiry: number;
  /** ln(K/F) */
  logMoneyness: number;
  impliedVol: number;
}

export interface TargetSolution {
  fit: CalibrationResult;
  /** the new scenario's base model: the old one, with a solved ρ written in (no stress can say it) */
  model: Model;
  /** the stress on that base that reproduces the solved jumps (and v0) */
  stress: Stress;
}

const JUMP_PARAMETERS = [
  'jumpIntensity',
  'jumpMean',
  'jumpStdev',
  'upProbability',
  'upMean',
  'downMean',
];

export function solveToTargets(
  market: Market,
  base: Model,
  stress: Partial<Stress>,
  targets: readonly TargetVol[],
  also: { rho?: boolean; v0?: boolean },
  progress?: (f: number) => boolean | void,
): TargetSolution {
  if (base.kind !== 'bates' && base.kind !== 'merton' && base.kind !== 'heston-kou') {
    throw new Error('solving jumps needs a model with jumps (Bates, Merton or Heston-Kou)');
  }
  const start = applyStress(market, base, stress);
  const free = new Set(PARAMETERS[base.kind].filter((p) => JUMP_PARAMETERS.includes(p)));
  if (also.rho && base.kind !== 'merton') free.add('rho');
  if (also.v0 && base.kind !== 'merton') free.add('v0');
  const fixed = PARAMETERS[base.kind].filter((p) => !free.has(p));
  const quotes = targets.map((t) => ({
    expiry: t.expiry,
    strike: forwardPrice(start.market, t.expiry) * Math.exp(t.logMoneyness),
    impliedVol: t.impliedVol,
  }));
  const fit = calibrate(
    { market: start.market, model: start.model, fixed, quotes, screen: 12, refine: 2 },
    progress,
  );
  const b = base as unknown as Record<string, number>;
  const solved = fit.model as unknown as Record<string, number>;
  if (base.kind === 'heston-kou') {
    // the stress cannot move Kou's up and down sizes apart: the solved law becomes the base
    return { fit, model: fit.model, stress: { ...NO_STRESS } };
  }
  const out: Stress = { ...NO_STRESS, ...stress };
  out.jumpIntensityScale =
    b.jumpIntensity > 0 ? solved.jumpIntensity / b.jumpIntensity : out.jumpIntensityScale;
  out.jumpMeanShift = solved.jumpMean - b.jumpMean;
  out.jumpStdevScale = b.jumpStdev > 0 ? solved.jumpStdev / b.jumpStdev : out.jumpStdevScale;
  if (also.v0 && base.kind === 'bates' && b.v0 > 0) out.v0Scale = solved.v0 / b.v0;
  const model = also.rho && base.kind === 'bates' ? ({ ...base, rho: solved.rho } as Model) : base;
  return { fit, model, stress: out };
}
