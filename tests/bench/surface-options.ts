/** The benchmarks' 328-option surface: 8 expiries × 41 strikes within ±3.5 s.d. of the forward. */
import { forwardPrice, type Market, type OptionSpec } from '../../src/engine/core';

export const SURFACE_DAYS = [1, 7, 14, 30, 61, 91, 182, 365];

export function surfaceOptions(market: Market): OptionSpec[] {
  return SURFACE_DAYS.flatMap((d) => {
    const T = d / 365;
    const sd = 0.2 * Math.sqrt(T);
    return Array.from({ length: 41 }, (_, i) => {
      const k = sd * (-3.5 + (7 * i) / 40);
      return {
        type: k < 0 ? ('put' as const) : ('call' as const),
        strike: forwardPrice(market, T) * Math.exp(k),
        expiry: T,
      };
    });
  });
}
