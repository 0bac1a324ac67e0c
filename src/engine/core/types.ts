/**
 * Shared engine types, derived from the schemas. Times are year fractions (ACT/365); rates
 * continuously compounded.
 */
import type { z } from 'zod';
import type { ModelKind } from './model-registry';
import type { marketSchema, modelSchema } from './schema';

export type { ModelKind } from './model-registry';
export { MODEL_KINDS } from './model-registry';

/** A zero-rate curve as [t, r] pairs, t in years, r continuously compounded. */
export type Curve = ReadonlyArray<readonly [number, number]>;

export type Market = z.infer<typeof marketSchema>;

/** A model: its `kind` and that kind's parameters (`model-registry.ts`). */
export type Model = z.infer<typeof modelSchema>;
export type ModelOf<K extends ModelKind> = Extract<Model, { kind: K }>;

export type OptionType = 'call' | 'put';

export interface OptionSpec {
  type: OptionType;
  strike: number;
  /** years */
  expiry: number;
}
