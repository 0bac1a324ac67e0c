/** The Fit page's settings: which model to fit, what to hold fixed, how to weight the quotes. */
import { z } from 'zod';
import { isoDateSchema, MODEL_KINDS, type ModelKind } from '../../engine/core';

/** The kinds worth calibrating (Black-Scholes has one number and no smile to fit). */
export const FIT_KINDS: ModelKind[] = MODEL_KINDS.filter((k) => k !== 'black-scholes');

export const fitSettingsSchema = z.object({
  kind: z.enum(MODEL_KINDS as [ModelKind, ...ModelKind[]]),
  weights: z.enum(['uniform', 'vega']),
  fixed: z.array(z.string()),
  /** fit the sizes of the scenario's scheduled moves too */
  fitEventSizes: z.boolean(),
  /** the comparison also tries Heston with one scheduled move on this date ('' for none) */
  moveDate: z.union([z.literal(''), isoDateSchema]),
  /** weight of the penalty on the change from the last fit in the history (0: none) */
  anchorWeight: z.number({ error: 'must be a number' }).min(0, 'must be 0 or more').max(1e6),
});

export type FitSettings = z.infer<typeof fitSettingsSchema>;

export const DEFAULT_FIT_SETTINGS: FitSettings = {
  kind: 'bates',
  weights: 'uniform',
  fixed: [],
  fitEventSizes: false,
  moveDate: '',
  anchorWeight: 0,
};
