import type { Knex } from 'knex';

/**
 * Scenario sets (personal or desk-owned), scenarios with revisions, the per-space change
 * counters that pull cursors read, processed mutation ids, invites and password resets.
 *
 * A "space" is what a pull cursor counts in: one per desk ("desk:<id>") and one per user for
 * personal sets ("user:<id>"). Every write takes the next number of its space's counter row
 * under a row lock, so within a space numbers are handed out in commit order and a pull
 * never skips a change behind its cursor.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('spaces', (t) => {
    t.text('id').primary();
    t.bigInteger('version').notNullable().defaultTo(0);
  });

  await knex.schema.createTable('scenario_sets', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable();
    t.uuid('desk_id').references('desks.id').onDelete('cascade');
    t.uuid('owner_id').references('users.id').onDelete('cascade');
    t.text('space').notNullable().references('spaces.id');
    t.boolean('deleted').notNullable().defaultTo(false);
    t.bigInteger('change_version').notNullable();
    t.uuid('created_by').references('users.id').onDelete('set null');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['space', 'change_version']);
  });
  await knex.raw(
    'alter table scenario_sets add constraint scenario_sets_one_owner check ((desk_id is null) <> (owner_id is null))',
  );

  await knex.schema.createTable('scenarios', (t) => {
    t.uuid('id').primary();
    t.uuid('set_id').notNullable().references('scenario_sets.id').onDelete('cascade');
    t.text('space').notNullable().references('spaces.id');
    t.integer('revision').notNullable();
    t.jsonb('document');
    t.boolean('deleted').notNullable().defaultTo(false);
    t.bigInteger('change_version').notNullable();
    t.uuid('updated_by').references('users.id').onDelete('set null');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['space', 'change_version']);
    t.index(['set_id']);
  });

  await knex.schema.createTable('scenario_revisions', (t) => {
    t.bigIncrements('id');
    t.uuid('scenario_id').notNullable().references('scenarios.id').onDelete('cascade');
    t.integer('revision').notNullable();
    t.jsonb('document');
    t.boolean('deleted').notNullable().defaultTo(false);
    t.uuid('author_id').references('users.id').onDelete('set null');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['scenario_id', 'revision']);
  });

  await knex.schema.createTable('sync_mutations', (t) => {
    t.uuid('mutation_id').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('cascade');
    t.jsonb('result').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('invites', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('desk_id').notNullable().references('desks.id').onDelete('cascade');
    t.text('email').notNullable();
    t.text('role').notNullable();
    t.text('token_hash').notNullable().unique();
    t.uuid('invited_by').references('users.id').onDelete('set null');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('accepted_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    "alter table invites add constraint invites_role check (role in ('lead', 'trader', 'analyst'))",
  );

  await knex.schema.createTable('password_resets', (t) => {
    t.text('token_hash').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('cascade');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // spaces for what exists already
  await knex.raw("insert into spaces (id) select 'desk:' || id from desks on conflict do nothing");
  await knex.raw("insert into spaces (id) select 'user:' || id from users on conflict do nothing");
}

export async function down(knex: Knex): Promise<void> {
  for (const t of [
    'password_resets',
    'invites',
    'sync_mutations',
    'scenario_revisions',
    'scenarios',
    'scenario_sets',
    'spaces',
  ])
    await knex.schema.dropTable(t);
}
