/**
 * The model's value and delta of a set of European legs on a grid of rebalance times × variance
 * × log-spot, so a hedge replay looks the model delta up on every path and step instead of
 * pricing afresh. For each (time, variance, expiry) one COS preparation prices every spot node;
 * spot nodes span ±8 standard deviations of the remaining time around the strikes, and lookups
 * are cubic (Catmull-Rom) in log-spot and in √variance. Beyond the nodes the edge delta is
 * held and the value extended linearly. Gamma is the slope of the interpolated delta in spot;
 * vega is the slope of the interpolated value in √variance, or, for a model whose variance is
 * constant, a central difference of two more slices at σ ± 0.01.
 */
import { modelSpec } from '../analytic/characteristic';
import { cosStrip, DEFAULT_COS_SETTINGS, prepareCos } from '../analytic/cos';
import { roughVariance } from '../analytic/cumulants';
import { discountFactor, forwardPrice } from '../core/market';
import { hasStochasticVariance, parameterValue } from '../core/models';
import { specFrom, type ModelSpec } from '../core/model-spec';
import type { Market, Model, OptionSpec } from '../core/types';

export interface Leg extends OptionSpec {
  quantity: number;
}

export interface HedgeTable {
  times: Float64Array;
  variances: Float64Array;
  /** per time: the first log-spot node ln(S/S0) and the spacing */
  x0: Float64Array;
  dx: Float64Array;
  nx: number;
  /** [time][variance][x]: Σ q·value and Σ q·∂value/∂S over the legs alive after that time */
  value: Float64Array;
  delta: Float64Array;
  /** [time][x]: Σ q·∂value/∂σ for a model with constant variance, when asked for */
  vega?: Float64Array;
}

/** The bump of σ for the vega of a constant-variance model (central difference). */
const VEGA_BUMP = 0.01;

/**
 * A table's series are 100 times looser than a price's in every tolerance: its bicubic lookup
 * is within 2e-3 of direct pricing, far above either.
 */
const HEDGE_COS = {
  ...DEFAULT_COS_SETTINGS,
  tailMass: 1e-12,
  tailTolerance: 1e-12,
  densityTolerance: 1e-8,
};

export function buildHedgeTable(
  market: Market,
  model: Model,
  legs: readonly Leg[],
  times: readonly number[],
  opts: { variances?: number; spots?: number; vega?: boolean } = {},
): HedgeTable {
  const stochastic = hasStochasticVariance(model.kind);
  const level = stochastic
    ? Math.max(parameterValue(model, 'v0'), parameterValue(model, 'theta'))
    : 0;
  const nv = stochastic ? (opts.variances ?? 21) : 1;
  const variances = Float64Array.from({ length: nv }, (_, i) =>
    nv === 1 ? 0 : 6 * level * (i / (nv - 1)) ** 2,
  );
  const nx = opts.spots ?? 161;
  const nt = times.length;
  const value = new Float64Array(nt * nv * nx);
  const delta = new Float64Array(nt * nv * nx);
  const x0 = new Float64Array(nt);
  const dx = new Float64Array(nt);
  const logK = legs.map((l) => Math.log(l.strike / market.spot));
  const kLo = Math.min(...logK);
  const kHi = Math.max(...logK);
  const spec0 = modelSpec(model);
  const expiries = [...new Set(legs.map((l) => l.expiry))];
  const strip = {
    call: new Float64Array(nx),
    put: new Float64Array(nx),
    cdf: new Float64Array(nx),
    dens: new Float64Array(nx),
    ks: new Float64Array(nx),
  };
  // one (time, variance) slice of Σ q·value (and Σ q·delta when asked) for the spec given
  const fill = (
    spec: ModelSpec,
    t: number,
    ti: number,
    alive: readonly number[],
    valueOut: Float64Array,
    deltaOut: Float64Array | null,
    base: number,
  ) => {
    for (const T of alive) {
      const tau = T - t;
      const growth = forwardPrice(market, T) / forwardPrice(market, t);
      const df = discountFactor(market, T) / discountFactor(market, t);
      const prep = prepareCos(spec, tau, HEDGE_COS);
      for (const leg of legs) {
        if (leg.expiry !== T) continue;
        for (let j = 0; j < nx; j++)
          strip.ks[j] = Math.log(
            leg.strike / (market.spot * Math.exp(x0[ti] + j * dx[ti]) * growth),
          );
        cosStrip(prep, strip.ks, strip.call, strip.put, strip.cdf, strip.dens);
        const isCall = leg.type === 'call';
        for (let j = 0; j < nx; j++) {
          const S = market.spot * Math.exp(x0[ti] + j * dx[ti]);
          const v = df * S * growth * (isCall ? strip.call[j] : strip.put[j]);
          valueOut[base + j] += leg.quantity * v;
          if (!deltaOut) continue;
          // S·Δ = V − K ∂V/∂K (scale invariance), ∂V/∂K from the COS CDF
          const dK = isCall ? -df * (1 - strip.cdf[j]) : df * strip.cdf[j];
          deltaOut[base + j] += leg.quantity * ((v - leg.strike * dK) / S);
        }
      }
    }
  };
  const withVega = opts.vega === true && !stochastic;
  const vega = withVega ? new Float64Array(nt * nx) : undefined;
  const bumped = withVega ? [new Float64Array(nx), new Float64Array(nx)] : [];
  times.forEach((t, ti) => {
    const alive = expiries.filter((T) => T - t > 1e-10);
    if (alive.length === 0) return;
    const tauMin = Math.min(...alive.map((T) => T - t));
    // scheduled moves and the intensity schedule as seen from t (a move dated t is still ahead)
    const specNow = specFrom(spec0, t);
    const sd = Math.sqrt(roughVariance(specNow, tauMin)) + 1e-4;
    x0[ti] = kLo - 8 * sd;
    dx[ti] = (kHi - kLo + 16 * sd) / (nx - 1);
    for (let vi = 0; vi < nv; vi++) {
      const spec = stochastic
        ? specFrom(modelSpec({ ...model, v0: variances[vi] } as Model), t)
        : specNow;
      fill(spec, t, ti, alive, value, delta, (ti * nv + vi) * nx);
    }
    if (vega && specNow.diffusion.type === 'constant') {
      const sigma = Math.sqrt(specNow.diffusion.variance);
      [-1, 1].forEach((side, b) => {
        bumped[b].fill(0);
        const s = Math.max(1e-6, sigma + side * VEGA_BUMP);
        fill(
          { ...specNow, diffusion: { type: 'constant', variance: s * s } },
          t,
          ti,
          alive,
          bumped[b],
          null,
          0,
        );
      });
      const width = Math.max(1e-6, sigma + VEGA_BUMP) - Math.max(1e-6, sigma - VEGA_BUMP);
      for (let j = 0; j < nx; j++) vega[ti * nx + j] = (bumped[1][j] - bumped[0][j]) / width;
    }
  });
  return {
    times: Float64Array.from(times),
    variances,
    x0,
    dx,
    nx,
    value,
    delta,
    ...(vega ? { vega } : {}),
  };
}

