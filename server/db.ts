/** The service's Knex instance, with migrations and seeds resolved from the project root. */
import knex, { type Knex } from 'knex';
import { fileURLToPath } from 'node:url';
import { knexConfig } from '../knexfile';

const root = fileURLToPath(new URL('..', import.meta.url));

export function createDb(connectionString: string): Knex {
  const base = knexConfig(connectionString);
  return knex({
    ...base,
    migrations: { ...base.migrations, directory: `${root}migrations` },
    seeds: { ...base.seeds, directory: `${root}seeds` },
  });
}

/** Any fixed number: the advisory lock under which instances migrate, one at a time. */
const MIGRATION_LOCK = 4_310_001;

/**
 * Runs pending migrations under a PostgreSQL advisory lock held by a transaction, so that
 * instances starting together migrate once: the others wait, then find nothing pending.
 * Errors say which migration failed.
 */
export async function migrate(db: Knex): Promise<string[]> {
  try {
    return await db.transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(?)', [MIGRATION_LOCK]);
      const [, applied] = (await db.migrate.latest()) as [number, string[]];
      return applied;
    });
  } catch (error) {
    throw new Error(`A database migration failed: ${(error as Error).message}`, { cause: error });
  }
}

/** The names of migrations not yet applied. */
export async function pendingMigrations(db: Knex): Promise<string[]> {
  const [, pending] = (await db.migrate.list()) as [unknown[], { file: string }[]];
  return pending.map((m) => m.file);
}

/** The demo desk, under the same lock (two instances starting together seed it once). */
export async function seed(db: Knex): Promise<void> {
  await db.transaction(async (trx) => {
    await trx.raw('select pg_advisory_xact_lock(?)', [MIGRATION_LOCK]);
    await db.seed.run();
  });
}

export async function databaseIsUp(db: Knex): Promise<boolean> {
  try {
    await db.raw('select 1');
    return true;
  } catch {
    return false;
  }
}
