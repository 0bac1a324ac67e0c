/**
 * A whole push in one transaction, with set-based reads and writes: one query for the mutation
 * ids seen before, one locked read of every scenario the push touches (in id order, so two
 * pushes never deadlock), one counter update per space (a block of numbers, taken under the
 * counter row's lock, so numbers still follow commit order and a pull never skips a change),
 * then one upsert of the scenarios, one insert of their revisions and one of the results.
 * Each mutation is judged on its own (access, role, document, base revision), in order: a later
 * mutation of the same scenario builds on the earlier one; a retried mutation id answers its
 * stored result.
 */
import type { Knex } from 'knex';
import { parseScenario, type Validated } from '../../src/engine/core';
import { parseBook } from '../../src/engine/book/book-document';
import type { ItemKind, MutationResult, PushMutation } from '../../src/contracts';
import { canManage, canWrite, setStanding, type SetRow, type Standing } from '../access';

interface ScenarioState {
  kind: ItemKind;
  revision: number;
  document: unknown;
  setId: string;
  deleted: boolean;
  exists: boolean;
}

interface Write {
  id: string;
  kind: ItemKind;
  setId: string;
  space: string;
  revision: number;
  document: string | null;
  deleted: boolean;
  exists: boolean;
}

const PARSERS: Record<ItemKind, (doc: unknown) => Validated<unknown>> = {
  scenario: parseScenario,
  book: parseBook,
};

const isUniqueViolation = (e: unknown) => (e as { code?: string }).code === '23505';

export async function applyPush(
  db: Knex,
  userId: string,
  mutations: readonly PushMutation[],
): Promise<MutationResult[]> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await db.transaction((trx) => applyAll(trx, userId, mutations));
    } catch (e) {
      // a concurrent create of the same scenario or the same mutation id: run again and see
      // the other transaction's result
      if (isUniqueViolation(e) && attempt < 3) continue;
      throw e;
    }
  }
}

