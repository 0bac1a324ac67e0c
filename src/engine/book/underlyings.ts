/**
 * What a book's figures are counted in: each leg's contract multiplier (units of the
 * underlying per contract), its currency, and the underlying of the scenarios it is revalued
 * under. P&L is never added up across underlyings: a scenario on another underlying than the
 * base's is left out of the book's totals, and totals are kept per currency.
 */
import type { LegRisk } from './book';
import type { Position } from './positions';
import type { Market } from '../core/types';

/** Positions with quantity in units of the underlying (quantity × multiplier, then none). */
export function inUnderlyingUnits(positions: readonly Position[]): readonly Position[] {
  if (positions.every((p) => p.multiplier === undefined)) return positions;
  return positions.map(({ multiplier, ...p }) =>
    multiplier === undefined ? p : { ...p, quantity: p.quantity * multiplier },
  );
}

/** Spots further apart than this (either way) are taken for two underlyings when unnamed. */
const SAME_UNDERLYING_SPOT_RATIO = 1.5;

/** Why a scenario is not on the base's underlying, or null when it is. */
export function otherUnderlying(base: Market, scenario: Market): string | null {
  const a = base.underlying?.trim();
  const b = scenario.underlying?.trim();
  if (a && b)
    return a.toLowerCase() === b.toLowerCase()
      ? null
      : `is on ${b}, not on the book's ${a}: left out of this book's totals`;
  if (Math.abs(Math.log(scenario.spot / base.spot)) <= Math.log(SAME_UNDERLYING_SPOT_RATIO))
    return null;
  return `spot ${scenario.spot} against the base's ${base.spot} is taken for another underlying and left out of this book's totals (name the underlying in both scenarios to decide by name)`;
}

export interface CurrencyTotal {
  /** the base scenario's underlying, when it is named */
  underlying: string | null;
  /** the legs' currency (the base scenario's when a leg names none; null when neither does) */
  currency: string | null;
  legs: number;
  value: number;
  delta: number;
  gamma: number;
  vega: number;
  theta: number;
  /** P&L since trade of this currency's legs with a trade price */
  sinceTrade: number;
}

/** The base's totals per currency, in the order the currencies first appear. */
export function totalsByCurrency(
  market: Market,
  positions: readonly Position[],
  legs: readonly LegRisk[],
  sinceTrade: readonly (number | null)[],
): CurrencyTotal[] {
  const out = new Map<string | null, CurrencyTotal>();
  positions.forEach((p, i) => {
    const currency = p.currency ?? market.currency ?? null;
    let t = out.get(currency);
    if (!t) {
      t = {
        underlying: market.underlying ?? null,
        currency,
        legs: 0,
        value: 0,
        delta: 0,
        gamma: 0,
        vega: 0,
        theta: 0,
        sinceTrade: 0,
      };
      out.set(currency, t);
    }
    const l = legs[i];
    t.legs++;
    t.value += l.value;
    t.delta += l.delta;
    t.gamma += l.gamma;
    t.vega += l.vega;
    t.theta += l.theta;
    t.sinceTrade += sinceTrade[i] ?? 0;
  });
  return [...out.values()];
}
