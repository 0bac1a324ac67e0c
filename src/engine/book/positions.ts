/**
 * The book's position model, shared by the Book and Replay pages: European calls and puts and
 * holdings of the underlying. Rows are validated one by one: good rows are kept, each bad row is
 * reported with its line number and the reason.
 */
import { expiryYears } from '../core/dates';
import type { RowIssue } from '../core/validate';
import type { Position } from './schema';

export type { Position, PositionType } from './schema';
export type { RowIssue } from '../core/validate';

export const MAX_POSITIONS = 20000;
export const MAX_QUANTITY = 1e9;

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
    const multiplierRaw = (fields.multiplier ?? '').trim();
    if (multiplierRaw !== '') {
      const m = Number(multiplierRaw);
      if (!Number.isFinite(m) || m <= 0 || m > 1e6) {
        bad('multiplier', 'must be a positive number up to 1e6 when given');
        continue;
      }
      position.multiplier = m;
    }
    const currencyRaw = (fields.currency ?? '').trim().toUpperCase();
    if (currencyRaw !== '') {
      if (!/^[A-Z]{3}$/.test(currencyRaw)) {
        bad('currency', `"${fields.currency}" is not a three-letter currency code such as EUR`);
        continue;
      }
      position.currency = currencyRaw;
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