function catmullRom(p0: number, p1: number, p2: number, p3: number, t: number): number {
  return (
    p1 + 0.5 * t * (p2 - p0 + t * (2 * p0 - 5 * p1 + 4 * p2 - p3 + t * (3 * (p1 - p2) + p3 - p0)))
  );
}

/** Bicubic (Catmull-Rom) interpolation of one field at fractional node positions (fv, fx). */
function atNodes(arr: Float64Array, table: HedgeTable, ti: number, fv: number, fx: number): number {
  const nx = table.nx;
  const nv = table.variances.length;
  const jx = Math.min(nx - 2, Math.max(0, Math.floor(fx)));
  const tx = fx - jx;
  const x0 = Math.max(0, jx - 1);
  const x3 = Math.min(nx - 1, jx + 2);
  let result = 0;
  if (nv === 1) {
    const base = ti * nx;
    return catmullRom(arr[base + x0], arr[base + jx], arr[base + jx + 1], arr[base + x3], tx);
  }
  const iv = Math.min(nv - 2, Math.floor(fv));
  const tv = fv - iv;
  const rows = [Math.max(0, iv - 1), iv, iv + 1, Math.min(nv - 1, iv + 2)];
  const vals = [0, 0, 0, 0];
  for (let r = 0; r < 4; r++) {
    const base = (ti * nv + rows[r]) * nx;
    vals[r] = catmullRom(arr[base + x0], arr[base + jx], arr[base + jx + 1], arr[base + x3], tx);
  }
  result = catmullRom(vals[0], vals[1], vals[2], vals[3], tv);
  return result;
}

/** Value and delta at time index ti, variance v and log-spot x = ln(S/S0). */
export function lookup(
  table: HedgeTable,
  ti: number,
  v: number,
  x: number,
  spot0: number,
): { value: number; delta: number } {
  const { variances, nx } = table;
  const nv = variances.length;
  const f = (x - table.x0[ti]) / table.dx[ti];
  // variance nodes are evenly spaced in √v, where values and deltas are close to linear:
  // interpolate there, cubically
  const fv =
    nv > 1
      ? Math.sqrt(Math.min(variances[nv - 1], Math.max(0, v)) / variances[nv - 1]) * (nv - 1)
      : 0;
  if (f >= 0 && f <= nx - 1)
    return {
      value: atNodes(table.value, table, ti, fv, f),
      delta: atNodes(table.delta, table, ti, fv, f),
    };
  // beyond the nodes: hold the edge delta, extend the value along it
  const edge = f < 0 ? 0 : nx - 1;
  const d = atNodes(table.delta, table, ti, fv, edge);
  const sEdge = spot0 * Math.exp(table.x0[ti] + edge * table.dx[ti]);
  return {
    value: atNodes(table.value, table, ti, fv, edge) + d * (spot0 * Math.exp(x) - sEdge),
    delta: d,
  };
}

