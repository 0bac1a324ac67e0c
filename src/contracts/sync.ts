/**
 * The sync protocol: push mutations and pull changes since a cursor. A push applies each
 * mutation at most once per mutation id, only onto the revision the client started from
 * (`baseRevision`; 0 creates), and answers applied, conflict (with the server's copy), denied
 * or invalid. A pull answers every change the caller may see after the cursor, with
 * tombstones, the sets, and what the caller can no longer see.
 *
 * The promises the service and the sync engine keep (each one is tested):
 *  1. no acknowledged write is lost (the local save writes scenario and outbox row in one
 *     Dexie transaction; the service commits before it answers);
 *  2. a conflict is shown, never silently overwritten (a write is conditional on its base
 *     revision);
 *  3. each change takes effect exactly once, though delivery is at least once (a retried
 *     mutation id gets its first result again);
 *  4. pull never skips a change behind the cursor, and a user reads their own writes;
 *  5. when activity stops, every client equals what the service lets it see;
 *  6. offline edits survive a tab crash, a reload and a dead service;
 *  7. no one reads or writes where their role does not allow, and a role change takes effect
 *     on the next request;
 *  8. bad input gets a 4xx with a reason, never a 500, a hang or a crash.
 */
import { z } from 'zod';

/** What a set holds: scenarios, and books of positions revalued under them. */
export const itemKinds = ['scenario', 'book'] as const;
export type ItemKind = (typeof itemKinds)[number];

export const mutationSchema = z
  .object({
    mutationId: z.string().uuid('must be a UUID'),
    /** the scenario's id, or the book's when `kind` is "book" */
    scenarioId: z.string().uuid('must be a UUID'),
    /** "scenario" when not given; an item never changes kind */
    kind: z.enum(itemKinds, { error: 'must be "scenario" or "book"' }).optional(),
    setId: z.string().uuid('must be a UUID'),
    baseRevision: z.number().int().min(0, 'must be 0 or more'),
    document: z.unknown().optional(),
    deleted: z.boolean().optional(),
  })
  .refine((m) => m.deleted === true || m.document !== undefined, {
    message: 'a mutation carries a document or deleted: true',
    path: ['document'],
  });
export type PushMutation = z.infer<typeof mutationSchema>;

export const pushBody = z.object({ mutations: z.array(mutationSchema).min(1).max(200) });
/**
 * `books=1`: the client keeps books too. Clients from before books ask without it and are sent
 * scenarios only, so a book never lands among their scenarios.
 */
export const pullQuery = z.object({
  since: z.string().max(4000).optional(),
  books: z.enum(['0', '1'], { error: 'must be 0 or 1' }).optional(),
});

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
  /** the scenario's or the book's id */
  scenarioId: string;
  /** a scenario when not given (services from before books) */
  kind?: ItemKind;
  setId: string;
  revision: number;
  /** null: deleted (a tombstone) */
  document: unknown;
  updatedBy: string | null;
  updatedAt: string;
}

/** A scenario set as a pull carries it. */
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
