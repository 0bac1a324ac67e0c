/**
 * Many strikes at one expiry, cheaply: COS values on a uniform log-moneyness grid, then quintic
 * Hermite interpolation using the put's value and its first two k-derivatives, all of which the
 * COS strip gives exactly (P' = e^k·CDF, P'' = e^k·(CDF + density)). The grid step is the
 * diffusive standard deviation over 16 (measured error at most 6e-11 per unit forward from
 * 1 day to 1 year); when the grid would not be smaller than the strike list, the strikes are
 * priced directly.
 */
import { cosStrip, type CosExpiry } from './cos';

export function putsByInterpolation(prep: CosExpiry, ks: Float64Array, put: Float64Array): void {
  const n = ks.length;
  let kMin = Infinity;
  let kMax = -Infinity;
  for (let i = 0; i < n; i++) {
    kMin = Math.min(kMin, ks[i]);
    kMax = Math.max(kMax, ks[i]);
  }
  const sd = Math.sqrt(Math.max(1e-16, Math.min(prep.variance, prep.diffusionVariance)));
  const h = sd / 16;
  const cells = Math.ceil((kMax - kMin) / h) + 1;
  if (!(cells + 1 < n) || !Number.isFinite(cells)) {
    const call = new Float64Array(n);
    cosStrip(prep, ks, call, put, new Float64Array(n), new Float64Array(n));
    return;
  }
  const m = cells + 1;
  const grid = new Float64Array(m);
  for (let i = 0; i < m; i++) grid[i] = kMin + i * h;
  const gCall = new Float64Array(m);
  const gPut = new Float64Array(m);
  const gCdf = new Float64Array(m);
  const gDen = new Float64Array(m);
  cosStrip(prep, grid, gCall, gPut, gCdf, gDen);
  for (let i = 0; i < n; i++) {
    const x = (ks[i] - kMin) / h;
    const c = Math.min(cells - 1, Math.max(0, Math.floor(x)));
    const t = x - c;
    const e0 = Math.exp(grid[c]);
    const e1 = Math.exp(grid[c + 1]);
    const f0 = gPut[c];
    const f1 = gPut[c + 1];
    const d0 = h * e0 * gCdf[c];
    const d1 = h * e1 * gCdf[c + 1];
    const s0 = h * h * e0 * (gCdf[c] + gDen[c]);
    const s1 = h * h * e1 * (gCdf[c + 1] + gDen[c + 1]);
    const t2 = t * t;
    const t3 = t2 * t;
    const t4 = t3 * t;
    const t5 = t4 * t;
    put[i] = Math.max(
      0,
      f0 * (1 - 10 * t3 + 15 * t4 - 6 * t5) +
        d0 * (t - 6 * t3 + 8 * t4 - 3 * t5) +
        s0 * 0.5 * (t2 - 3 * t3 + 3 * t4 - t5) +
        f1 * (10 * t3 - 15 * t4 + 6 * t5) +
        d1 * (-4 * t3 + 7 * t4 - 3 * t5) +
        s1 * 0.5 * (t3 - 2 * t4 + t5),
    );
  }
}
