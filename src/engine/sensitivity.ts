/**
 * Sensitivity of each smile point to each model parameter: ∂σ_impl/∂p by central differences of
 * the whole smile, with steps scaled to each parameter and kept inside its domain.
 */
import { modelSpec } from './characteristic';
import { smileSlice } from './smile';
import type { Market, Model } from './types';

export interface ParameterSensitivity {
  parameter: string;
  /** ∂σ/∂p at each log-moneyness point (null where a vol is undefined) */
  dVol: (number | null)[];
}

const LOWER_BOUND: Record<string, number> = {
  sigma: 0,
  v0: 0,
  kappa: 0,
  theta: 0,
  volOfVol: 0,
  jumpIntensity: 0,
  jumpStdev: 0,
  upProbability: 0,
  upMean: 0,
  downMean: 0,
  rho: -1,
};
const UPPER_BOUND: Record<string, number> = { rho: 1, upProbability: 1, upMean: 1 };

function parameters(model: Model): string[] {
  return Object.keys(model).filter(
    (k) => k !== 'kind' && typeof (model as unknown as Record<string, unknown>)[k] === 'number',
  );
}

export function smileSensitivities(
  market: Market,
  model: Model,
  expiry: number,
  logMoneyness: readonly number[],
): ParameterSensitivity[] {
  const values = model as unknown as Record<string, number>;
  return parameters(model).map((name) => {
    const x = values[name];
    let h = Math.max(1e-4, 1e-3 * Math.abs(x));
    const lo = LOWER_BOUND[name] ?? -Infinity;
    const hi = UPPER_BOUND[name] ?? Infinity;
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
