// Knex settings for the sync service. The server runs migrations itself at start; for the
// CLI: node --import tsx node_modules/knex/bin/cli.js --knexfile knexfile.ts migrate:latest
import type { Knex } from 'knex';

export function knexConfig(connectionString: string): Knex.Config {
  return {
    client: 'pg',
    connection: { connectionString, statement_timeout: 15000, application_name: 'saltation' },
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: 5000,
    migrations: {
      directory: './migrations',
      extension: 'ts',
      loadExtensions: ['.ts'],
      tableName: 'knex_migrations',
    },
    seeds: { directory: './seeds', extension: 'ts', loadExtensions: ['.ts'] },
  };
}

const config: Knex.Config = knexConfig(
  process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54310/saltation',
);

export default config;
