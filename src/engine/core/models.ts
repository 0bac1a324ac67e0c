/** What every layer asks of a model, answered from the registry rather than by its kind. */
import { MODEL_REGISTRY, parametersIn, parametersOf, type ModelKind } from './model-registry';
import type { ModelSpec } from './model-spec';
import { PARAMETER_SPECS, type ParameterKey } from './parameters';
import type { Model, ModelOf } from './types';

/** The model as a diffusion and a jump law, for the characteristic function and the paths. */
export function modelSpec(model: Model): ModelSpec {
  const spec: ModelSpec = MODEL_REGISTRY[model.kind].spec(model);
  if (model.events?.length) spec.events = model.events;
  if (model.jumpIntensitySchedule?.length) spec.intensitySchedule = model.jumpIntensitySchedule;
  return spec;
}

/** A parameter's value (the caller knows the kind takes it). */
export const parameterValue = (model: Model, key: ParameterKey): number => model[key] as number;

/** Whether the kind's variance is stochastic (a Heston variance), not a constant vol. */
export const hasStochasticVariance = (kind: ModelKind): boolean =>
  parametersIn(kind, 'variance').length > 0;

/** Whether the kind has a jump part. */
export const hasJumps = (kind: ModelKind): boolean => parametersIn(kind, 'jumps').length > 0;

/** The jump arrival rate per year after any schedule, 0 for a kind without jumps. */
export function jumpIntensityOf(model: Model): number {
  const jumps = modelSpec(model).jumps;
  return jumps.type === 'none' ? 0 : jumps.jumpIntensity;
}

/** A kind's parameters from the given values, in the registry's order; the rest are filled. */
export function modelFrom<K extends ModelKind>(
  kind: K,
  values: Readonly<Record<string, unknown>>,
  fill: (key: ParameterKey) => number,
): ModelOf<K> {
  const m: Record<string, unknown> = { kind };
  for (const p of parametersOf(kind)) m[p] = typeof values[p] === 'number' ? values[p] : fill(p);
  return m as ModelOf<K>;
}

/** A kind with every parameter at its default. */
export const defaultModel = <K extends ModelKind>(kind: K): ModelOf<K> =>
  modelFrom(kind, {}, (p) => PARAMETER_SPECS[p].default);

/**
 * Switching kind keeps every parameter the two kinds share and fills in the rest from the
 * defaults; a constant vol σ and a Heston variance carry over as σ = √v₀ and v₀ = θ = σ².
 */
export function convertModel<K extends ModelKind>(model: Model, kind: K): ModelOf<K> {
  const carried: Record<string, unknown> = { ...model };
  if (hasStochasticVariance(model.kind)) carried.sigma = Math.sqrt(model.v0 as number);
  else if (typeof model.sigma === 'number') {
    carried.v0 = model.sigma ** 2;
    carried.theta = model.sigma ** 2;
  }
  const out: Record<string, unknown> = modelFrom(kind, carried, (p) => PARAMETER_SPECS[p].default);
  // dated risk rides along; an intensity schedule only where the new kind has jumps
  if (model.events) out.events = model.events;
  if (model.jumpIntensitySchedule && hasJumps(kind))
    out.jumpIntensitySchedule = model.jumpIntensitySchedule;
  return out as ModelOf<K>;
}

/** A constant vol and no jumps: Black-Scholes, priced in closed form. */
export const isBlackScholes = (spec: ModelSpec): boolean =>
  spec.diffusion.type === 'constant' && spec.jumps.type === 'none' && !spec.events?.length;
