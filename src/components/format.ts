/** Display formatting: tenors, vols in percent, money, dates. */
export function formatTenor(years: number): string {
  const days = Math.round(years * 365);
  if (days <= 0) return `${(years * 365).toFixed(2)}D`;
  if (days < 7) return `${days}D`;
  if (days % 7 === 0 && days < 28) return `${days / 7}W`;
  if (days < 365) {
    const months = years * 12;
    return Math.abs(months - Math.round(months)) < 0.03 ? `${Math.round(months)}M` : `${days}D`;
  }
  const y = years;
  return Math.abs(y - Math.round(y)) < 0.01 ? `${Math.round(y)}Y` : `${y.toFixed(2)}Y`;
}

export function formatVol(v: number | null | undefined, digits = 2): string {
  return v === null || v === undefined || !Number.isFinite(v)
    ? '—'
    : `${(100 * v).toFixed(digits)}`;
}

// one formatter per number of digits: toLocaleString with options builds a new one each call,
// which a table of a few hundred numbers redrawn on every slider step notices
const formatters = new Map<number, Intl.NumberFormat>();

export function formatNumber(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  // no "-0.00" for values that round to zero
  if (Math.abs(v) < 0.5 * 10 ** -digits) v = 0;
  let f = formatters.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-US', {
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    });
    formatters.set(digits, f);
  }
  return f.format(v);
}

export function formatSigned(v: number | null | undefined, digits = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const s = v.toFixed(digits);
  return v > 0 ? `+${s}` : s;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A moment as an ISO date and 24-hour local time: 2026-12-02 14:05. */
export function formatDateTime(at: number | string | Date): string {
  const d = new Date(at);
  if (Number.isNaN(d.getTime())) return '—';
  return `${formatDate(d)} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A day as an ISO date in local time: 2026-12-02. */
export function formatDate(at: number | string | Date): string {
  const d = new Date(at);
  if (Number.isNaN(d.getTime())) return '—';
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
