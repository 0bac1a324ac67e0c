/** A scenario's revision history, newest first, with who wrote each revision. */
import type { Knex } from 'knex';

/** The set a scenario lives in, or null when there is no such scenario. */
export async function setOfScenario(db: Knex, scenarioId: string): Promise<string | null> {
  return (await db('scenarios').where({ id: scenarioId }).first('set_id'))?.set_id ?? null;
}

export async function listRevisions(db: Knex, scenarioId: string) {
  const revisions = await db('scenario_revisions as r')
    .leftJoin('users as u', 'u.id', 'r.author_id')
    .where('r.scenario_id', scenarioId)
    .orderBy('r.revision', 'desc')
    .select(
      'r.revision',
      'r.document',
      'r.deleted',
      'r.created_at',
      'u.name as author',
      'u.id as author_id',
    );
  return revisions.map((v) => ({
    revision: v.revision,
    document: v.document,
    deleted: v.deleted,
    author: v.author,
    authorId: v.author_id,
    createdAt: new Date(v.created_at).toISOString(),
  }));
}
