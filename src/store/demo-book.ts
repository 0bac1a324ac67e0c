/**
 * The invented demo book on the invented LKX 40 index (spot 4250): the short end an index desk
 * runs — short weekly and fortnightly puts against long further-out puts, call overwrites, a few
 * three- and six-month legs — delta-hedged with index futures-like holdings of the underlying.
 */
import type { Position } from '../engine/book';

const DAY = 1 / 365;

export function demoBookPositions(): Position[] {
  const legs: Position[] = [];
  const add = (type: 'call' | 'put', strike: number, days: number, quantity: number) =>
    legs.push({
      id: `${type === 'put' ? 'P' : 'C'}${strike}-${days}d`,
      type,
      strike,
      expiry: days * DAY,
      quantity,
    });
  // short-dated puts: sold near the money, bought further down (put spreads)
  for (const days of [2, 7, 14, 21]) {
    add('put', 4150, days, -40);
    add('put', 4050, days, -25);
    add('put', 3950, days, 30);
    add('put', 3800, days, 20);
  }
  // short-dated calls: overwrites above the money
  for (const days of [7, 14, 21, 30]) {
    add('call', 4350, days, -30);
    add('call', 4450, days, -15);
  }
  // the month and beyond
  add('put', 4000, 30, 25);
  add('put', 3850, 30, 30);
  add('call', 4250, 30, 10);
  add('put', 3900, 91, 40);
  add('put', 3600, 91, 25);
  add('call', 4500, 91, -20);
  add('put', 3700, 182, 15);
  add('call', 4600, 182, -10);
  legs.push({ id: 'LKX-hedge', type: 'underlying', quantity: 6 });
  return legs;
}
