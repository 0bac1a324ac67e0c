/**
 * The Library's scenarios filtered by name, notes or model and sorted (react-table as the
 * headless engine), grouped by the service set they belong to.
 */
import {
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingState,
} from '@tanstack/react-table';
import type { RemoteSet, StoredScenario } from '../../../store/db';

export type ScenarioSort = 'edited' | 'name' | 'state';

// state and data keep their identity between renders: the row models are memoised on them
const NONE: StoredScenario[] = [];

const STATE_ORDER = { conflict: 0, pending: 1, local: 2, synced: 3 } as const;

const COLUMNS: ColumnDef<StoredScenario>[] = [
  {
    id: 'name',
    accessorFn: (s) => s.name,
    sortingFn: (a, b) => a.original.name.localeCompare(b.original.name),
  },
  { id: 'state', accessorFn: (s) => STATE_ORDER[s.syncState] },
  { id: 'updatedAt', accessorFn: (s) => s.updatedAt },
];

const SORTS: Record<ScenarioSort, SortingState> = {
  edited: [{ id: 'updatedAt', desc: true }],
  name: [{ id: 'name', desc: false }],
  state: [
    { id: 'state', desc: false },
    { id: 'updatedAt', desc: true },
  ],
};

const matchesText: FilterFn<StoredScenario> = (row, _column, needle: string) =>
  `${row.original.name} ${row.original.document.notes ?? ''} ${row.original.document.model.kind}`
    .toLowerCase()
    .includes(needle);

export function useScenarioList(
  scenarios: StoredScenario[] | undefined,
  remoteSets: RemoteSet[] | undefined,
  filter: string,
  sort: ScenarioSort,
) {
  const table = useReactTable({
    data: scenarios ?? NONE,
    columns: COLUMNS,
    state: { sorting: SORTS[sort], globalFilter: filter.trim().toLowerCase() },
    globalFilterFn: matchesText,
    getColumnCanGlobalFilter: () => true,
    enableMultiSort: true,
    autoResetAll: false,
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const list = table.getRowModel().rows.map((r) => r.original);
  const sets = [...(remoteSets ?? [])].sort((a, b) => a.name.localeCompare(b.name));
  return {
    device: list.filter((s) => s.setId === null || !sets.some((t) => t.id === s.setId)),
    sets: sets.map((set) => ({ set, scenarios: list.filter((s) => s.setId === set.id) })),
  };
}
