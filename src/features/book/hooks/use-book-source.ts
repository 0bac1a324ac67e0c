/**
 * The books the Book page can open, as one list: those kept on this device only, and those in
 * the desk's sets on the service (synced like scenarios). A picked book is read and changed
 * through one shape, whichever kind it is.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ConflictChoice } from '../../../components/ConflictChoices';
import type { Position } from '../../../engine/book';
import { appDb, type RemoteSet, type StoredDeskBook } from '../../../store/db';
import { createBook, updateBook } from '../../../store/books';
import { newDeskBook, saveDeskBook } from '../../../store/desk-books';
import { remoteSetsQuery } from '../../../store/hooks';
import { keepBoth, keepMine, takeTheirs } from '../../../sync/conflicts';
import { nudgeSync } from '../../../sync/sync-loop';
import { bookKeys, deskBooksQuery, localBooksQuery } from '../api/queries';

export interface BookChange {
  name?: string;
  scenarioIds?: string[];
  baseScenarioId?: string | null;
  positions?: Position[];
}

export interface OpenBook {
  /** "device:<id>" or "desk:<id>" */
  key: string;
  id: string;
  name: string;
  scenarioIds: string[];
  baseScenarioId: string | null;
  positions: Position[];
  /** the desk set it is kept in, or null on this device only */
  set: RemoteSet | null;
  /** the desk book as synced (its state, conflict, refusal), or null on this device only */
  synced: StoredDeskBook | null;
  /** false for a desk book the user may only read (an analyst) */
  editable: boolean;
}

export type Resolution = ConflictChoice;

export function useBooks() {
  const device = useQuery(localBooksQuery);
  const desk = useQuery(deskBooksQuery);
  const sets = useQuery(remoteSetsQuery);
  const remoteSets = sets.data ?? [];
  const books: OpenBook[] = [
    ...(device.data ?? []).map((b) => ({
      key: `device:${b.id}`,
      id: b.id,
      name: b.name,
      scenarioIds: b.scenarioIds,
      baseScenarioId: b.baseScenarioId,
      positions: b.positions,
      set: null,
      synced: null,
      editable: true,
    })),
    ...(desk.data ?? []).flatMap((b) => {
      const set = remoteSets.find((s) => s.id === b.setId);
      if (!set) return [];
      return [
        {
          key: `desk:${b.id}`,
          id: b.id,
          name: b.name,
          scenarioIds: b.document.scenarioIds,
          baseScenarioId: b.document.baseScenarioId,
          positions: b.document.positions,
          set,
          synced: b,
          editable: set.canWrite,
        },
      ];
    }),
  ];
  return {
    books,
    /** the desk sets a new book may go into */
    writableSets: remoteSets.filter((s) => s.canWrite),
    isPending: device.isPending || desk.isPending || sets.isPending,
  };
}

function useInvalidate() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: bookKeys.books });
    void qc.invalidateQueries({ queryKey: bookKeys.deskBooks });
    void qc.invalidateQueries({ queryKey: ['local', 'unsynced'] });
  };
}

/** A new book: on this device (setId null) or in a desk set, over the given scenarios. */
export function useCreateBook() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: async (a: { name: string; scenarioIds: string[]; setId: string | null }) => {
      if (a.setId === null)
        return `device:${(await createBook(appDb(), a.name, a.scenarioIds)).id}`;
      if (!a.name.trim()) throw new Error('Give the book a name.');
      const stored = await saveDeskBook(appDb(), newDeskBook(a.name, a.scenarioIds), a.setId);
      nudgeSync();
      return `desk:${stored.id}`;
    },
    onSuccess: invalidate,
  });
}

export function useChangeBook() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: async ({ book, change }: { book: OpenBook; change: BookChange }) => {
      if (!book.synced) return updateBook(appDb(), book.id, change);
      if (!book.editable) throw new Error('You can read this book; leads and traders edit it.');
      await saveDeskBook(appDb(), { ...book.synced.document, ...change }, book.synced.setId);
      nudgeSync();
    },
    onSuccess: invalidate,
  });
}

export function useResolveBook() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: async ({ book, how }: { book: OpenBook; how: Resolution }) => {
      const db = appDb();
      if (how === 'mine') await keepMine(db, book.id, 'book');
      else if (how === 'theirs') await takeTheirs(db, book.id, 'book');
      else await keepBoth(db, book.id, book.editable, 'book');
      nudgeSync();
    },
    onSuccess: invalidate,
  });
}
