/**
 * Applies one pushed mutation in its own transaction: at most once per mutation id (the result
 * is stored with the write and answered again on a retry), only onto the revision the client
 * started from (otherwise a conflict carrying the server's document), only where the caller's
 * role allows, and only with a document the shared validator accepts.
 */
import type { Knex } from 'knex';
import { parseScenario } from '../../src/engine/core';
import { type MutationResult, type PushMutation } from '../../src/contracts';
import { canManage, canWrite, nextVersion, setStanding } from '../access';

export type { MutationResult };

type Mutation = PushMutation;

class Outcome extends Error {
  constructor(readonly result: MutationResult) {
    super(result.status);
  }
}

const isUniqueViolation = (e: unknown) => (e as { code?: string }).code === '23505';

export async function applyMutation(
  db: Knex,
  userId: string,
  m: Mutation,
): Promise<MutationResult> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await db.transaction((trx) => applyOnce(trx, userId, m));
    } catch (e) {
      if (e instanceof Outcome) return e.result;
      // a concurrent create of the same scenario, or the same mutation id arriving twice at
      // once: run again and see the other transaction's result
      if (isUniqueViolation(e) && attempt < 3) continue;
      throw e;
    }
  }
}

async function applyOnce(
  trx: Knex.Transaction,
  userId: string,
  m: Mutation,
): Promise<MutationResult> {
  const done = await trx('sync_mutations').where({ mutation_id: m.mutationId }).first();
  if (done) {
    if (done.user_id !== userId)
      return { mutationId: m.mutationId, status: 'invalid', error: 'mutation id already used' };
    return done.result as MutationResult;
  }
  const finish = async (result: MutationResult) => {
    await trx('sync_mutations').insert({ mutation_id: m.mutationId, user_id: userId, result });
    return result;
  };
  const existing = await trx('scenarios').where({ id: m.scenarioId }).forUpdate().first();
  const currentOf = (row: typeof existing) => ({
    revision: row.revision,
    document: row.document,
    setId: row.set_id,
    deleted: row.deleted,
  });
  // the scenario stays in its set: it is the set that decides who may see it
  const setId = existing ? existing.set_id : m.setId;
  const access = await setStanding(trx, userId, setId);
  if (!access)
    return finish({ mutationId: m.mutationId, status: 'denied', error: 'no such scenario set' });
  if (existing && existing.set_id !== m.setId)
    return finish({
      mutationId: m.mutationId,
      status: 'invalid',
      error: 'a scenario cannot move between sets; save a copy in the other set',
      current: currentOf(existing),
    });
  const allowed = m.deleted ? canManage(access.standing) : canWrite(access.standing);
  if (!allowed)
    return finish({
      mutationId: m.mutationId,
      status: 'denied',
      error: `a ${access.standing} may not ${m.deleted ? 'delete' : 'change'} scenarios in this set`,
      ...(existing ? { current: currentOf(existing) } : {}),
    });
  let document: unknown = null;
  if (!m.deleted) {
    const parsed = parseScenario(m.document);
    if (!parsed.ok)
      return finish({
        mutationId: m.mutationId,
        status: 'invalid',
        error: `document.${parsed.issues[0].path}: ${parsed.issues[0].message}`,
      });
    if ((parsed.value as { id?: unknown }).id !== m.scenarioId)
      return finish({
        mutationId: m.mutationId,
        status: 'invalid',
        error: 'document.id must equal scenarioId',
      });
    document = parsed.value;
  }
  const currentRevision = existing ? existing.revision : 0;
  if (m.baseRevision !== currentRevision)
    return finish({
      mutationId: m.mutationId,
      status: 'conflict',
      ...(existing ? { current: currentOf(existing) } : {}),
    });
  if (!existing && m.deleted)
    return finish({ mutationId: m.mutationId, status: 'applied', revision: 0 });
  const revision = currentRevision + 1;
  const version = await nextVersion(trx, access.set.space);
  const row = {
    revision,
    document: m.deleted ? null : JSON.stringify(document),
    deleted: Boolean(m.deleted),
    change_version: version,
    updated_by: userId,
    updated_at: trx.fn.now(),
  };
  if (existing) {
    const n = await trx('scenarios')
      .where({ id: m.scenarioId, revision: currentRevision })
      .update(row);
    if (n !== 1) throw new Outcome({ mutationId: m.mutationId, status: 'conflict' });
  } else {
    await trx('scenarios').insert({
      id: m.scenarioId,
      set_id: setId,
      space: access.set.space,
      ...row,
    });
  }
  await trx('scenario_revisions').insert({
    scenario_id: m.scenarioId,
    revision,
    document: row.document,
    deleted: row.deleted,
    author_id: userId,
  });
  return finish({ mutationId: m.mutationId, status: 'applied', revision });
}
