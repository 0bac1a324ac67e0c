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
  // ∫₀^∞ Re(e^{−iuk} φ(u − i/2)) / (u² + ¼) du
  const integral = fourierIntegral(spec, expiry, 0.5, k, (u) => 1 / (u * u + 0.25));
  const callValue = df * (F - (Math.sqrt(F * strike) / Math.PI) * integral);
  return type === 'call' ? callValue : callValue - df * (F - strike);
}

/**
 * The density of Y = ln(S_T/F_T) at k by Fourier inversion, f(k) = (1/π) ∫₀^∞ Re(e^{−iuk} φ(u)) du
 * (Gil-Pelaez 1951), on the same panels: an independent check of the COS density, and so of
 * gamma, which is DF·K·f(k)/S².
 */
export function lewisDensity(model: Model, k: number, expiry: number): number {
  return fourierIntegral(modelSpec(model), expiry, 0, k, () => 1) / Math.PI;
}

/**
 * ∫₀^∞ Re(e^{−iuk} φ(u − i·shift))·weight(u) du: the upper limit where the integrand is
 * negligible, then Gauss-Legendre panels doubled until two passes agree.
 */
function fourierIntegral(
  spec: ReturnType<typeof modelSpec>,
  expiry: number,
  shift: number,
  k: number,
  weight: (u: number) => number,
): number {
  const integrand = (u: Float64Array, out: Float64Array) => {
    const n = u.length;
    const wr = new Float64Array(n).fill(shift);
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    logCharacteristic(spec, expiry, wr, u, re, im, n);
    for (let j = 0; j < n; j++)
      out[j] = Math.exp(re[j]) * Math.cos(im[j] - u[j] * k) * weight(u[j]);
  };
  // Upper limit: where |φ(u − i·shift)|·weight(u)·u is negligible (the modulus, so that a
  // zero of the cosine cannot end it early)
  let upper = 50;
  const probe = new Float64Array(1);
  const probeShift = Float64Array.of(shift);
  const logModulus = new Float64Array(1);
  const phase = new Float64Array(1);
  for (let it = 0; it < 60; it++) {
    probe[0] = upper;
    logCharacteristic(spec, expiry, probeShift, probe, logModulus, phase, 1);
    if (Math.exp(logModulus[0]) * weight(upper) * upper < 1e-18) break;
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
  return previous;
}
