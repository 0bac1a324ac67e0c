/** The scenario document's fields in words, for pages that list them (a conflict's differences). */
import { isParameterKey, parameterLabel } from './parameters';
import type { StressField } from './stress-fields';

export const STRESS_LABELS: Record<StressField, string> = {
  jumpIntensityScale: 'Jump intensity (scale)',
  jumpMeanShift: 'Mean jump (shift)',
  jumpStdevScale: 'Jump spread (scale)',
  spotShift: 'Spot gap',
  volOfVolScale: 'Vol of vol (scale)',
  v0Scale: 'Initial variance (scale)',
  eventSizeScale: 'Scheduled moves (scale)',
  varianceJumpScale: 'Variance jump (scale)',
  jumpCorrelationShift: 'Jump correlation (shift)',
};

const FIELDS: Record<string, string> = {
  name: 'Name',
  notes: 'Notes',
  valuationDate: 'Valuation date',
  'market.spot': 'Spot',
  'market.rate': 'Rate (cont.)',
  'market.dividendYield': 'Dividend yield',
  'market.rateCurve': 'Rate curve',
  'market.dividendCurve': 'Dividend curve',
  'model.kind': 'Model',
  'model.events': 'Scheduled moves',
  'model.jumpIntensitySchedule': 'Jump-intensity schedule',
  'grid.expiries': 'Expiries',
  'grid.moneyness': 'Strikes, ln(K/F)',
  'grid.strikeSpacing': 'Strike spacing',
  runs: 'Saved runs',
};

/** "model.jumpIntensity" → "Intensity λ (per year)"; an unknown path is returned as it is. */
export function documentFieldLabel(path: string): string {
  if (FIELDS[path]) return FIELDS[path];
  const [head, key] = path.split('.');
  if (head === 'model' && key && isParameterKey(key)) return parameterLabel(key);
  if (head === 'stress' && key && key in STRESS_LABELS) return STRESS_LABELS[key as StressField];
  return path;
}
