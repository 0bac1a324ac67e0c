/**
 * Pull: every change since the caller's cursor in each space they can see, tombstones
 * included, and the scenarios of spaces they can no longer see (to be removed locally).
 * The cursor is opaque to clients: base64url JSON of {space: last version seen}.
 */
import type { Knex } from 'knex';
import { canManage, canWrite, spacesOf, type Standing } from '../access';
import type { SessionUser } from '../auth/session';
import type { PullAnswer } from '../../src/contracts';
import { HttpError } from '../errors';
import { prepared } from '../prepared';

export type Cursor = Record<string, number>;

export function decodeCursor(since: string | undefined): Cursor {
  if (!since || since === '0') return {};
  try {
    const parsed = JSON.parse(Buffer.from(since, 'base64url').toString('utf8')) as unknown;
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) throw new Error();
    const out: Cursor = {};
    for (const [k, v] of Object.entries(parsed)) {
      if (!/^(desk|user):[0-9a-f-]{36}$/.test(k) || !Number.isSafeInteger(v) || (v as number) < 0)
        throw new Error();
      out[k] = v as number;
    }
    return out;
  } catch {
    throw new HttpError(
      400,
      'invalid-input',
      'query.since: not a cursor this service gave out',
      'query.since',
    );
  }
}

interface PulledRow {
  id: string;
  item_kind: 'scenario' | 'book';
  set_id: string;
  space: string;
  revision: number;
  document: unknown;
  deleted: boolean;
  change_version: string;
  updated_at: Date;
  updated_by: string | null;
}
interface PulledSetRow {
  id: string;
  name: string;
  desk_id: string | null;
  space: string;
  deleted: boolean;
  change_version: string;
}

export const encodeCursor = (c: Cursor) => Buffer.from(JSON.stringify(c)).toString('base64url');

export async function pull(
  db: Knex,
  user: SessionUser,
  since: string | undefined,
  limit = 1000,
  withBooks = false,
): Promise<PullAnswer> {
  const cursor = decodeCursor(since);
  const spaces = spacesOf(user);
  // in the order the query sorts them (byte order, as collate "C")
  const names = [...spaces.keys()].sort();
  const after = names.map((s) => cursor[s] ?? 0);
  const gone = Object.keys(cursor).filter((s) => !spaces.has(s));
  // a prepared statement: a polling client sends this every few seconds. One statement for
  // the scenarios (ordered, limited) and the sets changed in those spaces.
  const [changed, removed, removedSets] = await Promise.all([
    prepared<(PulledRow | PulledSetRow) & { kind: 'scenario' | 'set' }>(
      db,
      'pull-changes',
      `with c as (select unnest($1::text[]) as space, unnest($2::bigint[]) as after)
       (select 'scenario' as kind, s.kind as item_kind, s.id, s.set_id, s.space, s.revision,
               s.document, s.deleted, s.change_version, s.updated_at, u.name as updated_by,
               null as name, null::uuid as desk_id
        from c join scenarios s on s.space = c.space and s.change_version > c.after
        left join users u on u.id = s.updated_by
        where $4::boolean or s.kind = 'scenario'
        order by s.space collate "C", s.change_version limit $3)
       union all
       (select 'set', null, t.id, null, t.space, null, null, t.deleted, t.change_version, null, null,
               t.name, t.desk_id
        from c join scenario_sets t on t.space = c.space and t.change_version > c.after)`,
      [names, after, limit + 1, withBooks],
    ),
    gone.length
      ? db('scenarios')
          .whereIn('space', gone)
          .modify((q) => (withBooks ? q : q.where('kind', 'scenario')))
          .pluck('id')
      : Promise.resolve([]),
    gone.length ? db('scenario_sets').whereIn('space', gone).pluck('id') : Promise.resolve([]),
  ]);
  const all = changed;
  const rows = all.filter((r) => r.kind === 'scenario') as PulledRow[];
  const setRows = all.filter((r) => r.kind === 'set') as PulledSetRow[];
  const more = rows.length > limit;
  const sent = more ? rows.slice(0, limit) : rows;
  const next: Cursor = {};
  names.forEach((s, i) => (next[s] = after[i]));
  for (const t of setRows) next[t.space] = Math.max(next[t.space], Number(t.change_version));
  for (const r of sent) next[r.space] = Math.max(next[r.space], Number(r.change_version));
  if (more) {
    // the space the limit cut through resumes after its last scenario sent
    const last = sent[sent.length - 1];
    next[last.space] = Number(last.change_version);
    const cut = names.indexOf(last.space);
    // spaces after the cut were not reached: keep their old positions
    names.slice(cut + 1).forEach((s) => (next[s] = cursor[s] ?? 0));
  }
  return {
    cursor: encodeCursor(next),
    changes: sent.map((r) => ({
      scenarioId: r.id,
      kind: r.item_kind,
      setId: r.set_id,
      revision: r.revision,
      document: r.deleted ? null : r.document,
      updatedBy: r.updated_by,
      updatedAt: new Date(r.updated_at).toISOString(),
    })),
    sets: setRows.map((t) => {
      const standing = spaces.get(t.space) as Standing;
      return {
        id: t.id,
        name: t.name,
        deskId: t.desk_id,
        deleted: t.deleted,
        canWrite: canWrite(standing),
        canManage: canManage(standing),
      };
    }),
    removed,
    removedSets,
    more,
  };
}
