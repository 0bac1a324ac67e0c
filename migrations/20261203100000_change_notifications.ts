import type { Knex } from 'knex';

/**
 * Live updates across instances: every change counted in a space (its counter row moves) and
 * every change of desk membership is announced with NOTIFY, delivered on commit to each
 * instance that LISTENs, which tells its signed-in clients through their event streams.
 * Identical notifications within one transaction arrive once, so a batch of writes to one
 * space is one event.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    create function saltation_notify_space() returns trigger language plpgsql as $$
    begin
      perform pg_notify('saltation_changes', new.id);
      return null;
    end $$;
    create trigger spaces_notify after insert or update on spaces
      for each row execute function saltation_notify_space();
    create function saltation_notify_member() returns trigger language plpgsql as $$
    begin
      perform pg_notify('saltation_members', coalesce(new.user_id, old.user_id)::text);
      return null;
    end $$;
    create trigger desk_members_notify after insert or update or delete on desk_members
      for each row execute function saltation_notify_member();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger desk_members_notify on desk_members;
    drop function saltation_notify_member();
    drop trigger spaces_notify on spaces;
    drop function saltation_notify_space();
  `);
}
