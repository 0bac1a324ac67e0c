import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable();
    t.text('name').notNullable();
    t.text('password_hash').notNullable();
    // tokens issued before this instant are refused (sign-out everywhere, password change)
    t.timestamp('tokens_valid_after', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('create unique index users_email_lower on users (lower(email))');

  await knex.schema.createTable('desks', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable();
    t.uuid('created_by').references('users.id').onDelete('set null');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('desk_members', (t) => {
    t.uuid('desk_id').notNullable().references('desks.id').onDelete('cascade');
    t.uuid('user_id').notNullable().references('users.id').onDelete('cascade');
    t.text('role').notNullable();
    t.timestamp('joined_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['desk_id', 'user_id']);
  });
  await knex.raw(
    "alter table desk_members add constraint desk_members_role check (role in ('lead', 'trader', 'analyst'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('desk_members');
  await knex.schema.dropTable('desks');
  await knex.schema.dropTable('users');
}
