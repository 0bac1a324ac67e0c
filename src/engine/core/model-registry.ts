/**
 * The model registry: one entry per model kind, the only place that knows what a kind is.
 * It lists the kind's parameters in groups (variance or diffusion, jumps), its name in words,
 * and how it maps onto a diffusion and a jump law (`model-spec.ts`), from which the analytic
 * layer builds the characteristic function. The schema, the form, calibration, stress and the
 * CLI read from here. To add a kind, see DEVELOPERS.md ("Adding a model").
 */
import {
  constantDiffusion,
  doubleExponentialJumps,
  hestonDiffusion,
  lognormalJumps,
  priceVarianceJumps,
  NO_JUMPS,
  type ModelSpec,
  type ParameterValues,
} from './model-spec';
import { expectedVarianceJump } from './jump-summary';
import { PARAMETER_SPECS, type ParameterKey, type ParameterSpec } from './parameters';
import type { Stress } from './stress-fields';

export interface ParameterGroup {
  /** what the group moves: the diffusion's constant vol, the stochastic variance, the jumps */
  role: 'diffusion' | 'variance' | 'jumps';
  /** the form's heading */
  title: string;
  parameters: readonly ParameterKey[];
}

export interface ModelEntry {
  /** the kind in words, as menus show it */
  label: string;
  /** the kind's short name, for buttons and titles */
  shortLabel: string;
  groups: readonly ParameterGroup[];
  spec: (p: ParameterValues) => ModelSpec;
  /**
   * A stress of the jump law that the per-parameter rules (`ParameterSpec.stress`) cannot say;
   * returns the parameters it changes.
   */
  stressJumps?: (p: ParameterValues, s: Stress) => Record<string, number>;
  /** a condition across parameters that their domains cannot say: the bad field and why */
  check?: (p: ParameterValues) => { path: string; message: string } | null;
}

const HESTON = ['v0', 'kappa', 'theta', 'volOfVol', 'rho'] as const;
const LOGNORMAL_JUMPS = ['jumpIntensity', 'jumpMean', 'jumpStdev'] as const;

const variance = { role: 'variance', title: 'Variance', parameters: HESTON } as const;
const lognormal = {
  role: 'jumps',
  title: 'Jumps (lognormal)',
  parameters: LOGNORMAL_JUMPS,
} as const;

