/**
 * Fit to a sketch: solve a scenario's jump parameters (and optionally ρ and v0) so its smiles
 * pass through target vols, starting from the scenario; the answer is expressed as a stress on
 * the scenario's base parameters where the stress can say it.
 */
import { calibrate, type CalibrationResult } from './calibrate';
import {
  hasJumps,
  hasStochasticVariance,
  modelEntry,
  parametersIn,
  parametersOf,
  parameterValue,
  PARAMETER_SPECS,
  type ParameterKey,
  type ParameterSpec,
} from '../core';
import { forwardPrice } from '../core/market';
import { applyStress, NO_STRESS, type Stress } from '../core/stress';
import type { Market, Model } from '../core/types';

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

export function solveToTargets(
  market: Market,
  base: Model,
  stress: Partial<Stress>,
  targets: readonly TargetVol[],
  also: { rho?: boolean; v0?: boolean },
  progress?: (f: number) => boolean | void,
): TargetSolution {
  if (!hasJumps(base.kind)) throw new Error('solving jumps needs a model with jumps');
  const start = applyStress(market, base, stress);
  const free = new Set<ParameterKey>(parametersIn(base.kind, 'jumps'));
  if (also.rho && hasStochasticVariance(base.kind)) free.add('rho');
  if (also.v0 && hasStochasticVariance(base.kind)) free.add('v0');
  const fixed = parametersOf(base.kind).filter((p) => !free.has(p));
  const quotes = targets.map((t) => ({
    expiry: t.expiry,
    strike: forwardPrice(start.market, t.expiry) * Math.exp(t.logMoneyness),
    impliedVol: t.impliedVol,
  }));
  const fit = calibrate(
    { market: start.market, model: start.model, fixed, quotes, screen: 12, refine: 2 },
    progress,
  );
  if (modelEntry(base.kind).stressJumps) {
    // the stress cannot say this jump law's own moves (Kou's up and down sizes apart): the
    // solved law becomes the base
    return { fit, model: fit.model, stress: { ...NO_STRESS } };
  }
  // each solved parameter that a stress moves becomes that stress; the others join the base
  const out: Stress = { ...NO_STRESS, ...stress };
  const written: Record<string, number> = {};
  for (const key of free) {
    const rule = (PARAMETER_SPECS[key] as ParameterSpec).stress;
    const was = parameterValue(base, key);
    const now = parameterValue(fit.model, key);
    if (!rule) written[key] = now;
    else if (rule.op === 'shift') out[rule.field] = now - was;
    else if (was > 0) out[rule.field] = now / was;
  }
  const model = Object.keys(written).length > 0 ? ({ ...base, ...written } as Model) : base;
  return { fit, model, stress: out };
}
