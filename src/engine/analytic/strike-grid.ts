/**
 * The strikes a smile is drawn on, per expiry. A scenario's grid is either one list of
 * log-moneyness values shared by every expiry (documents from before the spacing was chosen keep
 * it) or spaced in the expiry's own ATM standard deviations, s = σ_ATM·√T: ±4 s over 41 points,
 * closer together near the money (z = 4·sinh(αx)/sinh(α) for x uniform on [−1, 1]). A one-day
 * panel then spans the few percent a day's options are listed over, and a one-year panel its
 * whole quoted wing.
 */
import { cosStrip, prepareCos } from './cos';
import { roughVariance } from './cumulants';
import { impliedVolFromOtm } from './pricing';
import type { ModelSpec } from './characteristic';

export type StrikeSpacing = 'log-moneyness' | 'standard-deviations';

/** The standard-deviation grid: half-width in ATM standard deviations, points, stretch α. */
export const SD_GRID = { halfWidth: 4, points: 41, stretch: 1.2 } as const;

/** ln(K/F) at ±halfWidth ATM standard deviations, denser near the money; 0 is a point. */
export function standardDeviationGrid(
  atmVol: number,
  expiry: number,
  points: number = SD_GRID.points,
  halfWidth: number = SD_GRID.halfWidth,
): number[] {
  const s = atmVol * Math.sqrt(expiry);
  const alpha = SD_GRID.stretch;
  const middle = (points - 1) / 2;
  return Array.from({ length: points }, (_, i) => {
    if (i === middle) return 0;
    const x = (i - middle) / middle;
    return (s * halfWidth * Math.sinh(alpha * x)) / Math.sinh(alpha);
  });
}

/** ATM (at the forward) implied vol of the model at T; the rough total vol where undefined. */
export function atmVolAt(spec: ModelSpec, expiry: number): number {
  const prep = prepareCos(spec, expiry);
  const one = () => new Float64Array(1);
  const call = one();
  const put = one();
  cosStrip(prep, [0], call, put, one(), one());
  const vol = impliedVolFromOtm(call[0], 0, expiry);
  return vol ?? Math.sqrt(roughVariance(spec, expiry) / expiry);
}

/** Each expiry's ln(K/F) list for a scenario grid. */
export function strikeGrids(
  spec: ModelSpec,
  expiries: readonly number[],
  moneyness: readonly number[],
  spacing: StrikeSpacing = 'log-moneyness',
): number[][] {
  if (spacing === 'log-moneyness') return expiries.map(() => [...moneyness]);
  return expiries.map((T) => standardDeviationGrid(atmVolAt(spec, T), T));
}
