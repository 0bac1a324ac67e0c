/**
 * The browser's sync loop while someone is signed in: a round at start, every 20 s, when the
 * browser comes back online, shortly after each local save, and at once when the service's
 * live-update stream says a visible space changed; after a failure it waits 2, 4, 8… up to
 * 60 s. The status is a small external store for React.
 */
import { useSyncExternalStore } from 'react';
import { apiFetch } from '../api/client';
import { appDb } from '../store/db';
import type { SyncTransport } from './protocol';
import { syncOnce, type SyncReport } from './sync-engine';
import { closeLiveEvents, openLiveEvents } from './live-events';

export interface SyncStatus {
  state: 'signed-out' | 'idle' | 'syncing' | 'offline' | 'error';
  lastSyncedAt: number | null;
  lastReport: SyncReport | null;
  error: string | null;
  /** the service's live-update stream is open: colleagues' edits arrive at once */
  live: boolean;
}

let status: SyncStatus = {
  state: 'signed-out',
  lastSyncedAt: null,
  lastReport: null,
  error: null,
  live: false,
};
const listeners = new Set<() => void>();
const set = (next: Partial<SyncStatus>) => {
  status = { ...status, ...next };
  listeners.forEach((l) => l());
};

export const httpTransport: SyncTransport = {
  push: (mutations) =>
    apiFetch('/sync/push', { method: 'POST', body: JSON.stringify({ mutations }) }),
  pull: (since) => apiFetch(`/sync/pull?since=${encodeURIComponent(since)}&books=1`),
};

let userId: string | null = null;
let timer: ReturnType<typeof setTimeout> | null = null;
let running: Promise<void> | null = null;
let again = false;
let failures = 0;
let onSynced: () => void = () => undefined;

function schedule(ms: number) {
  if (timer) clearTimeout(timer);
  timer = setTimeout(() => void round(), ms);
}

async function round(): Promise<void> {
  if (!userId) return;
  if (running) {
    again = true;
    return running;
  }
  const who = userId;
  running = (async () => {
    set({ state: 'syncing' });
    try {
      const report = await syncOnce(appDb(), httpTransport, who);
      failures = 0;
      set({ state: 'idle', lastSyncedAt: Date.now(), lastReport: report, error: null });
      onSynced();
      schedule(20_000);
      // the service answers: listen for changes (a no-op while a stream is open)
      openLiveEvents(
        () => void round(),
        (live) => set({ live }),
      );
    } catch (e) {
      failures++;
      const offline = typeof navigator !== 'undefined' && !navigator.onLine;
      const code = (e as { status?: number }).status;
      set({
        state: offline || code === 0 ? 'offline' : 'error',
        error: (e as Error).message,
      });
      schedule(Math.min(60_000, 1000 * 2 ** failures));
    }
  })();
  try {
    await running;
  } finally {
    running = null;
    if (again) {
      again = false;
      void round();
    }
  }
}

const online = () => void round();

export function startSync(id: string, afterSync: () => void): void {
  if (userId === id) return;
  stopSync();
  userId = id;
  onSynced = afterSync;
  window.addEventListener('online', online);
  void round();
}

export function stopSync(): void {
  userId = null;
  closeLiveEvents();
  if (timer) clearTimeout(timer);
  timer = null;
  window.removeEventListener('online', online);
  set({ state: 'signed-out', lastReport: null, error: null });
}

/** After a local save: sync soon (a burst of saves makes one round). */
export function nudgeSync(): void {
  if (userId) schedule(400);
}

/** Sync now (the "Sync now" button). */
export const syncNow = () => round();

export function useSyncStatus(): SyncStatus {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => status,
  );
}
