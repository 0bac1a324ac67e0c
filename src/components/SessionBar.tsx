/** Who is signed in and how sync stands; starts and stops the sync loop with the session. */
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Link } from 'react-router';
import { meQuery } from '../api/session';
import { unsyncedQuery } from '../store/hooks';
import { startSync, stopSync, syncNow, useSyncStatus } from '../sync/sync-loop';

export function SessionBar() {
  const qc = useQueryClient();
  const me = useQuery(meQuery);
  const unsynced = useQuery(unsyncedQuery);
  const status = useSyncStatus();
  const userId = me.data?.user.id;
  useEffect(() => {
    if (userId)
      startSync(userId, () => {
        void qc.invalidateQueries({ queryKey: ['local'] });
        // an open history shows the revision a sync just wrote
        void qc.invalidateQueries({ queryKey: ['service', 'revisions'] });
      });
    else if (me.data === null) stopSync();
  }, [userId, me.data, qc]);
  if (me.isPending) return null;
  if (!me.data)
    return (
      <Link to="/signin" className="text-sm font-semibold text-teal" data-testid="sign-in-link">
        Sign in to share
      </Link>
    );
  const u = unsynced.data;
  const label =
    status.state === 'syncing'
      ? 'syncing…'
      : u && u.conflicts > 0
        ? `${u.conflicts} conflict${u.conflicts > 1 ? 's' : ''}`
        : u && u.pending > 0
          ? `${u.pending} to sync`
          : status.state === 'offline'
            ? 'offline: edits kept here'
            : status.state === 'error'
              ? 'sync failed: will retry'
              : 'all synced';
  return (
    <span className="inline-flex items-center gap-3 text-sm">
      <button
        type="button"
        onClick={() => void syncNow()}
        title={status.error ?? 'Sync now'}
        data-testid="sync-status"
        data-state={status.state}
        className={u && u.conflicts > 0 ? 'text-stressed' : 'text-muted'}
      >
        {label}
      </button>
      {status.live && (
        <span
          className="text-xs text-teal"
          data-testid="live-updates"
          title="Colleagues' edits arrive as they are saved"
        >
          live
        </span>
      )}
      <Link to="/account" className="text-ink/80 hover:text-teal" data-testid="account-link">
        {me.data.user.name}
      </Link>
    </span>
  );
}
