/** Calendar dates of the scenario's day count (ACT/365). */

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
