// The demo desk's shared book, in its first demo set, at revision 1 by the desk's lead. Runs
// once: when that set exists and the book's id has never been stored (a deleted book counts).
import type { Knex } from 'knex';
import { nextVersion } from '../server/access';
import { DEMO_DESK, DEMO_DESK_BOOK, DEMO_SETS, DEMO_USERS } from '../server/demo';
import { BOOK_FORMAT, type BookDocument } from '../src/engine/book/book-document';
import { demoBookPositions } from '../src/store/demo-book';

export async function seed(knex: Knex): Promise<void> {
  const desk = await knex('desks').where({ name: DEMO_DESK }).first('id');
  const lead = await knex('users').whereRaw('lower(email) = ?', [DEMO_USERS[0].email]).first('id');
  if (!desk || !lead) return;
  const set = await knex('scenario_sets')
    .where({ desk_id: desk.id, name: DEMO_DESK_BOOK.setName, deleted: false })
    .first('id', 'space');
  if (!set) return;
  if (await knex('scenarios').where({ id: DEMO_DESK_BOOK.id }).first('id')) return;
  const scenarioIds = DEMO_SETS[0].scenarios.map((s) => s.id);
  const book: BookDocument = {
    format: BOOK_FORMAT,
    id: DEMO_DESK_BOOK.id,
    name: DEMO_DESK_BOOK.name,
    scenarioIds,
    baseScenarioId: scenarioIds[0],
    positions: demoBookPositions().map((p) => ({
      ...p,
      multiplier: DEMO_DESK_BOOK.multiplier,
      currency: DEMO_DESK_BOOK.currency,
    })),
  };
  const document = JSON.stringify(book);
  await knex.transaction(async (trx) => {
    await trx('scenarios').insert({
      id: book.id,
      kind: 'book',
      set_id: set.id,
      space: set.space,
      revision: 1,
      document,
      change_version: await nextVersion(trx, set.space),
      updated_by: lead.id,
    });
    await trx('scenario_revisions').insert({
      scenario_id: book.id,
      revision: 1,
      document,
      author_id: lead.id,
    });
  });
}
