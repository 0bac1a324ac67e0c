/**
 * CSV exports cannot run formulas when opened in a spreadsheet (the CSV-injection advice of
 * OWASP; common practice): text cells that begin with =, +, -, @, tab or carriage return are
 * escaped by papaparse's formula escaping, while numbers, negative ones too, stay numbers.
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from '../../src/components/csv';

describe('CSV exports', () => {
  it('escapes text that a spreadsheet would run, and keeps numbers as numbers', () => {
    const text = toCsv(
      ['leg', 'pnl'],
      [
        ['=HYPERLINK("http://x","y")', -12.5],
        ['+1', 3],
        ['-2', -0],
        ['@SUM(A1)', 1e-7],
        ['\tlead', null],
        ['\rcr', 4],
        ['plain, with comma', 5],
      ],
    );
    const rows = Papa.parse<string[]>(text.trim()).data;
    expect(rows[0]).toEqual(['leg', 'pnl']);
    expect(rows.slice(1).map((r) => r[0])).toEqual([
      `'=HYPERLINK("http://x","y")`,
      "'+1",
      "'-2",
      "'@SUM(A1)",
      "'\tlead",
      "'\rcr",
      'plain, with comma',
    ]);
    // numbers are written as numbers, the sign of a negative one included
    expect(rows.slice(1).map((r) => r[1])).toEqual(['-12.5', '3', '0', '1e-7', '', '4', '5']);
  });
});
