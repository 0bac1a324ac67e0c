/**
 * The Paths page's settings as typed (text), and their translation into validated simulation
 * settings: the form's zod schema outputs what the engine takes.
 */
import { z } from 'zod';
import type { OptionSpec } from '../../engine/core';
import { simulationSettingsSchema } from '../../engine/paths';

export const pathsFormFields = z.object({
  paths: z.string(),
  stepsPerDay: z.string(),
  horizonDays: z.string(),
  seed: z.string(),
  antithetic: z.boolean(),
  scheme: z.enum(['qe', 'euler']),
  /** options at the horizon, strikes as fractions of spot */
  strikes: z.string(),
});
export type PathsForm = z.infer<typeof pathsFormFields>;

export const DEFAULT_PATHS_FORM: PathsForm = {
  paths: '20000',
  stepsPerDay: '1',
  horizonDays: '30',
  seed: String(20261201),
  antithetic: true,
  scheme: 'qe',
  strikes: '0.9, 1, 1.1',
};

/** Text to settings (a put below spot, a call from spot up), then the engine's own checks. */
export const pathsFormSchema = (spot: number) =>
  pathsFormFields
    .transform((form): z.input<typeof simulationSettingsSchema> => {
      const horizon = Number(form.horizonDays) / 365;
      const options: OptionSpec[] = form.strikes
        .split(/[,\s]+/)
        .filter(Boolean)
        .map((m) => ({
          type: Number(m) < 1 ? 'put' : 'call',
          strike: Number(m) * spot,
          expiry: horizon,
        }));
      return {
        horizon,
        stepsPerYear: Number(form.stepsPerDay) * 365,
        paths: Number(form.paths),
        seed: Number(form.seed),
        antithetic: form.antithetic,
        scheme: form.scheme,
        options,
      };
    })
    .pipe(simulationSettingsSchema);

export type PathsSettings = z.output<ReturnType<typeof pathsFormSchema>>;
