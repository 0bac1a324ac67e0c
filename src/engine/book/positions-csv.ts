/** Positions from CSV text (papaparse): header row, comma/semicolon/tab delimited. */
import Papa from 'papaparse';
import { MAX_POSITIONS, validatePositionRows, type Position, type RowIssue } from './positions';

export const MAX_POSITIONS_FILE_BYTES = 4 * 1024 * 1024;
const REQUIRED = ['id', 'type', 'quantity'];

export interface ParsedPositions {
  positions: Position[];
  issues: RowIssue[];
  /** a problem with the file as a whole (nothing was kept) */
  fileError?: string;
}

/** Column names are matched without case or spaces; trade_price and tradeprice mean tradePrice. */
function normaliseHeader(h: string): string {
  const key = h
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, '');
  return key === 'tradeprice' ? 'tradePrice' : key;
}

export function parsePositionsCsv(text: string, valuationDate: string): ParsedPositions {
  if (text.length > MAX_POSITIONS_FILE_BYTES) {
    return {
      positions: [],
      issues: [],
      fileError: `the file is over ${MAX_POSITIONS_FILE_BYTES / 1024 / 1024} MB`,
    };
  }
  if (text.trim() === '') return { positions: [], issues: [], fileError: 'the file is empty' };
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t'],
    transformHeader: normaliseHeader,
  });
  const header = parsed.meta.fields ?? [];
  const missing = REQUIRED.filter((f) => !header.includes(f));
  if (missing.length > 0) {
    return {
      positions: [],
      issues: [],
      fileError: `the header must name the columns id, type, strike, expiry, quantity (and optionally tradePrice, multiplier, currency); missing: ${missing.join(', ')}`,
    };
  }
  // keep file line numbers: row i of the data is line i + 2; blank lines are skipped here
  const rows = parsed.data
    .map((fields, i) => ({ line: i + 2, fields }))
    .filter((r) => Object.values(r.fields).some((v) => typeof v === 'string' && v.trim() !== ''));
  if (rows.length > MAX_POSITIONS) {
    return {
      positions: [],
      issues: [],
      fileError: `the file has ${rows.length} rows; the limit is ${MAX_POSITIONS}`,
    };
  }
  return validatePositionRows(rows, valuationDate);
}
