/** Fixed-bin histograms of simulated values, filled block by block in the hot loop. */
import { roughVariance } from '../analytic/cumulants';
import { modelSpec } from '../core/models';
import type { Model } from '../core/types';

export interface HistogramSpec {
  lo: number;
  hi: number;
  bins: number;
}

/** Fixed bins for ln(S_T/S_0): the same for every block, so counts add exactly. */
export function terminalBins(model: Model, horizon: number, bins = 80): HistogramSpec {
  const sd = Math.sqrt(roughVariance(modelSpec(model), horizon));
  return { lo: -6 * sd, hi: 4 * sd, bins };
}

export function histogramInto(counts: Uint32Array, spec: HistogramSpec, x: number): void {
  const i = Math.floor(((x - spec.lo) / (spec.hi - spec.lo)) * spec.bins);
  if (i >= 0 && i < spec.bins) counts[i]++;
}
