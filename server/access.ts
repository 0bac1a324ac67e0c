/**
 * Who may see and change what, read from the database on every request (roles are never in
 * the token). A desk's sets are readable by its members and writable by leads and traders;
 * deleting and managing a desk's sets is for leads; personal sets belong to their owner.
 */
import type { Knex } from 'knex';
import { HttpError } from './errors';

import type { Role } from '../src/contracts';

export type { Role };
/** the caller's standing on a set: its owner, or their role on the set's desk */
export type Standing = 'owner' | Role;

export const deskSpace = (deskId: string) => `desk:${deskId}`;
export const userSpace = (userId: string) => `user:${userId}`;

export async function deskRole(db: Knex, userId: string, deskId: string): Promise<Role | null> {
  const row = await db('desk_members').where({ desk_id: deskId, user_id: userId }).first('role');
  return (row?.role as Role | undefined) ?? null;
}

/** The caller's role on a desk, or 404 when they are not a member (as if it did not exist). */
export async function requireDeskRole(
  db: Knex,
  userId: string,
  deskId: string,
  allowed: readonly Role[] = ['lead', 'trader', 'analyst'],
): Promise<Role> {
  const role = isUuid(deskId) ? await deskRole(db, userId, deskId) : null;
  if (!role) throw new HttpError(404, 'not-found', 'no such desk');
  if (!allowed.includes(role))
    throw new HttpError(403, 'forbidden', `a ${role} may not do this on the desk`);
  return role;
}

/** The spaces a user's pull covers: their own and one per desk they belong to. */
export function spacesOf(user: {
  id: string;
  memberships: { deskId: string; role: Role }[];
}): Map<string, Standing> {
  const spaces = new Map<string, Standing>([[userSpace(user.id), 'owner']]);
  for (const m of user.memberships) spaces.set(deskSpace(m.deskId), m.role);
  return spaces;
}

export interface SetRow {
  id: string;
  name: string;
  desk_id: string | null;
  owner_id: string | null;
  space: string;
  deleted: boolean;
}

/** A live set and the caller's standing on it, or null when they may not see it. */
export async function setStanding(
  db: Knex,
  userId: string,
  setId: string,
): Promise<{ set: SetRow; standing: Standing } | null> {
  if (!isUuid(setId)) return null;
  const set = (await db('scenario_sets').where({ id: setId, deleted: false }).first()) as
    SetRow | undefined;
  if (!set) return null;
  if (set.owner_id) return set.owner_id === userId ? { set, standing: 'owner' } : null;
  const role = await deskRole(db, userId, set.desk_id!);
  return role ? { set, standing: role } : null;
}

export const canWrite = (s: Standing) => s === 'owner' || s === 'lead' || s === 'trader';
export const canManage = (s: Standing) => s === 'owner' || s === 'lead';

export const isUuid = (s: string) =>
  /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(s);

/** The next number of a space's change counter, taken under the counter row's lock. */
export async function nextVersion(trx: Knex.Transaction, space: string): Promise<number> {
  const r = await trx.raw(
    'insert into spaces (id, version) values (?, 1) on conflict (id) do update set version = spaces.version + 1 returning version',
    [space],
  );
  return Number(r.rows[0].version);
}
