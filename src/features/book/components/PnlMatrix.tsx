import {
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingFn,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import type { SetRevaluation, Position } from '../../../engine/book';
import { downloadText, toCsv } from '../../../components/csv';
import { formatNumber } from '../../../components/format';

const MAX_ROWS = 300;

interface Row {
  id: string;
  pnl: (number | null)[];
}

// an invalid scenario's P&L (null) sorts as 0
const byPnl: SortingFn<Row> = (a, b, id) =>
  ((a.getValue<number | null>(id) ?? 0) as number) -
  ((b.getValue<number | null>(id) ?? 0) as number);

/** Legs × scenarios P&L against base, with totals; sortable by any column; CSV export. */
export function PnlMatrix({
  result,
  positions,
  onSelect,
}: {
  result: SetRevaluation;
  positions: Position[];
  onSelect: (id: string) => void;
}) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const scenarios = result.scenarios;
  const data = useMemo<Row[]>(
    () =>
      positions.map((p, i) => ({
        id: p.id,
        pnl: scenarios.map((s) => (s.legPnl ? s.legPnl[i] : null)),
      })),
    [positions, scenarios],
  );
  const columns = useMemo<ColumnDef<Row>[]>(
    () =>
      scenarios.map((s, i) => ({
        id: String(i),
        header: s.name,
        accessorFn: (r) => r.pnl[i],
        sortingFn: byPnl,
      })),
    [scenarios],
  );
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    sortDescFirst: false,
    autoResetAll: false,
    enableSortingRemoval: false,
  });
  const rows = table.getRowModel().rows.map((r) => r.original);
  const headers = table.getHeaderGroups()[0]?.headers ?? [];
  const exportCsv = () =>
    downloadText(
      'book-pnl-by-scenario.csv',
      toCsv(
        ['leg', ...scenarios.map((s) => s.name)],
        [['TOTAL', ...scenarios.map((s) => s.total)], ...rows.map((r) => [r.id, ...r.pnl])],
      ),
    );
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between">
        <h3 className="font-semibold">P&amp;L against base, by leg and scenario</h3>
        <button
          type="button"
          onClick={exportCsv}
          className="rounded border border-rule px-3 py-1 text-sm hover:border-teal"
        >
          Export CSV
        </button>
      </div>
      <div className="max-h-96 overflow-auto rounded border border-rule">
        <table className="tabular w-full text-right text-sm" data-testid="pnl-matrix">
          <thead className="sticky top-0 bg-panel text-xs text-muted">
            <tr>
              <th scope="col" className="px-2 py-1.5 text-left font-normal">
                leg
              </th>
              {headers.map((h, i) => {
                const dir = h.column.getIsSorted();
                return (
                  <th
                    key={scenarios[i].id}
                    scope="col"
                    className="px-2 py-1.5 font-normal"
                    aria-sort={dir === 'desc' ? 'descending' : dir === 'asc' ? 'ascending' : 'none'}
                  >
                    <button
                      type="button"
                      onClick={h.column.getToggleSortingHandler()}
                      className="hover:text-ink"
                    >
                      {scenarios[i].name}
                      {dir === 'desc' ? ' ↓' : dir === 'asc' ? ' ↑' : ''}
                    </button>
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody>
            <tr className="border-t border-rule font-semibold" data-testid="pnl-total">
              <th scope="row" className="px-2 py-1 text-left">
                Total
              </th>
              {scenarios.map((s) => (
                <td
                  key={s.id}
                  className={`px-2 py-1 ${s.total !== null && s.total < 0 ? 'text-stressed' : ''}`}
                  title={s.issues.map((x) => `${x.path}: ${x.message}`).join('; ')}
                >
                  {s.total === null
                    ? s.issues.some((x) => x.path === 'market.underlying')
                      ? 'other underlying'
                      : 'invalid stress'
                    : formatNumber(s.total, 2)}
                </td>
              ))}
            </tr>
            {rows.slice(0, MAX_ROWS).map((r) => (
              <tr key={r.id} className="border-t border-rule/60">
                <th scope="row" className="px-2 py-1 text-left font-normal">
                  <button
                    type="button"
                    className="text-teal hover:underline"
                    onClick={() => onSelect(r.id)}
                  >
                    {r.id}
                  </button>
                </th>
                {r.pnl.map((v, i) => (
                  <td
                    key={scenarios[i].id}
                    className={`px-2 py-1 ${v !== null && v < 0 ? 'text-stressed' : ''}`}
                  >
                    {v === null ? '—' : formatNumber(v, 2)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