async function applyAll(
  trx: Knex.Transaction,
  userId: string,
  mutations: readonly PushMutation[],
): Promise<MutationResult[]> {
  const ids = [...new Set(mutations.map((m) => m.mutationId))];
  const seen = new Map<string, { user_id: string; result: MutationResult }>(
    (await trx('sync_mutations').whereIn('mutation_id', ids)).map(
      (r: { mutation_id: string; user_id: string; result: MutationResult }) => [r.mutation_id, r],
    ),
  );
  const scenarioIds = [...new Set(mutations.map((m) => m.scenarioId))].sort();
  const state = new Map<string, ScenarioState>();
  for (const row of await trx('scenarios')
    .whereIn('id', scenarioIds)
    .orderBy('id')
    .forUpdate()
    .select('id', 'kind', 'revision', 'document', 'set_id', 'deleted'))
    state.set(row.id, {
      kind: row.kind,
      revision: row.revision,
      document: row.document,
      setId: row.set_id,
      deleted: row.deleted,
      exists: true,
    });
  const standings = new Map<string, { set: SetRow; standing: Standing } | null>();
  const standingOf = async (setId: string) => {
    if (!standings.has(setId)) standings.set(setId, await setStanding(trx, userId, setId));
    return standings.get(setId)!;
  };

  const results: MutationResult[] = [];
  const stored: { mutation_id: string; user_id: string; result: MutationResult }[] = [];
  const writes: Write[] = [];
  const finish = (m: PushMutation, result: MutationResult) => {
    seen.set(m.mutationId, { user_id: userId, result });
    stored.push({ mutation_id: m.mutationId, user_id: userId, result });
    results.push(result);
  };
  for (const m of mutations) {
    const before = seen.get(m.mutationId);
    if (before) {
      results.push(
        before.user_id === userId
          ? before.result
          : { mutationId: m.mutationId, status: 'invalid', error: 'mutation id already used' },
      );
      continue;
    }
    const kind: ItemKind = m.kind ?? 'scenario';
    const existing = state.get(m.scenarioId);
    const live = existing?.exists ? existing : undefined;
    const current = live && {
      revision: live.revision,
      document: live.document,
      setId: live.setId,
      deleted: live.deleted,
    };
    // the scenario stays in its set: it is the set that decides who may see it
    const setId = live ? live.setId : m.setId;
    const access = await standingOf(setId);
    if (!access) {
      finish(m, { mutationId: m.mutationId, status: 'denied', error: 'no such scenario set' });
      continue;
    }
    if (live && live.setId !== m.setId) {
      finish(m, {
        mutationId: m.mutationId,
        status: 'invalid',
        error: 'a scenario cannot move between sets; save a copy in the other set',
        current,
      });
      continue;
    }
    if (live && live.kind !== kind) {
      finish(m, {
        mutationId: m.mutationId,
        status: 'invalid',
        error: `kind: this id is a ${live.kind} on the service, not a ${kind}`,
      });
      continue;
    }
    const allowed = m.deleted ? canManage(access.standing) : canWrite(access.standing);
    if (!allowed) {
      finish(m, {
        mutationId: m.mutationId,
        status: 'denied',
        error: `a ${access.standing} may not ${m.deleted ? 'delete' : 'change'} ${kind}s in this set`,
        ...(current ? { current } : {}),
      });
      continue;
    }
    let document: unknown = null;
    if (!m.deleted) {
      const parsed = PARSERS[kind](m.document);
      if (!parsed.ok) {
        finish(m, {
          mutationId: m.mutationId,
          status: 'invalid',
          error: `document.${parsed.issues[0].path}: ${parsed.issues[0].message}`,
        });
        continue;
      }
      if ((parsed.value as { id?: unknown }).id !== m.scenarioId) {
        finish(m, {
          mutationId: m.mutationId,
          status: 'invalid',
          error: 'document.id must equal scenarioId',
        });
        continue;
      }
      document = parsed.value;
    }
    const currentRevision = live ? live.revision : 0;
    if (m.baseRevision !== currentRevision) {
      finish(m, { mutationId: m.mutationId, status: 'conflict', ...(current ? { current } : {}) });
      continue;
    }
    if (!live && m.deleted) {
      finish(m, { mutationId: m.mutationId, status: 'applied', revision: 0 });
      continue;
    }
    const revision = currentRevision + 1;
    const text = m.deleted ? null : JSON.stringify(document);
    writes.push({
      id: m.scenarioId,
      kind,
      setId,
      space: access.set.space,
      revision,
      document: text,
      deleted: Boolean(m.deleted),
      exists: Boolean(live),
    });
    state.set(m.scenarioId, {
      kind,
      revision,
      document,
      setId,
      deleted: Boolean(m.deleted),
      exists: true,
    });
    finish(m, { mutationId: m.mutationId, status: 'applied', revision });
  }

  if (writes.length > 0) {
    // a block of change numbers per space, spaces in order (two pushes never deadlock)
    const perSpace = new Map<string, number>();
    for (const w of writes) perSpace.set(w.space, (perSpace.get(w.space) ?? 0) + 1);
    const first = new Map<string, number>();
    for (const space of [...perSpace.keys()].sort()) {
      const n = perSpace.get(space)!;
      const r = await trx.raw(
        'insert into spaces (id, version) values (?, ?) on conflict (id) do update set version = spaces.version + ? returning version',
        [space, n, n],
      );
      first.set(space, Number(r.rows[0].version) - n + 1);
    }
    const versions = writes.map((w) => {
      const v = first.get(w.space)!;
      first.set(w.space, v + 1);
      return v;
    });
    // the scenarios table holds each scenario's last write of the push
    const last = new Map<string, { w: Write; version: number }>();
    writes.forEach((w, i) => last.set(w.id, { w, version: versions[i] }));
    await trx('scenarios')
      .insert(
        [...last.values()].map(({ w, version }) => ({
          id: w.id,
          kind: w.kind,
          set_id: w.setId,
          space: w.space,
          revision: w.revision,
          document: w.document,
          deleted: w.deleted,
          change_version: version,
          updated_by: userId,
          updated_at: trx.fn.now(),
        })),
      )
      .onConflict('id')
      .merge(['revision', 'document', 'deleted', 'change_version', 'updated_by', 'updated_at']);
    await trx('scenario_revisions').insert(
      writes.map((w) => ({
        scenario_id: w.id,
        revision: w.revision,
        document: w.document,
        deleted: w.deleted,
        author_id: userId,
      })),
    );
  }
  if (stored.length > 0) await trx('sync_mutations').insert(stored);
  return results;
}
