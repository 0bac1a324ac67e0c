/** Switching model kind keeps every parameter the two kinds share and fills in the rest. */
import type { Model, ModelKind } from '../../engine/types';

const DEFAULTS = {
  sigma: 0.2,
  v0: 0.04,
  kappa: 1.5,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.1,
  jumpStdev: 0.15,
  upProbability: 0.3,
  upMean: 0.05,
  downMean: 0.08,
};

export const KIND_LABELS: Record<ModelKind, string> = {
  'black-scholes': 'Black-Scholes',
  heston: 'Heston',
  merton: 'Merton jumps',
  bates: 'Bates (Heston + Merton jumps)',
  'heston-kou': 'Heston + double-exponential jumps',
};

export function convertModel(model: Model, kind: ModelKind): Model {
  const m = { ...DEFAULTS, ...(model as Partial<typeof DEFAULTS>) };
  if (model.kind === 'heston' || model.kind === 'bates' || model.kind === 'heston-kou') {
    m.sigma = Math.sqrt(model.v0);
  } else if (model.kind === 'black-scholes' || model.kind === 'merton') {
    m.v0 = model.sigma ** 2;
    m.theta = model.sigma ** 2;
  }
  const heston = { v0: m.v0, kappa: m.kappa, theta: m.theta, volOfVol: m.volOfVol, rho: m.rho };
  const merton = { jumpIntensity: m.jumpIntensity, jumpMean: m.jumpMean, jumpStdev: m.jumpStdev };
  switch (kind) {
    case 'black-scholes':
      return { kind, sigma: m.sigma };
    case 'heston':
      return { kind, ...heston };
    case 'merton':
      return { kind, sigma: m.sigma, ...merton };
    case 'bates':
      return { kind, ...heston, ...merton };
    case 'heston-kou':
      return {
        kind,
        ...heston,
        jumpIntensity: m.jumpIntensity,
        upProbability: m.upProbability,
        upMean: m.upMean,
        downMean: m.downMean,
      };
  }
}
