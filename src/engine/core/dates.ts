/** Calendar dates of the scenario's day count (ACT/365), strictly ISO 8601 (YYYY-MM-DD). */
import { z } from 'zod';

const DAY_MS = 86400000;

export const DATE_MESSAGE = 'must be a real date YYYY-MM-DD';

/** A real calendar date: 2026-02-30, 2026-13-45 and 2026-2-3 are refused. */
export const isoDateSchema = z.iso.date({
  error: (issue) => (issue.input === undefined ? 'is required' : DATE_MESSAGE),
});

export const isCalendarDate = (text: string): boolean => isoDateSchema.safeParse(text).success;

/** Years (ACT/365) from the valuation date to an expiry given as a date or a year fraction. */
export function expiryYears(value: string, valuationDate: string): number | string {
  const trimmed = value.trim();
  if (/^\d{4}-\d{1,2}-\d{1,2}$/.test(trimmed)) {
    if (!isCalendarDate(trimmed)) return `"${trimmed}" is not a real date (YYYY-MM-DD)`;
    const t = Date.parse(`${trimmed}T00:00:00Z`);
    const v = Date.parse(`${valuationDate}T00:00:00Z`);
    return (t - v) / DAY_MS / 365;
  }
  const n = Number(trimmed);
  if (trimmed === '' || !Number.isFinite(n)) return 'must be a date YYYY-MM-DD or a year fraction';
  return n;
}

/** The calendar date `days` whole days after (or before, when negative) an ISO date. */
export function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

/** The calendar date `years` (ACT/365, rounded to whole days) after the valuation date. */
export const dateAfter = (valuationDate: string, years: number): string =>
  addDays(valuationDate, Math.round(years * 365));
