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

/** Runs pending migrations; errors say which migration failed. */
export async function migrate(db: Knex): Promise<string[]> {
  try {
    const [, applied] = (await db.migrate.latest()) as [number, string[]];
    return applied;
  } catch (error) {
    throw new Error(`A database migration failed: ${(error as Error).message}`, { cause: error });
  }
}

export async function seed(db: Knex): Promise<void> {
  await db.seed.run();
}

export async function databaseIsUp(db: Knex): Promise<boolean> {
  try {
    await db.raw('select 1');
    return true;
  } catch {
    return false;
  }
}
