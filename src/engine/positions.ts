/**
 * The book's position model, shared by the Book and Replay pages: European calls and puts and
 * holdings of the underlying. Rows are validated one by one: good rows are kept, each bad row is
 * reported with its line number and the reason.
 */
export type PositionType = 'call' | 'put' | 'underlying';

export interface Position {
  id: string;
  type: PositionType;
  /** option legs only */
  strike?: number;
  /** option legs only: years from the valuation date (ACT/365) */
  expiry?: number;
  /** number of options (or of units of the underlying); negative for short */
  quantity: number;
  tradePrice?: number;
}

export interface RowIssue {
  /** 1-based line number in the file (the header is line 1) */
  line: number;
  field: string;
  message: string;
}

export const MAX_POSITIONS = 20000;
export const MAX_QUANTITY = 1e9;

const DAY_MS = 86400000;

/** Years (ACT/365) from the valuation date to an expiry given as a date or a year fraction. */
export function expiryYears(value: string, valuationDate: string): number | string {
  const trimmed = value.trim();
  if (/^\d{4}-\d{2}-\d{2}$/.test(trimmed)) {
    const t = Date.parse(`${trimmed}T00:00:00Z`);
    const v = Date.parse(`${valuationDate}T00:00:00Z`);
    if (!Number.isFinite(t)) return 'is not a real date';
    return (t - v) / DAY_MS / 365;
  }
  const n = Number(trimmed);
  if (trimmed === '' || !Number.isFinite(n)) return 'must be a date YYYY-MM-DD or a year fraction';
  return n;
}

export interface RawPositionRow {
  line: number;
  fields: Record<string, string | undefined>;
}

/** Validates parsed rows against the valuation date; keeps the good ones. */
export function validatePositionRows(
  rows: RawPositionRow[],
  valuationDate: string,
): { positions: Position[]; issues: RowIssue[] } {
  const positions: Position[] = [];
  const issues: RowIssue[] = [];
  const seen = new Set<string>();
  for (const { line, fields } of rows) {
    const bad = (field: string, message: string) => issues.push({ line, field, message });
    const id = (fields.id ?? '').trim();
    const typeRaw = (fields.type ?? '').trim().toLowerCase();
    if (!id) {
      bad('id', 'is missing');
      continue;
    }
    if (seen.has(id)) {
      bad('id', `"${id}" appears more than once`);
      continue;
    }
    if (typeRaw !== 'call' && typeRaw !== 'put' && typeRaw !== 'underlying') {
      bad('type', `"${fields.type ?? ''}" is not call, put or underlying`);
      continue;
    }
    const quantity = Number((fields.quantity ?? '').trim());
    if ((fields.quantity ?? '').trim() === '' || !Number.isFinite(quantity)) {
      bad('quantity', 'must be a number');
      continue;
    }
    if (quantity === 0 || Math.abs(quantity) > MAX_QUANTITY) {
      bad('quantity', `must be non-zero and at most ${MAX_QUANTITY} in size`);
      continue;
    }
    const position: Position = { id, type: typeRaw, quantity };
    const tradeRaw = (fields.tradePrice ?? '').trim();
    if (tradeRaw !== '') {
      const tp = Number(tradeRaw);
      if (!Number.isFinite(tp) || tp < 0) {
        bad('tradePrice', 'must be a non-negative number when given');
        continue;
      }
      position.tradePrice = tp;
    }
    if (typeRaw !== 'underlying') {
      const strike = Number((fields.strike ?? '').trim());
      if ((fields.strike ?? '').trim() === '' || !Number.isFinite(strike) || strike <= 0) {
        bad('strike', 'must be a positive number');
        continue;
      }
      if ((fields.expiry ?? '').trim() === '') {
        bad('expiry', 'is missing');
        continue;
      }
      const years = expiryYears(fields.expiry ?? '', valuationDate);
      if (typeof years === 'string') {
        bad('expiry', years);
        continue;
      }
      if (years <= 0) {
        bad('expiry', 'is on or before the valuation date (the leg has expired)');
        continue;
      }
      if (years > 50) {
        bad('expiry', 'is more than 50 years away');
        continue;
      }
      position.strike = strike;
      position.expiry = years;
    }
    seen.add(id);
    positions.push(position);
  }
  return { positions, issues };
}
