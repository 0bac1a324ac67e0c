/**
 * The move a term structure of ATM vols prices for a dated event, by forward-variance
 * arithmetic (common practice): with ATM vols σ₁ at T₁ before the event and σ₂ at T₂ after it,
 * and a base vol for the ordinary days between,
 *   σ_e² = σ₂²T₂ − σ₁²T₁ − σ_base²(T₂ − T₁),
 * σ_e being the standard deviation of the event's log-move. The base vol is the user's choice;
 * by default the ATM vol before the event (the days around it priced like the days before).
 */
import { touches } from '../core/scheduled-moves';

export interface EventMoveEstimate {
  /** the event's time (years) */
  time: number;
  /** the expiries either side of it and their ATM vols */
  before: { expiry: number; atm: number };
  after: { expiry: number; atm: number };
  baseVol: number;
  /** the implied standard deviation of the log-move, null when the variance left is negative */
  impliedMove: number | null;
}

/** σ_e from two ATM vols either side of the event and a base vol (null when σ_e² < 0). */
export function impliedEventMove(
  atm1: number,
  T1: number,
  atm2: number,
  T2: number,
  baseVol: number,
): number | null {
  const v = atm2 * atm2 * T2 - atm1 * atm1 * T1 - baseVol * baseVol * (T2 - T1);
  return v >= 0 ? Math.sqrt(v) : null;
}

/**
 * For each event time, the implied move from the expiries just before (or on) it and just after
 * it, when both have an ATM vol; with no expiry before the event, T₁ = 0, which needs a base vol.
 */
export function impliedEventMoves(
  eventTimes: readonly number[],
  expiries: readonly number[],
  atm: readonly (number | null)[],
  baseVol?: number,
): EventMoveEstimate[] {
  const order = expiries.map((_, i) => i).sort((a, b) => expiries[a] - expiries[b]);
  const out: EventMoveEstimate[] = [];
  for (const time of eventTimes) {
    let before = -1;
    let after = -1;
    for (const i of order) {
      if (!touches(time, expiries[i])) before = i;
      else if (after < 0) after = i;
    }
    if (after < 0 || atm[after] === null) continue;
    if (before >= 0 && atm[before] === null) continue;
    if (before < 0 && baseVol === undefined) continue;
    const b =
      before >= 0 ? { expiry: expiries[before], atm: atm[before]! } : { expiry: 0, atm: baseVol! };
    const base = baseVol ?? b.atm;
    out.push({
      time,
      before: b,
      after: { expiry: expiries[after], atm: atm[after]! },
      baseVol: base,
      impliedMove: impliedEventMove(b.atm, b.expiry, atm[after]!, expiries[after], base),
    });
  }
  return out;
}
