/** The Book feature's query keys and options: device-only books, desk books, revaluation. */
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { BookRequest } from '../../../workers/engine-api';
import { appDb } from '../../../store/db';
import { listBooks } from '../../../store/books';
import { listDeskBooks } from '../../../store/desk-books';
import { engineWorker } from '../../../workers/engine-client';

export const bookKeys = {
  books: ['local', 'books'] as const,
  deskBooks: ['local', 'desk-books'] as const,
  revaluation: (request: BookRequest | null) => ['engine', 'book', request] as const,
  jumpExposure: (request: BookRequest | null) => ['engine', 'book-jumps', request] as const,
};

export const localBooksQuery = queryOptions({
  queryKey: bookKeys.books,
  queryFn: () => listBooks(appDb()),
  staleTime: Infinity,
});

export const deskBooksQuery = queryOptions({
  queryKey: bookKeys.deskBooks,
  queryFn: () => listDeskBooks(appDb()),
  staleTime: Infinity,
});

export const revaluationQuery = (request: BookRequest | null) =>
  queryOptions({
    queryKey: bookKeys.revaluation(request),
    queryFn: () => engineWorker().book(request!),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });

/** Asked after the revaluation (the worker answers in order): the matrix shows first. */
export const jumpExposureQuery = (request: BookRequest | null) =>
  queryOptions({
    queryKey: bookKeys.jumpExposure(request),
    queryFn: () => engineWorker().bookJumpExposure(request!),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
