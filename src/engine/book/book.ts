/**
 * Book revaluation: the value and Greeks of each leg and of the book, P&L against a base
 * scenario, and the gap ladder (value after instant moves of the underlying, revalued through
 * the model so the smile reacts as the model says). The distribution of Y = ln(S_T/F) does not
 * depend on spot, so one COS preparation per expiry serves every ladder point.
 */
import { blackPrice } from '../analytic/black';
import { modelSpec } from '../analytic/characteristic';
import { prepareCos } from '../analytic/cos';
import { putsByInterpolation } from '../analytic/strip-interpolation';
import { discountFactor, forwardPrice } from '../core/market';
import { priceOptions } from '../analytic/pricing';
import type { Position } from './positions';
import { isBlackScholes, parameterValue } from '../core/models';
import { expectedVarianceJump } from '../core/jump-summary';
import type { Market, Model } from '../core/types';

export interface LegRisk {
  id: string;
  /** quantity × price */
  value: number;
  /** quantity × ∂V/∂S, in units of the underlying */
  delta: number;
  /** quantity × ∂²V/∂S² */
  gamma: number;
  /** quantity × ∂V/∂σ per vol point (0.01) of the leg's own implied vol */
  vega: number;
  /** quantity × ∂V/∂t per calendar day */
  theta: number;
  /** the leg's implied vol (null for the underlying or where undefined) */
  impliedVol: number | null;
}

export type BookTotal = Omit<LegRisk, 'id' | 'impliedVol'>;

export function legRisks(market: Market, model: Model, positions: readonly Position[]): LegRisk[] {
  const optionIdx = positions
    .map((p, i) => (p.type === 'underlying' ? -1 : i))
    .filter((i) => i >= 0);
  const priced = priceOptions(
    market,
    model,
    optionIdx.map((i) => ({
      type: positions[i].type as 'call' | 'put',
      strike: positions[i].strike!,
      expiry: positions[i].expiry!,
    })),
  );
  const out: LegRisk[] = positions.map((p) => ({
    id: p.id,
    value: p.quantity * market.spot,
    delta: p.quantity,
    gamma: 0,
    vega: 0,
    theta: 0,
    impliedVol: null,
  }));
  optionIdx.forEach((i, j) => {
    const q = positions[i].quantity;
    const r = priced[j];
    out[i] = {
      id: positions[i].id,
      value: q * r.price,
      delta: q * r.delta,
      gamma: q * r.gamma,
      vega: (q * r.vega) / 100,
      theta: (q * r.theta) / 365,
      impliedVol: r.impliedVol,
    };
  });
  return out;
}

export function bookTotal(legs: readonly LegRisk[]): BookTotal {
  const t: BookTotal = { value: 0, delta: 0, gamma: 0, vega: 0, theta: 0 };
  for (const l of legs) {
    t.value += l.value;
    t.delta += l.delta;
    t.gamma += l.gamma;
    t.vega += l.vega;
    t.theta += l.theta;
  }
  return t;
}

/**
 * Leg values (quantity × price) after each relative spot move: values[m][leg], with the rates,
 * dividends and model unchanged, except that under SVCJ a move is read as one jump of that size:
 * the variance gains E[Z_V | Z_S = ln(1 + move)] (`expectedVarianceJump`), so vol reacts to the
 * gap as the model's joint jump law says.
 */
export function legValuesAtMoves(
  market: Market,
  model: Model,
  positions: readonly Position[],
  moves: readonly number[],
): Float64Array[] {
  const jumps = modelSpec(model).jumps;
  if (jumps.type !== 'price-variance')
    return legValuesAtMovesSticky(market, model, positions, moves);
  const v0 = parameterValue(model, 'v0');
  return moves.map((m) => {
    const reacted =
      m === 0
        ? model
        : ({ ...model, v0: v0 + expectedVarianceJump(jumps, Math.log1p(m)) } as Model);
    return legValuesAtMovesSticky(market, reacted, positions, [m])[0];
  });
}

/**
 * Leg values after each move with the model itself unchanged: every model here is invariant to
 * the scale of spot, so this is the sticky-moneyness rule (the smile moves with spot).
 */
