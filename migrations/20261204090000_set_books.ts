import type { Knex } from 'knex';

/**
 * A set's books of positions ride in the same table as its scenarios, told apart by `kind`, so
 * a book has what a scenario has: revisions, conditional writes (conflicts), the set's roles,
 * tombstones, pull cursors and change notifications. A row never changes kind.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('scenarios', (t) => {
    t.text('kind').notNullable().defaultTo('scenario');
  });
  await knex.raw(
    "alter table scenarios add constraint scenarios_kind check (kind in ('scenario', 'book'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table scenarios drop constraint scenarios_kind');
  await knex.schema.alterTable('scenarios', (t) => {
    t.dropColumn('kind');
  });
}
