/**
 * Stress: shocks layered on a scenario's base parameters. Scales multiply, shifts add; the
 * spot shift is a relative move (−0.2 is a 20 % fall). A stressed set that leaves the model's
 * domain is reported, never clipped.
 */
import { validateModel, type FieldIssue } from './validate-model';
import type { Market, Model } from './types';

export interface Stress {
  jumpIntensityScale: number;
  jumpMeanShift: number;
  jumpStdevScale: number;
  spotShift: number;
  volOfVolScale: number;
  v0Scale: number;
}

export const NO_STRESS: Stress = {
  jumpIntensityScale: 1,
  jumpMeanShift: 0,
  jumpStdevScale: 1,
  spotShift: 0,
  volOfVolScale: 1,
  v0Scale: 1,
};

export function isIdentityStress(s: Partial<Stress> | undefined): boolean {
  if (!s) return true;
  const full = { ...NO_STRESS, ...s };
  return (Object.keys(NO_STRESS) as (keyof Stress)[]).every((k) => full[k] === NO_STRESS[k]);
}

export interface StressedScenario {
  market: Market;
  model: Model;
  issues: FieldIssue[];
}

/**
 * Applies a stress. For the double-exponential law the mean-jump shift moves the mean
 * log-jump p·upMean − (1−p)·downMean by the shift: a fall deepens downMean by
 * −shift/(1−p), a rise lengthens upMean by shift/p; the spread scale multiplies both means.
 */
export function applyStress(
  market: Market,
  model: Model,
  stress: Partial<Stress>,
): StressedScenario {
  const s = { ...NO_STRESS, ...stress };
  const stressedMarket: Market = { ...market, spot: market.spot * (1 + s.spotShift) };
  let m: Model;
  switch (model.kind) {
    case 'black-scholes':
      m = { ...model };
      break;
    case 'heston':
      m = { ...model, v0: model.v0 * s.v0Scale, volOfVol: model.volOfVol * s.volOfVolScale };
      break;
    case 'merton':
      m = {
        ...model,
        jumpIntensity: model.jumpIntensity * s.jumpIntensityScale,
        jumpMean: model.jumpMean + s.jumpMeanShift,
        jumpStdev: model.jumpStdev * s.jumpStdevScale,
      };
      break;
    case 'bates':
      m = {
        ...model,
        v0: model.v0 * s.v0Scale,
        volOfVol: model.volOfVol * s.volOfVolScale,
        jumpIntensity: model.jumpIntensity * s.jumpIntensityScale,
        jumpMean: model.jumpMean + s.jumpMeanShift,
        jumpStdev: model.jumpStdev * s.jumpStdevScale,
      };
      break;
    case 'heston-kou': {
      const shift = s.jumpMeanShift;
      const p = model.upProbability;
      let upMean = model.upMean;
      let downMean = model.downMean;
      if (shift < 0 && p < 1) downMean += -shift / (1 - p);
      if (shift > 0 && p > 0) upMean += shift / p;
      m = {
        ...model,
        v0: model.v0 * s.v0Scale,
        volOfVol: model.volOfVol * s.volOfVolScale,
        jumpIntensity: model.jumpIntensity * s.jumpIntensityScale,
        upMean: upMean * s.jumpStdevScale,
        downMean: downMean * s.jumpStdevScale,
      };
      break;
    }
  }
  const issues: FieldIssue[] = [];
  if (!(stressedMarket.spot > 0)) {
    issues.push({ path: 'stress.spotShift', message: 'the stressed spot must stay above zero' });
  }
  for (const issue of validateModel(m)) {
    issues.push({ path: `stress → model.${issue.path}`, message: issue.message });
  }
  return { market: stressedMarket, model: m, issues };
}
