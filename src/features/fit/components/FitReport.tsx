import {
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import {
  isParameterKey,
  parameterLabel,
  parametersOf,
  parameterValue,
  PARAMETER_SPECS,
} from '../../../engine/core';

/** A parameter's symbol (its label when it has none), for the compact correlation table. */
const parameterSymbol = (name: string) =>
  isParameterKey(name) ? PARAMETER_SPECS[name].symbol || PARAMETER_SPECS[name].label : name;
import type { CalibrationResult, JumpsVerdict } from '../../../engine/fit';
import { formatTenor } from '../../../components/format';

/** Parameters, fit quality and flags of one calibration. */
export function ParameterTable({ result }: { result: CalibrationResult }) {
  const entries = parametersOf(result.model.kind).map(
    (k) => [k, parameterValue(result.model, k)] as const,
  );
  const { errors } = result;
  const seOf = (k: string) => {
    const i = errors?.names.indexOf(k) ?? -1;
    return i < 0 ? undefined : errors.standardErrors[i];
  };
  return (
    <div className="space-y-2" data-testid="fit-parameters">
      <table className="tabular text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="pr-6 text-left font-normal">parameter</th>
            <th className="text-right font-normal">value</th>
            <th className="pl-3 text-right font-normal">std. error</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {entries.map(([k, v]) => {
            const se = seOf(k);
            return (
              <tr key={k} className="border-b border-rule/60">
                <th scope="row" className="py-1 pr-6 text-left font-normal">
                  {parameterLabel(k)}
                </th>
                <td className="py-1 text-right">{v.toPrecision(5)}</td>
                <td className="py-1 pl-3 text-right text-muted">
                  {se === undefined ? 'held' : se === null ? '—' : `±${se.toPrecision(2)}`}
                </td>
                <td className="py-1 pl-3 text-xs text-stressed">
                  {[
                    result.onBounds.includes(k) ? 'on its bound' : '',
                    errors?.unidentified.includes(k) ? 'not pinned down by these quotes' : '',
                  ]
                    .filter(Boolean)
                    .join('; ')}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {result.anchorPenalty !== undefined && (
        <p className="tabular text-sm" data-testid="anchor-penalty">
          Anchored to the last fit in the history: the penalty adds{' '}
          {result.anchorPenalty.toFixed(3)} vol pts² to the SSE below.
        </p>
      )}
      {errors?.correlations && errors.names.length > 1 && (
        <details className="text-sm">
          <summary className="cursor-pointer">Correlations of the estimates</summary>
          <table className="tabular mt-1 text-xs" data-testid="fit-correlations">
            <thead className="text-muted">
              <tr>
                <th />
                {errors.names.map((n) => (
                  <th key={n} className="px-1 font-normal">
                    {n.startsWith('events.') ? n : parameterSymbol(n)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {errors.correlations.map((row, a) => (
                <tr key={errors.names[a]}>
                  <th className="pr-2 text-left font-normal text-muted">
                    {errors.names[a].startsWith('events.')
                      ? errors.names[a]
                      : parameterSymbol(errors.names[a])}
                  </th>
                  {row.map((c, b) => (
                    <td
                      key={b}
                      className={`px-1 text-right ${a !== b && Math.abs(c) > 0.95 ? 'text-stressed' : ''}`}
                    >
                      {c.toFixed(2)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </details>
      )}
      <p className="text-xs text-muted">
        Standard errors from the Jacobian at the optimum; “not pinned down” means a relative error
        above 100 % or a correlation above 0.95 with another parameter.
      </p>
      <p className="tabular text-sm" data-testid="fit-quality">
        RMSE {result.rmseVolPoints.toFixed(3)} vol points · SSE {result.sseVolPoints.toFixed(3)} ·{' '}
        {result.iterations} iterations · {result.elapsedMs.toFixed(0)} ms
        {result.feller && ` · Feller ${result.feller.holds ? 'holds' : 'does not hold'}`}
      </p>
      <p className="tabular text-xs text-muted">
        RMSE by expiry:{' '}
        {result.rmseByExpiry
          .map((e) => `${formatTenor(e.expiry)} ${e.rmseVolPoints.toFixed(2)}`)
          .join(' · ')}
      </p>
    </div>
  );
}

interface ResidualRow {
  expiry: number;
  strike: number;
  market: number;
  model: number | null;
  /** model − quote in vol points */
  err: number | null;
  /** model − quote in units of the quote's half-spread (chains with bid and ask) */
  inHalfSpreads: number | null;
}

const RESIDUAL_COLUMNS: ColumnDef<ResidualRow>[] = [
  { id: 'expiry', accessorKey: 'expiry', filterFn: 'equals' },
  { id: 'strike', accessorKey: 'strike' },
  // an unpriced quote counts as a 99-point error: it sorts first among the largest errors
  { id: 'absErr', accessorFn: (r) => Math.abs(r.err ?? 99) },
];

const LARGEST_ERROR_FIRST: SortingState = [{ id: 'absErr', desc: true }];
const BY_EXPIRY_AND_STRIKE: SortingState = [
  { id: 'expiry', desc: false },
  { id: 'strike', desc: false },
];

/** The residuals, one expiry or all, in expiry and strike order or largest error first. */
export function ResidualTable({
  result,
  halfSpreads,
}: {
  result: CalibrationResult;
  /** each residual in half-spreads, aligned with `result.residuals`, when the quotes have them */
  halfSpreads?: (number | null)[];
}) {
  const [expiry, setExpiry] = useState<number | 'all'>('all');
  const [byError, setByError] = useState(false);
  const expiries = [...new Set(result.residuals.map((r) => r.expiry))].sort((a, b) => a - b);
  const data = useMemo<ResidualRow[]>(
    () =>
      result.residuals.map((r, i) => ({
        ...r,
        err: r.model === null ? null : 100 * (r.model - r.market),
        inHalfSpreads: halfSpreads?.[i] ?? null,
      })),
    [result.residuals, halfSpreads],
  );
  // the table's state must keep its identity between renders (its row models are memoised on it)
  const sorting = byError ? LARGEST_ERROR_FIRST : BY_EXPIRY_AND_STRIKE;
  const columnFilters = useMemo(
    () => (expiry === 'all' ? [] : [{ id: 'expiry', value: expiry }]),
    [expiry],
  );
  const table = useReactTable({
    data,
    columns: RESIDUAL_COLUMNS,
    state: { sorting, columnFilters },
    autoResetAll: false,
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
    enableMultiSort: true,
  });
  const rows = table.getRowModel().rows.map((r) => r.original);
  return (
    <div className="space-y-2">
      <div className="flex items-center gap-3 text-sm">
        <select
          aria-label="Residuals for expiry"
          value={String(expiry)}
          onChange={(e) => setExpiry(e.target.value === 'all' ? 'all' : Number(e.target.value))}
          className="rounded border border-rule bg-panel px-2 py-1"
        >
          <option value="all">all expiries</option>
          {expiries.map((t) => (
            <option key={t} value={t}>
              {formatTenor(t)}
            </option>
          ))}
        </select>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={byError} onChange={(e) => setByError(e.target.checked)} />{' '}
          largest errors first
        </label>
      </div>
      <div className="max-h-72 overflow-auto rounded border border-rule">
        <table className="tabular w-full text-right text-sm" data-testid="residual-table">
          <thead className="sticky top-0 bg-panel text-xs text-muted">
            <tr>
              {[
                'expiry',
                'strike',
                'quote vol %',
                'model vol %',
                'model − quote (vol pts)',
                ...(halfSpreads ? ['in half-spreads'] : []),
              ].map((h) => (
                <th key={h} className="px-2 py-1 font-normal">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={`${r.expiry}-${r.strike}`} className="border-t border-rule/60">
                <td className="px-2 py-1">{formatTenor(r.expiry)}</td>
                <td className="px-2 py-1">{r.strike.toFixed(2)}</td>
                <td className="px-2 py-1">{(100 * r.market).toFixed(2)}</td>
                <td className="px-2 py-1">{r.model === null ? '—' : (100 * r.model).toFixed(2)}</td>
                <td
                  className={`px-2 py-1 ${r.err !== null && Math.abs(r.err) > 0.5 ? 'text-stressed' : ''}`}
                >
                  {r.err === null ? '—' : r.err.toFixed(3)}
                </td>
                {halfSpreads && (
                  <td
                    className={`px-2 py-1 ${r.inHalfSpreads !== null && Math.abs(r.inHalfSpreads) > 1 ? 'text-stressed' : ''}`}
                  >
                    {r.inHalfSpreads === null ? '—' : r.inHalfSpreads.toFixed(2)}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

export function VerdictPanel({ verdict }: { verdict: JumpsVerdict }) {
  const f = (v: number | null | undefined) => (v === null || v === undefined ? '—' : v.toFixed(3));
  const move = verdict.move;
  return (
    <div className="space-y-2 rounded border border-rule p-3" data-testid="jumps-verdict">
      <h3 className="font-semibold">Are the jumps worth it?</h3>
      <p className={verdict.jumpsEarnTheirKeep ? 'text-teal' : ''}>{verdict.summary}</p>
      <table className="tabular text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="pr-6 text-left font-normal">RMSE (vol pts)</th>
            <th className="px-3 font-normal">Heston</th>
            <th className="px-3 font-normal">Bates</th>
            <th className="px-3 font-normal">SVCJ</th>
            {move && <th className="px-3 font-normal">Heston + one move</th>}
            <th className="px-3 font-normal">quotes</th>
          </tr>
        </thead>
        <tbody>
          {verdict.buckets.map((b) => (
            <tr key={b.bucket}>
              <th scope="row" className="pr-6 text-left font-normal">
                {b.bucket}
              </th>
              <td className="px-3 text-right">{f(b.heston)}</td>
              <td className="px-3 text-right">{f(b.bates)}</td>
              <td className="px-3 text-right">{f(b.svcj)}</td>
              {move && <td className="px-3 text-right">{f(b.move)}</td>}
              <td className="px-3 text-right">{b.count}</td>
            </tr>
          ))}
          <tr>
            <th scope="row" className="pr-6 text-left font-normal">
              all
            </th>
            <td className="px-3 text-right">{f(verdict.heston.rmseVolPoints)}</td>
            <td className="px-3 text-right">{f(verdict.bates.rmseVolPoints)}</td>
            <td className="px-3 text-right">{f(verdict.svcj.rmseVolPoints)}</td>
            {move && <td className="px-3 text-right">{f(move.rmseVolPoints)}</td>}
            <td />
          </tr>
          <tr>
            <th scope="row" className="pr-6 text-left font-normal">
              AIC
            </th>
            <td className="px-3 text-right">{verdict.aic.heston.toFixed(1)}</td>
            <td className="px-3 text-right">{verdict.aic.bates.toFixed(1)}</td>
            <td className="px-3 text-right">{verdict.aic.svcj.toFixed(1)}</td>
            {move && <td className="px-3 text-right">{verdict.aic.move?.toFixed(1)}</td>}
            <td />
          </tr>
          <tr>
            <th scope="row" className="pr-6 text-left font-normal">
              BIC
            </th>
            <td className="px-3 text-right">{verdict.bic.heston.toFixed(1)}</td>
            <td className="px-3 text-right">{verdict.bic.bates.toFixed(1)}</td>
            <td className="px-3 text-right">{verdict.bic.svcj.toFixed(1)}</td>
            {move && <td className="px-3 text-right">{verdict.bic.move?.toFixed(1)}</td>}
            <td />
          </tr>
        </tbody>
      </table>
      <p className="text-xs text-muted">
        AIC and BIC charge each model for its parameters (5 for Heston, 8 for Bates, 10 for SVCJ
        {move ? ', 6 for Heston with one move' : ''}, fewer for those held fixed); lower is better.
      </p>
    </div>
  );
}
