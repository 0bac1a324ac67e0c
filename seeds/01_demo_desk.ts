// Demo data: an invented desk with one member per role. Runs only on an empty database, so
// restarting never overwrites anyone's work.
import argon2 from 'argon2';
import type { Knex } from 'knex';
import { DEMO_DESK, DEMO_USERS } from '../server/demo';

export async function seed(knex: Knex): Promise<void> {
  const existing = await knex('users').count<{ count: string }[]>({ count: '*' });
  if (Number(existing[0].count) > 0) return;
  await knex.transaction(async (trx) => {
    const ids: Record<string, string> = {};
    for (const u of DEMO_USERS) {
      const [row] = await trx('users')
        .insert({
          email: u.email,
          name: u.name,
          password_hash: await argon2.hash(u.password, { type: argon2.argon2id }),
        })
        .returning('id');
      ids[u.email] = row.id;
    }
    const [desk] = await trx('desks')
      .insert({ name: DEMO_DESK, created_by: ids[DEMO_USERS[0].email] })
      .returning('id');
    await trx('desk_members').insert(
      DEMO_USERS.map((u) => ({ desk_id: desk.id, user_id: ids[u.email], role: u.role })),
    );
    await trx('spaces').insert([
      { id: `desk:${desk.id}`, version: 0 },
      ...Object.values(ids).map((id) => ({ id: `user:${id}`, version: 0 })),
    ]);
  });
}
