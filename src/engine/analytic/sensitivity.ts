/**
 * Sensitivity of each smile point to each model parameter: ∂σ_impl/∂p by central differences of
 * the whole smile, with steps scaled to each parameter and kept inside its domain.
 */
import { modelSpec } from './characteristic';
import { smileSlice } from './smile';
import { parametersOf, parameterValue, PARAMETER_SPECS, type Domain } from '../core';
import type { Market, Model } from '../core/types';

export interface ParameterSensitivity {
  parameter: string;
  /** ∂σ/∂p at each log-moneyness point (null where a vol is undefined) */
  dVol: (number | null)[];
}

export function smileSensitivities(
  market: Market,
  model: Model,
  expiry: number,
  logMoneyness: readonly number[],
): ParameterSensitivity[] {
  return parametersOf(model.kind).map((name) => {
    const x = parameterValue(model, name);
    let h = Math.max(1e-4, 1e-3 * Math.abs(x));
    // steps stay inside the parameter's domain (where its formulas hold)
    const { lo, hi }: Domain = PARAMETER_SPECS[name].domain;
    let down = x - h;
    let up = x + h;
    if (down < lo) down = x; // one-sided at a bound
    if (up > hi) up = x;
    if (up === down) h = 0;
    const bumped = (v: number) =>
      smileSlice(modelSpec({ ...model, [name]: v } as Model), market, expiry, logMoneyness)
        .impliedVols;
    const volsUp = bumped(up);
    const volsDown = bumped(down);
    const dVol = volsUp.map((vu, i) => {
      const vd = volsDown[i];
      return vu === null || vd === null || h === 0 ? null : (vu - vd) / (up - down);
    });
    return { parameter: name, dVol };
  });
}

/**
 * The step a trader thinks in, per parameter: one vol point of √v₀, √θ or σ; +0.1 on vol of
 * vol, correlations, intensity and mean reversion; −1 % on the mean jump and +1 % on jump
 * sizes; +5 % on the up probability. `step` is in the parameter's own units (for v₀ and θ, the
 * variance change that moves their square root by 0.01).
 */
export function naturalStep(name: string, value: number): { step: number; label: string } {
  const rootStep = (v: number) => (Math.sqrt(Math.max(0, v)) + 0.01) ** 2 - Math.max(0, v);
  switch (name) {
    case 'v0':
      return { step: rootStep(value), label: '+1 vol pt of √v₀' };
    case 'theta':
      return { step: rootStep(value), label: '+1 vol pt of √θ' };
    case 'sigma':
      return { step: 0.01, label: '+1 vol pt' };
    case 'jumpMean':
      return { step: -0.01, label: '−1 %' };
    case 'jumpStdev':
    case 'upMean':
    case 'downMean':
    case 'varianceJumpMean':
      return { step: 0.01, label: '+1 %' };
    case 'upProbability':
      return { step: 0.05, label: '+0.05' };
    case 'jumpIntensity':
      return { step: 0.1, label: '+0.1 a year' };
    default:
      return { step: 0.1, label: '+0.1' };
  }
}
