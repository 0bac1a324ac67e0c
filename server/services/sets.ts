/**
 * Scenario sets in the database: listed for a user's spaces, created, renamed and deleted
 * (with tombstones). Each function takes the db handle first; access checks stay with the
 * caller (`access.ts`).
 */
import type { Knex } from 'knex';
import type { ScenarioSet } from '../../src/contracts';
import { canManage, canWrite, nextVersion, type SetRow, type Standing } from '../access';

/** The live sets of the given spaces, with the caller's standing in each, by name. */
export async function listSets(
  db: Knex,
  spaces: Map<string, Standing>,
): Promise<(ScenarioSet & { updatedAt: string })[]> {
  const rows = await db('scenario_sets as t')
    .leftJoin('desks as d', 'd.id', 't.desk_id')
    .whereIn('t.space', [...spaces.keys()])
    .where('t.deleted', false)
    .select('t.id', 't.name', 't.desk_id', 'd.name as desk_name', 't.space', 't.updated_at')
    .orderBy('t.name');
  const counts = await db('scenarios')
    .whereIn(
      'set_id',
      rows.map((t) => t.id),
    )
    .where({ deleted: false, kind: 'scenario' })
    .groupBy('set_id')
    .select('set_id', db.raw('count(*)::int as n'));
  const n = new Map(counts.map((c) => [c.set_id, c.n as number]));
  return rows.map((t) => {
    const standing = spaces.get(t.space)!;
    return {
      id: t.id,
      name: t.name,
      deskId: t.desk_id,
      deskName: t.desk_name,
      role: standing,
      canWrite: canWrite(standing),
      canManage: canManage(standing),
      scenarios: n.get(t.id) ?? 0,
      updatedAt: new Date(t.updated_at).toISOString(),
    };
  });
}

export function createSet(
  db: Knex,
  set: { name: string; deskId?: string; space: string; createdBy: string },
) {
  return db.transaction(async (trx) => {
    const version = await nextVersion(trx, set.space);
    const [row] = await trx('scenario_sets')
      .insert({
        name: set.name,
        desk_id: set.deskId ?? null,
        owner_id: set.deskId ? null : set.createdBy,
        space: set.space,
        change_version: version,
        created_by: set.createdBy,
      })
      .returning(['id', 'name', 'desk_id']);
    return { id: row.id as string, name: row.name as string, deskId: row.desk_id as string | null };
  });
}

export function renameSet(db: Knex, set: SetRow, name: string) {
  return db.transaction(async (trx) => {
    const version = await nextVersion(trx, set.space);
    await trx('scenario_sets')
      .where({ id: set.id })
      .update({ name, change_version: version, updated_at: trx.fn.now() });
  });
}

/** Deleting a set leaves a tombstone for the set and for each of its scenarios and books. */
export function deleteSet(db: Knex, set: SetRow, userId: string) {
  return db.transaction(async (trx) => {
    const live = await trx('scenarios').where({ set_id: set.id, deleted: false }).forUpdate();
    for (const s of live) {
      const version = await nextVersion(trx, set.space);
      await trx('scenarios')
        .where({ id: s.id })
        .update({
          revision: s.revision + 1,
          document: null,
          deleted: true,
          change_version: version,
          updated_by: userId,
          updated_at: trx.fn.now(),
        });
      await trx('scenario_revisions').insert({
        scenario_id: s.id,
        revision: s.revision + 1,
        document: null,
        deleted: true,
        author_id: userId,
      });
    }
    const version = await nextVersion(trx, set.space);
    await trx('scenario_sets')
      .where({ id: set.id })
      .update({ deleted: true, change_version: version, updated_at: trx.fn.now() });
  });
}
