/**
 * The browser's own database (IndexedDB through Dexie): the user's scenarios, the outbox of
 * edits not yet pushed to the sync service, and a cache of computed results. The browser is the
 * source of truth while offline: every edit lands here first.
 */
import Dexie, { type EntityTable } from 'dexie';
import type { BookDocument, Position } from '../engine/book';
import type { ScenarioDocument } from '../engine/core';
import type { PulledSet, ServerCopy } from '../contracts';

export type SyncState = 'local' | 'synced' | 'pending' | 'conflict';

/** What the sync engine keeps of every item it syncs: scenarios and the desk's books. */
export interface SyncedItem<D = unknown> {
  id: string;
  name: string;
  document: D;
  setId: string | null;
  /** server revision this copy is based on (0: never pushed) */
  revision: number;
  syncState: SyncState;
  updatedAt: number;
  /** when syncState is 'conflict': the server's copy the local edit collided with */
  conflict?: ServerCopy & { at: number };
  /** the service refused the last push of this item as invalid */
  syncError?: string;
  /** who wrote the server revision this copy is based on */
  updatedBy?: string | null;
}

export type StoredScenario = SyncedItem<ScenarioDocument>;

/** A book kept in one of the desk's sets on the service, as this device last saw or edited it. */
export type StoredDeskBook = SyncedItem<BookDocument> & { setId: string };

export interface OutboxEntry {
  seq?: number;
  mutationId: string;
  scenarioId: string;
  baseRevision: number;
  deleted: boolean;
  createdAt: number;
  /** the scenario's set when it was deleted (the row itself is gone) */
  setId?: string | null;
  /** a desk book's edit; a scenario's when not given (entries from before books) */
  kind?: 'book';
}

/** A scenario set on the sync service that this device has pulled (a live one). */
export type RemoteSet = Omit<PulledSet, 'deleted'>;

export interface MetaEntry {
  key: string;
  value: string;
}

/** A named group of scenarios on this device, with the book of positions it revalues. */
export interface LocalBook {
  id: string;
  name: string;
  scenarioIds: string[];
  /** the scenario whose unstressed parameters are the book's base */
  baseScenarioId: string | null;
  positions: Position[];
  updatedAt: number;
}

export interface CachedResult {
  key: string;
  kind: string;
  value: unknown;
  bytes: number;
  createdAt: number;
  lastUsedAt: number;
}

export class SaltationDb extends Dexie {
  scenarios!: EntityTable<StoredScenario, 'id'>;
  outbox!: EntityTable<OutboxEntry, 'seq'>;
  results!: EntityTable<CachedResult, 'key'>;
  /** the device-only books (the table keeps the name it was created with) */
  sets!: EntityTable<LocalBook, 'id'>;
  remoteSets!: EntityTable<RemoteSet, 'id'>;
  deskBooks!: EntityTable<StoredDeskBook, 'id'>;
  meta!: EntityTable<MetaEntry, 'key'>;

  constructor(name = 'saltation') {
    super(name, { chromeTransactionDurability: 'strict' });
    this.version(1).stores({
      scenarios: 'id, name, setId, syncState, updatedAt',
      outbox: '++seq, mutationId, scenarioId',
      results: 'key, kind, lastUsedAt',
    });
    this.version(2).stores({ sets: 'id, name, updatedAt' });
    this.version(3).stores({ remoteSets: 'id, deskId', meta: 'key' });
    this.version(4).stores({ deskBooks: 'id, setId, syncState' });
  }
}

let instance: SaltationDb | undefined;

/** The app's database, opened once; another tab upgrading the schema makes this one reload. */
export function appDb(): SaltationDb {
  if (!instance) {
    instance = new SaltationDb();
    instance.on('versionchange', () => {
      instance?.close();
      if (typeof location !== 'undefined') location.reload();
      return false;
    });
    if (typeof navigator !== 'undefined' && navigator.storage?.persist) {
      void navigator.storage.persist().catch(() => undefined);
    }
  }
  return instance;
}