export function legValuesAtMovesSticky(
  market: Market,
  model: Model,
  positions: readonly Position[],
  moves: readonly number[],
): Float64Array[] {
  const values = moves.map(() => new Float64Array(positions.length));
  const byExpiry = new Map<number, number[]>();
  positions.forEach((p, i) => {
    if (p.type === 'underlying') {
      moves.forEach((m, mi) => (values[mi][i] = p.quantity * market.spot * (1 + m)));
      return;
    }
    const list = byExpiry.get(p.expiry!);
    if (list) list.push(i);
    else byExpiry.set(p.expiry!, [i]);
  });
  const spec = modelSpec(model);
  for (const [T, legs] of byExpiry) {
    const df = discountFactor(market, T);
    const F0 = forwardPrice(market, T);
    if (isBlackScholes(spec)) {
      moves.forEach((m, mi) => {
        for (const i of legs) {
          const p = positions[i];
          values[mi][i] =
            p.quantity *
            blackPrice({
              forward: F0 * (1 + m),
              strike: p.strike!,
              sigma: parameterValue(model, 'sigma'),
              expiry: T,
              discount: df,
              isCall: p.type === 'call',
            });
        }
      });
      continue;
    }
    const prep = prepareCos(spec, T);
    const n = legs.length * moves.length;
    const ks = new Float64Array(n);
    moves.forEach((m, mi) =>
      legs.forEach(
        (i, j) => (ks[mi * legs.length + j] = Math.log(positions[i].strike! / (F0 * (1 + m)))),
      ),
    );
    const put = new Float64Array(n);
    putsByInterpolation(prep, ks, put);
    moves.forEach((m, mi) => {
      const F = F0 * (1 + m);
      legs.forEach((i, j) => {
        const p = positions[i];
        const idx = mi * legs.length + j;
        // calls from puts by parity, per unit forward: C = P + 1 − e^k
        const norm = p.type === 'call' ? put[idx] + 1 - Math.exp(ks[idx]) : put[idx];
        values[mi][i] = p.quantity * df * F * norm;
      });
    });
  }
  return values;
}

/** Sticky-strike Black-Scholes leg values: each option keeps its implied vol of today. */
export function stickyStrikeValuesAtMoves(
  market: Market,
  positions: readonly Position[],
  legs: readonly LegRisk[],
  moves: readonly number[],
): Float64Array[] {
  return moves.map((m) => {
    const row = new Float64Array(positions.length);
    positions.forEach((p, i) => {
      if (p.type === 'underlying') {
        row[i] = p.quantity * market.spot * (1 + m);
        return;
      }
      const T = p.expiry!;
      const sigma = legs[i].impliedVol;
      const F = forwardPrice(market, T) * (1 + m);
      const df = discountFactor(market, T);
      row[i] =
        sigma === null
          ? legs[i].value
          : p.quantity *
            blackPrice({
              forward: F,
              strike: p.strike!,
              sigma,
              expiry: T,
              discount: df,
              isCall: p.type === 'call',
            });
    });
    return row;
  });
}

/**
 * Sticky strike with a spot-vol reaction: each option keeps today's implied vol plus
 * `pointsPerPercentDown` vol points for each 1 % the spot falls (and minus as much per 1 % up),
 * floored at 1 vol point.
 */
export function volReactionValuesAtMoves(
  market: Market,
  positions: readonly Position[],
  legs: readonly LegRisk[],
  moves: readonly number[],
  pointsPerPercentDown: number,
): Float64Array[] {
  return moves.map((m) => {
    const shift = -m * pointsPerPercentDown;
    const shifted = legs.map((l) =>
      l.impliedVol === null ? l : { ...l, impliedVol: Math.max(0.01, l.impliedVol + shift) },
    );
    return stickyStrikeValuesAtMoves(market, positions, shifted, [m])[0];
  });
}

export interface LadderSpec {
  from: number;
  to: number;
  steps: number;
}

export function ladderMoves({ from, to, steps }: LadderSpec): number[] {
  if (steps === 1) return [from];
  // rounded so that, e.g., the zero move is exactly 0
  return Array.from(
    { length: steps },
    (_, i) => Math.round((from + ((to - from) * i) / (steps - 1)) * 1e12) / 1e12,
  );
}

export const sumRow = (row: Float64Array) => row.reduce((a, b) => a + b, 0);
