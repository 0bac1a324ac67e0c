/**
 * The book's exposure to jumps: each gap's P&L with the delta part taken out (what a
 * delta-hedged book makes or loses on it), the expected jump P&L a year, and how much of the
 * 1-day tail comes from days with a jump. Every figure is a P&L: negative is a loss.
 */
import type { JumpExposure, SetRevaluation } from '../../../engine/book';
import { formatNumber } from '../../../components/format';

/** The ladder points shown in the table: the down moves a desk hedges and two up moves. */
const SHOWN = [-0.3, -0.2, -0.15, -0.1, -0.05, 0.05, 0.1];

export function JumpExposurePanel({
  result,
  exposure,
  error,
}: {
  result: SetRevaluation;
  /** undefined while the worker computes it */
  exposure: JumpExposure | undefined;
  error: Error | null;
}) {
  if (!exposure)
    return (
      <section className="space-y-2" data-testid="jump-exposure" aria-busy={!error}>
        <h3 className="font-semibold">Jump exposure</h3>
        {error ? (
          <p role="alert" className="text-sm text-stressed">
            The jump exposure failed: {error.message}
          </p>
        ) : (
          <p className="text-sm text-muted">
            Computing the jump exposure (every leg at some two thousand moves)…
          </p>
        )}
      </section>
    );
  const e = exposure;
  const rows = SHOWN.map((m) => e.moves.findIndex((x) => Math.abs(x - m) < 1e-9)).filter(
    (i) => i >= 0,
  );
  const share = e.oneDay.jumpShare;
  return (
    <section
      className="space-y-2"
      data-testid="jump-exposure"
      aria-labelledby="jump-exposure-title"
    >
      <h3 id="jump-exposure-title" className="font-semibold">
        Jump exposure
      </h3>
      <p className="text-sm text-muted">
        The P&amp;L of an instant gap less the delta part (book delta ×{' '}
        {formatNumber(result.base.total.delta, 2)} × spot × move): what the book loses or makes on a
        gap once its delta is hedged. A delta hedge in the underlying cannot offset it; only options
        can.
      </p>
      <table className="tabular text-right text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="px-2 text-left font-normal">gap</th>
            <th className="px-2 font-normal">model</th>
            <th className="px-2 font-normal">
              sticky strike, +{result.volReaction} pts per 1 % fall
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((i) => (
            <tr key={i} className="border-t border-rule/60">
              <td className="px-2 text-left">{formatNumber(100 * e.moves[i], 0)} %</td>
              <td className="px-2">{formatNumber(e.model[i], 2)}</td>
              <td className="px-2">{formatNumber(e.volReaction[i], 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <ul className="space-y-1 text-sm">
        <li data-testid="expected-jump-pnl">
          Expected jump P&amp;L a year:{' '}
          <strong className="tabular">{formatNumber(e.expectedJumpPnlPerYear, 2)}</strong>{' '}
          {e.jumpsPerYear > 0
            ? `(${formatNumber(e.jumpsPerYear, 2)} jumps a year × the mean P&L of one jump, delta part removed, over the model's jump law)`
            : '(the base model has no jumps)'}
        </li>
        <li data-testid="one-day-tail">
          1-day 99 % VaR, as P&amp;L at the 1st percentile:{' '}
          <strong className="tabular">{formatNumber(e.oneDay.var99, 2)}</strong>; mean P&amp;L of
          the worst 1 % of days:{' '}
          <strong className="tabular">{formatNumber(e.oneDay.es99, 2)}</strong>
          {share === null
            ? '.'
            : `, of which ${formatNumber(100 * share, 0)} % comes from days with a jump.`}{' '}
          <span className="text-muted">
            Revalued at the day&apos;s move with the model held; theta and the day&apos;s vol change
            are left out.
          </span>
        </li>
      </ul>
    </section>
  );
}
