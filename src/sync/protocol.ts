/** The sync service's push and pull messages (DESIGN.md), shared by the client and the server. */

export interface PushMutation {
  mutationId: string;
  scenarioId: string;
  setId: string;
  baseRevision: number;
  document?: unknown;
  deleted?: boolean;
}

export interface ServerCopy {
  revision: number;
  /** null when the server's copy is deleted */
  document: unknown;
  setId: string;
  deleted: boolean;
}

export interface MutationResult {
  mutationId: string;
  status: 'applied' | 'conflict' | 'denied' | 'invalid';
  revision?: number;
  /** on a conflict (and a denial where the caller may read): the server's copy */
  current?: ServerCopy;
  error?: string;
}

export interface PulledChange {
  scenarioId: string;
  setId: string;
  revision: number;
  /** null: deleted (a tombstone) */
  document: unknown;
  updatedBy: string | null;
  updatedAt: string;
}

export interface PulledSet {
  id: string;
  name: string;
  deskId: string | null;
  deleted: boolean;
  canWrite: boolean;
  canManage: boolean;
}

export interface PullAnswer {
  cursor: string;
  changes: PulledChange[];
  sets: PulledSet[];
  /** scenarios the caller can no longer see */
  removed: string[];
  removedSets: string[];
  /** more changes wait: pull again with the new cursor */
  more: boolean;
}

export interface SyncTransport {
  push(mutations: PushMutation[]): Promise<{ results: MutationResult[] }>;
  pull(since: string): Promise<PullAnswer>;
}
