/**
 * Migrates and seeds the database at DATABASE_URL, for tests that make a cluster of their own
 * (Knex cannot load TypeScript migrations inside vitest, so this runs as its own process).
 */
import { createDb, migrate, seed } from '../../server/db';

const db = createDb(process.env.DATABASE_URL!);
try {
  await migrate(db);
  await seed(db);
} finally {
  await db.destroy();
}
