/**
 * Calibration parameters: bounds, the logistic map that keeps every trial inside them
 * (x = lo + (hi − lo)/(1 + e^{−z})), plausible boxes for starting points, and a Halton sequence
 * (low-discrepancy, Halton 1960) to spread those starts.
 */
import { modelFrom, parametersOf, PARAMETER_SPECS, type FitBox } from '../core';
import type { Model, ModelKind } from '../core/types';
import { EVENT_SIZE_BOX, eventSize, eventSizeIndex, withEventSize } from './event-sizes';

/** A parameter's calibration box (from the parameter table). */
export type Bound = FitBox;

/** Every parameter's calibration box, by name. */
export const BOUNDS: Record<string, Bound> = Object.fromEntries(
  Object.entries(PARAMETER_SPECS).map(([key, spec]) => [key, spec.fit]),
);

export const toUnbounded = (x: number, b: Bound) => {
  const u = Math.min(1 - 1e-12, Math.max(1e-12, (x - b.lo) / (b.hi - b.lo)));
  return Math.log(u / (1 - u));
};
export const toBounded = (z: number, b: Bound) => b.lo + (b.hi - b.lo) / (1 + Math.exp(-z));

/** Whether x sits within 0.1 % of the width of either bound. */
export const onBound = (x: number, b: Bound) =>
  (x - b.lo) / (b.hi - b.lo) < 1e-3 || (b.hi - x) / (b.hi - b.lo) < 1e-3;

const PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31];

/** Point `index` (1-based) of the Halton sequence in `dims` dimensions. */
export function halton(index: number, dims: number): number[] {
  return Array.from({ length: dims }, (_, d) => {
    const base = PRIMES[d];
    let f = 1;
    let r = 0;
    let i = index;
    while (i > 0) {
      f /= base;
      r += f * (i % base);
      i = Math.floor(i / base);
    }
    return r;
  });
}

/** The free parameters of a model kind, less the fixed ones. */
export function freeParameters(kind: ModelKind, fixed: readonly string[]): string[] {
  return parametersOf(kind).filter((p) => !fixed.includes(p));
}

/** The box of a calibration coordinate: a model parameter, or a scheduled move's size. */
export const boundOf = (name: string): Bound =>
  eventSizeIndex(name) === null ? BOUNDS[name] : EVENT_SIZE_BOX;

/** The value of a calibration coordinate in a model. */
export function coordinateValue(model: Model, name: string): number {
  const i = eventSizeIndex(name);
  if (i === null) return model[name as keyof Model] as number;
  const e = model.events?.[i];
  if (!e) throw new RangeError(`the model has no event ${i}`);
  return eventSize(e);
}

export function withParameters(
  model: Model,
  names: readonly string[],
  values: ArrayLike<number>,
): Model {
  let m: Record<string, unknown> = { ...model };
  names.forEach((n, i) => {
    const e = eventSizeIndex(n);
    if (e === null) m[n] = values[i];
    else m = withEventSize(m as Model, e, values[i]);
  });
  return m as Model;
}

/** A full starting guess: the caller's values, typical ones for the parameters not given. */
export function completeGuess(kind: ModelKind, given: Record<string, unknown>): Model {
  const m: Record<string, unknown> = modelFrom(kind, given, (p) => PARAMETER_SPECS[p].fit.guess);
  // dated risk is part of the guess as given
  if (given.events !== undefined) m.events = given.events;
  if (given.jumpIntensitySchedule !== undefined)
    m.jumpIntensitySchedule = given.jumpIntensitySchedule;
  return m as Model;
}
