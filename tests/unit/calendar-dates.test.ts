/**
 * Dates are ISO 8601 calendar dates (YYYY-MM-DD, a real day of a real month; common practice
 * for exchange and desk files): impossible or loosely written dates are refused at every edge,
 * with the field or row that holds them.
 */
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { parsePositionsCsv } from '../../src/engine/book';
import { isCalendarDate, newScenario, parseScenario } from '../../src/engine/core';
import { parseQuotesCsv } from '../../src/engine/fit';

const BAD = ['2026-02-30', '2026-13-45', '2026-2-3'];

describe('calendar dates', () => {
  it('accepts real days, leap days included, and refuses impossible or short forms', () => {
    expect(['2026-12-02', '2024-02-29', '2000-02-29'].every(isCalendarDate)).toBe(true);
    expect([...BAD, '2100-02-29', '2026-12-2'].some(isCalendarDate)).toBe(false);
  });

  it('a scenario document with an impossible valuation date is refused at valuationDate', () => {
    for (const date of BAD) {
      const r = parseScenario({ ...newScenario('d1', 'Dates', '2026-12-01'), valuationDate: date });
      expect(r.ok).toBe(false);
      if (!r.ok)
        expect(r.issues[0]).toEqual({
          path: 'valuationDate',
          message: 'must be a real date YYYY-MM-DD',
        });
    }
  });

  it('a positions file row with an impossible expiry is reported on its line, the rest kept', () => {
    const text = [
      'id,type,strike,expiry,quantity',
      'a,put,90,2026-12-18,-10',
      ...BAD.map((d, i) => `b${i},call,110,${d},5`),
    ].join('\n');
    const parsed = parsePositionsCsv(text, '2026-12-01');
    expect(parsed.positions.map((p) => p.id)).toEqual(['a']);
    expect(parsed.issues.map((i) => [i.line, i.field])).toEqual([
      [3, 'expiry'],
      [4, 'expiry'],
      [5, 'expiry'],
    ]);
    expect(parsed.issues[0].message).toMatch(/2026-02-30" is not a real date/);
  });

  it('a quotes file row with an impossible expiry is reported on its line', () => {
    const text = ['expiry,strike,impliedVol', '2026-12-18,100,0.2', '2026-02-30,100,0.2'].join(
      '\n',
    );
    const parsed = parseQuotesCsv(text, { spot: 100, rate: 0, dividendYield: 0 }, '2026-12-01');
    expect(parsed.quotes).toHaveLength(1);
    expect(parsed.issues).toEqual([
      expect.objectContaining({
        line: 3,
        field: 'expiry',
        message: expect.stringMatching(/not a real date/),
      }),
    ]);
  });

  it('the command line refuses them with exit 2 and the path of the field', () => {
    for (const date of BAD) {
      const doc = { ...newScenario('d2', 'Dates', '2026-12-01'), valuationDate: date };
      const r = spawnSync(process.execPath, ['--import', 'tsx', 'cli/main.ts', 'smile'], {
        input: JSON.stringify(doc),
        encoding: 'utf8',
      });
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(JSON.parse(r.stderr).error).toMatchObject({
        code: 'invalid-input',
        path: 'valuationDate',
      });
    }
  }, 60_000);
});