export const MODEL_REGISTRY = {
  'black-scholes': {
    label: 'Black-Scholes (constant volatility)',
    shortLabel: 'Black-Scholes',
    groups: [{ role: 'diffusion', title: 'Diffusion', parameters: ['sigma'] }],
    spec: (p) => ({ diffusion: constantDiffusion(p), jumps: NO_JUMPS }),
  },
  heston: {
    label: 'Heston (stochastic variance)',
    shortLabel: 'Heston',
    groups: [variance],
    spec: (p) => ({ diffusion: hestonDiffusion(p), jumps: NO_JUMPS }),
  },
  merton: {
    label: 'Merton (lognormal jumps)',
    shortLabel: 'Merton',
    groups: [{ role: 'diffusion', title: 'Diffusion', parameters: ['sigma'] }, lognormal],
    spec: (p) => ({ diffusion: constantDiffusion(p), jumps: lognormalJumps(p) }),
  },
  bates: {
    label: 'Bates (Heston + lognormal jumps)',
    shortLabel: 'Bates',
    groups: [variance, lognormal],
    spec: (p) => ({ diffusion: hestonDiffusion(p), jumps: lognormalJumps(p) }),
  },
  'heston-kou': {
    label: 'Heston-Kou (Heston + double-exponential jumps)',
    shortLabel: 'Heston-Kou',
    groups: [
      variance,
      {
        role: 'jumps',
        title: 'Jumps (double-exponential)',
        parameters: ['jumpIntensity', 'upProbability', 'upMean', 'downMean'],
      },
    ],
    spec: (p) => ({ diffusion: hestonDiffusion(p), jumps: doubleExponentialJumps(p) }),
    // The mean-jump shift moves the mean log-jump p·upMean − (1−p)·downMean by the shift:
    // a fall deepens downMean by −shift/(1−p), a rise lengthens upMean by shift/p; the
    // spread scale multiplies both means.
    stressJumps: (p, s) => {
      const shift = s.jumpMeanShift;
      const up = p.upProbability as number;
      let upMean = p.upMean as number;
      let downMean = p.downMean as number;
      if (shift < 0 && up < 1) downMean += -shift / (1 - up);
      if (shift > 0 && up > 0) upMean += shift / up;
      return { upMean: upMean * s.jumpStdevScale, downMean: downMean * s.jumpStdevScale };
    },
  },
  svcj: {
    label: 'SVCJ (Heston + jumps in price and variance)',
    shortLabel: 'SVCJ',
    groups: [
      variance,
      {
        role: 'jumps',
        title: 'Jumps (price and variance together)',
        parameters: [...LOGNORMAL_JUMPS, 'varianceJumpMean', 'jumpCorrelation'],
      },
    ],
    spec: (p) => ({ diffusion: hestonDiffusion(p), jumps: priceVarianceJumps(p) }),
    // a spot gap is read as one jump of that size: the variance gains what such a jump brings
    // on average, E[Z_V | Z_S = ln(1 + gap)]
    stressJumps: (p, s): Record<string, number> =>
      s.spotShift === 0
        ? {}
        : {
            v0:
              (p.v0 as number) * s.v0Scale +
              expectedVarianceJump(
                {
                  jumpMean: (p.jumpMean as number) + s.jumpMeanShift,
                  jumpStdev: (p.jumpStdev as number) * s.jumpStdevScale,
                  varianceJumpMean: (p.varianceJumpMean as number) * s.varianceJumpScale,
                  jumpCorrelation: (p.jumpCorrelation as number) + s.jumpCorrelationShift,
                },
                Math.log1p(s.spotShift),
              ),
          },
    // E[e^{Z_S}] = e^{μS + σS²/2}/(1 − ρJ·μV) is finite only while ρJ·μV < 1
    check: (p) =>
      (p.jumpCorrelation as number) * (p.varianceJumpMean as number) < 1
        ? null
        : {
            path: 'jumpCorrelation',
            message: 'jump correlation × mean variance jump must be below 1',
          },
  },
} as const satisfies Record<string, ModelEntry>;

export type ModelKind = keyof typeof MODEL_REGISTRY;

/** The kinds in the order the product lists them. */
export const MODEL_KINDS = Object.keys(MODEL_REGISTRY) as ModelKind[];

/** The parameter names of one kind, in the registry's order. */
export type ParametersOf<K extends ModelKind> =
  (typeof MODEL_REGISTRY)[K]['groups'][number]['parameters'][number];

export const modelEntry = (kind: ModelKind): ModelEntry => MODEL_REGISTRY[kind];

export const isModelKind = (kind: unknown): kind is ModelKind =>
  typeof kind === 'string' && Object.hasOwn(MODEL_REGISTRY, kind);

/** Every parameter of a kind, group by group: the order of calibration vectors. */
export function parametersOf(kind: ModelKind): ParameterKey[] {
  return modelEntry(kind).groups.flatMap((g) => g.parameters);
}

/** The parameters of a kind's groups of one role. */
export function parametersIn(kind: ModelKind, role: ParameterGroup['role']): ParameterKey[] {
  return modelEntry(kind)
    .groups.filter((g) => g.role === role)
    .flatMap((g) => g.parameters);
}

export const modelLabel = (kind: ModelKind): string => modelEntry(kind).label;
export const modelShortLabel = (kind: ModelKind): string => modelEntry(kind).shortLabel;

/** The stress fields that move a kind's parameters (the spot gap moves every kind). */
export function stressFieldsOf(kind: ModelKind): (keyof Stress)[] {
  const fields = new Set<keyof Stress>(['spotShift']);
  for (const p of parametersOf(kind)) {
    const rule = (PARAMETER_SPECS[p] as ParameterSpec).stress;
    if (rule) fields.add(rule.field);
  }
  return [...fields];
}
