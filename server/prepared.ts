/**
 * A named (prepared) statement on one of Knex's pooled pg connections: PostgreSQL parses and
 * plans it once per connection instead of on every request. For the few queries every request
 * or every poll runs; everything else goes through Knex. Errors (a database that is down, a
 * connection cut off) reach the error handler like any Knex error, and Knex's pool drops a
 * connection that failed.
 */
import type { Knex } from 'knex';

interface PgConnection {
  query(q: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }>;
}
interface PoolClient {
  acquireConnection(): Promise<PgConnection>;
  releaseConnection(c: PgConnection): Promise<void>;
}

export async function prepared<T>(
  db: Knex,
  name: string,
  text: string,
  values: unknown[],
): Promise<T[]> {
  const client = db.client as unknown as PoolClient;
  const connection = await client.acquireConnection();
  try {
    return (await connection.query({ name, text, values })).rows as T[];
  } finally {
    await client.releaseConnection(connection);
  }
}
