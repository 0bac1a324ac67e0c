import type { Knex } from 'knex';

/**
 * Rate-limit counters shared by every instance of the service: one row per limiter and key
 * (an address, an account), with its hits and when its window ends. Expired rows are reset by
 * the next hit and swept now and then.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limits', (t) => {
    t.text('key').primary();
    t.integer('hits').notNullable();
    t.timestamp('reset_at', { useTz: true }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limits');
}
