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
