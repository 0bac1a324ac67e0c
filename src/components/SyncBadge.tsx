import type { SyncedItem } from '../store/db';

const TEXT = {
  local: 'this device only',
  synced: 'synced',
  pending: 'waiting to sync',
  conflict: 'conflict',
} as const;
const STYLE = {
  local: 'border-rule text-muted',
  synced: 'border-teal/40 text-teal',
  pending: 'border-warn/50 text-ink/80',
  conflict: 'border-stressed/60 text-stressed',
} as const;

/** A synced item's state (a scenario's or a desk book's), in words. */
export function SyncBadge({ s }: { s: SyncedItem }) {
  return (
    <span
      data-testid="sync-state"
      data-state={s.syncState}
      title={s.syncError ?? undefined}
      className={`rounded-full border px-2 py-0.5 text-xs ${STYLE[s.syncState]}`}
    >
      {s.syncError ? 'refused: see details' : TEXT[s.syncState]}
    </span>
  );
}
