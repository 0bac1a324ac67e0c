import { describe, expect, it } from 'vitest';
import { parsePositionsCsv } from '../../src/engine/book';

const HEADER = 'id,type,strike,expiry,quantity,tradePrice';

describe('positions CSV', () => {
  it('keeps good rows and reports each bad one with its line and reason', () => {
    const csv = [
      HEADER,
      'P1,put,90,2026-12-18,-10,1.2',
      'X1,swaption,90,2026-12-18,1,', // unknown type
      'P2,put,90,,5,', // missing expiry
      'P3,put,90,2026-11-20,5,', // expired
      'P1,call,110,2027-01-15,3,', // duplicate id
      'P4,call,110,2027-01-15,ten,', // non-numeric quantity
      'H1,underlying,,,100,',
      '',
      'C9,call,-5,0.5,1,', // negative strike
    ].join('\n');
    const r = parsePositionsCsv(csv, '2026-12-01');
    expect(r.positions.map((p) => p.id)).toEqual(['P1', 'H1']);
    expect(r.positions[0].expiry).toBeCloseTo(17 / 365, 12);
    expect(r.issues.map((i) => [i.line, i.field])).toEqual([
      [3, 'type'],
      [4, 'expiry'],
      [5, 'expiry'],
      [6, 'id'],
      [7, 'quantity'],
      [10, 'strike'],
    ]);
    expect(r.issues[2].message).toMatch(/expired/);
  });

  it('accepts semicolons and year fractions', () => {
    const r = parsePositionsCsv('id;type;strike;expiry;quantity\nA;call;100;0.25;2', '2026-12-01');
    expect(r.positions).toEqual([
      { id: 'A', type: 'call', strike: 100, expiry: 0.25, quantity: 2 },
    ]);
  });

  it('refuses 50,000 rows with a clear limit, and a file without the needed columns', () => {
    const big = [HEADER, ...Array.from({ length: 50000 }, (_, i) => `L${i},call,100,0.5,1,`)].join(
      '\n',
    );
    const r = parsePositionsCsv(big, '2026-12-01');
    expect(r.positions).toHaveLength(0);
    expect(r.fileError).toMatch(/50000 rows; the limit is 20000/);
    expect(parsePositionsCsv('a,b\n1,2', '2026-12-01').fileError).toMatch(
      /missing: id, type, quantity/,
    );
    expect(parsePositionsCsv('   ', '2026-12-01').fileError).toBe('the file is empty');
  });
});
