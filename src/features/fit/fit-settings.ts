/** The Fit page's settings: which model to fit, what to hold fixed, how to weight the quotes. */
import { z } from 'zod';
import { MODEL_KINDS, type ModelKind } from '../../engine/core';

/** The kinds worth calibrating (Black-Scholes has one number and no smile to fit). */
export const FIT_KINDS: ModelKind[] = MODEL_KINDS.filter((k) => k !== 'black-scholes');

export const fitSettingsSchema = z.object({
  kind: z.enum(MODEL_KINDS as [ModelKind, ...ModelKind[]]),
  weights: z.enum(['uniform', 'vega']),
  fixed: z.array(z.string()),
});

export type FitSettings = z.infer<typeof fitSettingsSchema>;

export const DEFAULT_FIT_SETTINGS: FitSettings = { kind: 'bates', weights: 'uniform', fixed: [] };
