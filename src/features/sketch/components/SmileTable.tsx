import { memo } from 'react';
import type { OptionResult, SmileSlice } from '../../../engine/analytic';
import { formatNumber, formatSigned, formatTenor, formatVol } from '../../../components/format';
import { downloadText, toCsv } from '../../../components/csv';

interface Props {
  slice: SmileSlice;
  stressedSlice: SmileSlice | null;
  /** OTM option at each strike under the base model (null while computing) */
  greeks: OptionResult[] | null;
  scenarioName: string;
}

const HEADER = [
  'strike',
  'ln(K/F)',
  'type',
  'base vol %',
  'stressed vol %',
  'change (vol pts)',
  'price',
  'delta',
  'gamma',
  'vega (per vol pt)',
  'theta (per day)',
];

/** Prices, vols and Greeks at one expiry; the option at each strike is the out-of-the-money one. */
// memo: a slider step re-renders the page, not this (its inputs follow when the drag pauses)
export const SmileTable = memo(function SmileTable({
  slice,
  stressedSlice,
  greeks,
  scenarioName,
}: Props) {
  const rows = slice.strikes.map((K, i) => {
    const k = slice.logMoneyness[i];
    const base = slice.impliedVols[i];
    const stressed = stressedSlice?.impliedVols[i] ?? null;
    const g = greeks?.[i];
    return {
      K,
      k,
      type: k < 0 ? 'put' : 'call',
      base,
      stressed,
      change: base !== null && stressed !== null ? 100 * (stressed - base) : null,
      g,
    };
  });
  const exportCsv = () => {
    const csv = toCsv(
      HEADER,
      rows.map((r) => [
        r.K.toFixed(6),
        r.k.toFixed(6),
        r.type,
        r.base === null ? null : (100 * r.base).toFixed(6),
        r.stressed === null ? null : (100 * r.stressed).toFixed(6),
        r.change === null ? null : r.change.toFixed(6),
        r.g ? r.g.price.toPrecision(10) : null,
        r.g ? r.g.delta.toPrecision(8) : null,
        r.g ? r.g.gamma.toPrecision(8) : null,
        r.g ? (r.g.vega / 100).toPrecision(8) : null,
        r.g ? (r.g.theta / 365).toPrecision(8) : null,
      ]),
    );
    downloadText(`${scenarioName.replace(/[^\w-]+/g, '_')}_${formatTenor(slice.expiry)}.csv`, csv);
  };
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between">
        <p className="text-sm text-muted">
          Forward {formatNumber(slice.forward, 4)} · ATM {formatVol(slice.atm)}% · RR25{' '}
          {formatSigned(slice.rr25 === null ? null : 100 * slice.rr25)} · BF25{' '}
          {formatSigned(slice.bf25 === null ? null : 100 * slice.bf25)} · RR10{' '}
          {formatSigned(slice.rr10 === null ? null : 100 * slice.rr10)} · BF10{' '}
          {formatSigned(slice.bf10 === null ? null : 100 * slice.bf10)} vol pts
        </p>
        <button
          type="button"
          onClick={exportCsv}
          className="rounded border border-rule px-3 py-1 text-sm hover:border-teal hover:text-teal"
        >
          Export CSV
        </button>
      </div>
      <div className="max-h-[28rem] overflow-auto rounded border border-rule">
        <table className="tabular w-full text-right text-sm" data-testid="smile-table">
          <thead className="sticky top-0 bg-panel text-xs text-muted">
            <tr>
              {HEADER.map((h) => (
                <th key={h} scope="col" className="px-2 py-1.5 font-normal">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr
                key={r.k}
                className={`border-t border-rule/60 ${Math.abs(r.k) < 1e-9 ? 'bg-teal/5' : ''}`}
              >
                <td className="px-2 py-1">{formatNumber(r.K, 2)}</td>
                <td className="px-2 py-1 text-muted">{r.k.toFixed(3)}</td>
                <td className="px-2 py-1 text-muted">{r.type}</td>
                <td className="px-2 py-1 text-base-curve">{formatVol(r.base)}</td>
                <td className="px-2 py-1 text-stressed">{formatVol(r.stressed)}</td>
                <td className="px-2 py-1">{formatSigned(r.change)}</td>
                <td className="px-2 py-1">{r.g ? formatNumber(r.g.price, 4) : '…'}</td>
                <td className="px-2 py-1">{r.g ? formatNumber(r.g.delta, 4) : '…'}</td>
                <td className="px-2 py-1">{r.g ? r.g.gamma.toExponential(3) : '…'}</td>
                <td className="px-2 py-1">{r.g ? formatNumber(r.g.vega / 100, 4) : '…'}</td>
                <td className="px-2 py-1">{r.g ? formatNumber(r.g.theta / 365, 4) : '…'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
});
