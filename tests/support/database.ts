/** The test database that `npm test` starts; API and browser tests need it. */
import type { Knex } from 'knex';
import { createDb } from '../../server/db';

export function testDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error(
      'These tests need the throwaway PostgreSQL that `npm test` starts (DATABASE_URL is unset).',
    );
  }
  return url;
}

export function testDb(): Knex {
  return createDb(testDatabaseUrl());
}

export const uniqueEmail = (label: string) =>
  `${label}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@example.test`;
