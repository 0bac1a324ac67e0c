// The demo desk's shared scenario sets, each scenario at revision 1 by the desk's lead. Runs
// once: when the demo desk exists and none of its demo scenarios has ever been stored (a
// deleted one counts), so a lead who deletes them does not see them come back.
import type { Knex } from 'knex';
import { nextVersion } from '../server/access';
import { DEMO_DESK, DEMO_SETS, DEMO_USERS } from '../server/demo';
import { demoScenarios } from '../src/store/demo-scenarios';

export async function seed(knex: Knex): Promise<void> {
  const desk = await knex('desks').where({ name: DEMO_DESK }).first('id');
  const lead = await knex('users').whereRaw('lower(email) = ?', [DEMO_USERS[0].email]).first('id');
  if (!desk || !lead) return;
  const ids = DEMO_SETS.flatMap((s) => s.scenarios.map((sc) => sc.id));
  const seen = await knex('scenarios')
    .whereIn('id', ids)
    .count<{ count: string }[]>({ count: '*' });
  if (Number(seen[0].count) > 0) return;
  const space = `desk:${desk.id}`;
  const base = demoScenarios(new Date().toISOString().slice(0, 10))[0];
  await knex.transaction(async (trx) => {
    const next = () => nextVersion(trx, space);
    for (const set of DEMO_SETS) {
      const [row] = await trx('scenario_sets')
        .insert({
          name: set.name,
          desk_id: desk.id,
          space,
          change_version: await next(),
          created_by: lead.id,
        })
        .returning('id');
      for (const sc of set.scenarios) {
        const document = JSON.stringify({
          ...base,
          id: sc.id,
          name: sc.name,
          notes: sc.notes,
          stress: { ...base.stress, ...sc.stress },
        });
        await trx('scenarios').insert({
          id: sc.id,
          set_id: row.id,
          space,
          revision: 1,
          document,
          change_version: await next(),
          updated_by: lead.id,
        });
        await trx('scenario_revisions').insert({
          scenario_id: sc.id,
          revision: 1,
          document,
          author_id: lead.id,
        });
      }
    }
  });
}
