// Demo data: an invented desk with one member per role. Runs only on an empty database, so
// restarting never overwrites anyone's work.
import argon2 from 'argon2';
import type { Knex } from 'knex';
import { DEMO_DESK, DEMO_SETS, DEMO_USERS } from '../server/demo';
import { demoScenarios } from '../src/store/demo-scenarios';

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
    // the desk's shared sets, each scenario at revision 1 by the lead
    const space = `desk:${desk.id}`;
    await trx('spaces').insert([
      { id: space, version: 0 },
      ...Object.values(ids).map((id) => ({ id: `user:${id}`, version: 0 })),
    ]);
    let version = 0;
    const lead = ids[DEMO_USERS[0].email];
    const base = demoScenarios(new Date().toISOString().slice(0, 10))[0];
    for (const set of DEMO_SETS) {
      const [row] = await trx('scenario_sets')
        .insert({
          name: set.name,
          desk_id: desk.id,
          space,
          change_version: ++version,
          created_by: lead,
        })
        .returning('id');
      for (const sc of set.scenarios) {
        const document = {
          ...base,
          id: sc.id,
          name: sc.name,
          notes: sc.notes,
          stress: { ...base.stress, ...sc.stress },
        };
        await trx('scenarios').insert({
          id: sc.id,
          set_id: row.id,
          space,
          revision: 1,
          document: JSON.stringify(document),
          change_version: ++version,
          updated_by: lead,
        });
        await trx('scenario_revisions').insert({
          scenario_id: sc.id,
          revision: 1,
          document: JSON.stringify(document),
          author_id: lead,
        });
      }
    }
    await trx('spaces').where({ id: space }).update({ version });
  });
}
