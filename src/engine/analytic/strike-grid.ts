/**
 * The strikes a smile is drawn on, per expiry. A scenario's grid is either one list of
 * log-moneyness values shared by every expiry (documents from before the spacing was chosen keep
 * it) or spaced in the expiry's own ATM standard deviations, s = σ_ATM·√T: ±4 s over 41 points,
 * closer together near the money (z = 4·sinh(αx)/sinh(α) for x uniform on [−1, 1]). A one-day
 * panel then spans the few percent a day's options are listed over, and a one-year panel its
 * whole quoted wing.
 */
import { roughVariance } from './cumulants';
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

/**
 * One expiry's ln(K/F) list: the scenario's own list, or the standard-deviation grid around the
 * expiry's ATM vol (the rough total vol where that is not defined).
 */
export function expiryGrid(
  spec: ModelSpec,
  expiry: number,
  atmVol: number | null,
  moneyness: readonly number[],
  spacing: StrikeSpacing,
): readonly number[] {
  if (spacing === 'log-moneyness') return moneyness;
  const vol = atmVol ?? Math.sqrt(roughVariance(spec, expiry) / expiry);
  return standardDeviationGrid(vol, expiry);
}
