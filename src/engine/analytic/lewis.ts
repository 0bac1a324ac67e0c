/**
 * Independent pricer for validation: the Lewis (2001) single-integral formula
 *   C = DF·[F − (√(FK)/π) ∫₀^∞ Re(e^{−iuk} φ(u − i/2)) / (u² + ¼) du],   k = ln(K/F),
 * integrated with composite Gauss-Legendre panels, doubled until two passes agree. Slow, but
 * shares nothing with the COS pricer except the characteristic function.
 */
import { logCharacteristic, modelSpec } from './characteristic';
import { discountFactor, forwardPrice } from '../core/market';
import type { Market, Model, OptionType } from '../core/types';

/** Gauss-Legendre nodes and weights on [−1, 1] by Newton iteration on P_n. */
export function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

const RULE = gaussLegendre(24);

function integrate(
  f: (u: Float64Array, out: Float64Array) => void,
  upper: number,
  panels: number,
): number {
  const n = RULE.x.length;
  const u = new Float64Array(n * panels);
  const h = upper / panels;
  for (let p = 0; p < panels; p++) {
    for (let i = 0; i < n; i++) u[p * n + i] = h * (p + 0.5 * (RULE.x[i] + 1));
  }
  const out = new Float64Array(u.length);
  f(u, out);
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    for (let i = 0; i < n; i++) sum += RULE.w[i] * out[p * n + i];
  }
  return 0.5 * h * sum;
}

export function lewisPrice(
  market: Market,
  model: Model,
  type: OptionType,
  strike: number,
  expiry: number,
): number {
  const spec = modelSpec(model);
  const F = forwardPrice(market, expiry);
  const df = discountFactor(market, expiry);
  const k = Math.log(strike / F);
  const integrand = (u: Float64Array, out: Float64Array) => {
    const n = u.length;
    const wr = new Float64Array(n).fill(0.5);
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    logCharacteristic(spec, expiry, wr, u, re, im, n);
    for (let j = 0; j < n; j++) {
      const m = Math.exp(re[j]);
      out[j] = (m * Math.cos(im[j] - u[j] * k)) / (u[j] * u[j] + 0.25);
    }
  };
  // Upper limit: where |φ(u − i/2)| / u² is negligible.
  let upper = 50;
  for (let it = 0; it < 60; it++) {
    const probe = new Float64Array([upper]);
    const val = new Float64Array(1);
    integrand(probe, val);
    if (Math.abs(val[0]) * upper < 1e-18) break;
    upper *= 1.5;
  }
  let panels = 16;
  let previous = integrate(integrand, upper, panels);
  for (let it = 0; it < 12; it++) {
    panels *= 2;
    const next = integrate(integrand, upper, panels);
    const done = Math.abs(next - previous) < 5e-14 * Math.max(1, Math.abs(next));
    previous = next;
    if (done) break;
  }
  const callValue = df * (F - (Math.sqrt(F * strike) / Math.PI) * previous);
  return type === 'call' ? callValue : callValue - df * (F - strike);
}
