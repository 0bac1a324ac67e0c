import { useRegisterSW } from 'virtual:pwa-register/react';
import { syncNow } from '../sync/sync-loop';

/**
 * Offers a new version once its service worker is waiting; never reloads on its own. Before
 * reloading it gives the outbox one sync round (edits are safe in IndexedDB either way).
 */
export function UpdatePrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    updateServiceWorker,
  } = useRegisterSW();
  if (!needRefresh) return null;
  return (
    <div
      role="status"
      className="flex items-center gap-3 border-b border-rule bg-teal/10 px-6 py-2 text-sm"
    >
      A new version of Saltation is ready.
      <button
        type="button"
        className="font-semibold text-teal underline"
        onClick={() => void syncNow().finally(() => void updateServiceWorker(true))}
      >
        Reload to update
      </button>
      <button type="button" className="text-muted" onClick={() => setNeedRefresh(false)}>
        Later
      </button>
    </div>
  );
}
