/** The stress a scenario layers on its base parameters: its fields and their neutral values. */

/** Scales multiply, shifts add; the spot shift is a relative move (−0.2 is a 20 % fall). */
export const STRESS_FIELDS = [
  'jumpIntensityScale',
  'jumpMeanShift',
  'jumpStdevScale',
  'spotShift',
  'volOfVolScale',
  'v0Scale',
  'eventSizeScale',
  'varianceJumpScale',
  'jumpCorrelationShift',
] as const;

export type StressField = (typeof STRESS_FIELDS)[number];
export type Stress = Record<StressField, number>;

export const NO_STRESS: Stress = {
  jumpIntensityScale: 1,
  jumpMeanShift: 0,
  jumpStdevScale: 1,
  spotShift: 0,
  volOfVolScale: 1,
  v0Scale: 1,
  eventSizeScale: 1,
  varianceJumpScale: 1,
  jumpCorrelationShift: 0,
};