/** d/dt of the Catmull-Rom segment above. */
function catmullRomSlope(p0: number, p1: number, p2: number, p3: number, t: number): number {
  return (
    0.5 *
    (p2 - p0 + 2 * t * (2 * p0 - 5 * p1 + 4 * p2 - p3) + 3 * t * t * (3 * (p1 - p2) + p3 - p0))
  );
}

export interface TableGreeks {
  value: number;
  delta: number;
  /** ∂delta/∂S */
  gamma: number;
  /** ∂value/∂σ, σ the instantaneous vol (√v for a stochastic-variance model) */
  vega: number;
}

/** Scratch for the stencil rows: values [0..3], deltas [4..7], deltas' slopes in x [8..11]. */
const rowScratch = new Float64Array(12);

function stencilRow(
  table: HedgeTable,
  base: number,
  slot: number,
  c0: number,
  jx: number,
  c3: number,
  tx: number,
): void {
  const val = table.value;
  const del = table.delta;
  rowScratch[slot] = catmullRom(
    val[base + c0],
    val[base + jx],
    val[base + jx + 1],
    val[base + c3],
    tx,
  );
  rowScratch[slot + 4] = catmullRom(
    del[base + c0],
    del[base + jx],
    del[base + jx + 1],
    del[base + c3],
    tx,
  );
  rowScratch[slot + 8] = catmullRomSlope(
    del[base + c0],
    del[base + jx],
    del[base + jx + 1],
    del[base + c3],
    tx,
  );
}

/**
 * Value, delta, gamma and vega at time index ti, variance v and log-spot x = ln(S/S0), for the
 * option hedges, written into `out` (no allocation: it runs on every path and step). Inside the
 * spot nodes value and delta are `lookup`'s; beyond them they are `lookup`'s edge extension,
 * gamma is 0 and vega is held at the edge.
 */
export function lookupGreeks(
  table: HedgeTable,
  ti: number,
  v: number,
  x: number,
  spot0: number,
  out: TableGreeks = { value: 0, delta: 0, gamma: 0, vega: 0 },
): TableGreeks {
  const { nx, variances } = table;
  const nv = variances.length;
  const f = (x - table.x0[ti]) / table.dx[ti];
  const inside = f >= 0 && f <= nx - 1;
  const fc = Math.min(nx - 1, Math.max(0, f));
  const jx = Math.min(nx - 2, Math.floor(fc));
  const tx = fc - jx;
  const c0 = Math.max(0, jx - 1);
  const c3 = Math.min(nx - 1, jx + 2);
  const S = spot0 * Math.exp(x);
  if (nv === 1) {
    stencilRow(table, ti * nx, 0, c0, jx, c3, tx);
    out.value = rowScratch[0];
    out.delta = rowScratch[4];
    out.gamma = inside ? rowScratch[8] / (table.dx[ti] * S) : 0;
    const vg = table.vega;
    const b = ti * nx;
    out.vega = vg ? catmullRom(vg[b + c0], vg[b + jx], vg[b + jx + 1], vg[b + c3], tx) : 0;
  } else {
    const top = variances[nv - 1];
    const fv = Math.sqrt(Math.min(top, Math.max(0, v)) / top) * (nv - 1);
    const iv = Math.min(nv - 2, Math.floor(fv));
    const tv = fv - iv;
    stencilRow(table, (ti * nv + Math.max(0, iv - 1)) * nx, 0, c0, jx, c3, tx);
    stencilRow(table, (ti * nv + iv) * nx, 1, c0, jx, c3, tx);
    stencilRow(table, (ti * nv + iv + 1) * nx, 2, c0, jx, c3, tx);
    stencilRow(table, (ti * nv + Math.min(nv - 1, iv + 2)) * nx, 3, c0, jx, c3, tx);
    const r = rowScratch;
    out.value = catmullRom(r[0], r[1], r[2], r[3], tv);
    out.delta = catmullRom(r[4], r[5], r[6], r[7], tv);
    out.gamma = inside ? catmullRom(r[8], r[9], r[10], r[11], tv) / (table.dx[ti] * S) : 0;
    // √v nodes are (nv − 1) steps over √top
    out.vega = (catmullRomSlope(r[0], r[1], r[2], r[3], tv) * (nv - 1)) / Math.sqrt(top);
  }
  if (!inside) {
    const edge = lookup(table, ti, v, x, spot0);
    out.value = edge.value;
    out.delta = edge.delta;
  }
  return out;
}
