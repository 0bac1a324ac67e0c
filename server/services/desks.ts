/**
 * Desks, their members and invites, in the database. Each function takes the db handle (Knex
 * or a transaction) first; access checks stay with the caller (`access.ts`).
 */
import type { Knex } from 'knex';
import type { Role } from '../../src/contracts';
import { deskSpace, nextVersion } from '../access';
import { hashToken, newOneTimeToken } from '../auth/one-time-tokens';
import { HttpError, notFound } from '../errors';

export const INVITE_DAYS = 7;

export function listDesks(db: Knex, userId: string) {
  return db('desk_members as m')
    .join('desks as d', 'd.id', 'm.desk_id')
    .where('m.user_id', userId)
    .select('d.id', 'd.name', 'm.role')
    .orderBy('d.name');
}

/** A new desk with its creator as lead, and its change counter. */
export function createDesk(db: Knex, userId: string, name: string) {
  return db.transaction(async (trx) => {
    const [d] = await trx('desks').insert({ name, created_by: userId }).returning(['id', 'name']);
    await trx('desk_members').insert({ desk_id: d.id, user_id: userId, role: 'lead' });
    await nextVersion(trx, deskSpace(d.id));
    return { ...d, role: 'lead' as Role };
  });
}

export function listMembers(db: Knex, deskId: string) {
  return db('desk_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.desk_id', deskId)
    .select('u.id', 'u.name', 'u.email', 'm.role', 'm.joined_at as joinedAt')
    .orderBy('u.name');
}

async function lockMembers(trx: Knex.Transaction, deskId: string) {
  return (await trx('desk_members')
    .where({ desk_id: deskId })
    .forUpdate()
    .select('user_id', 'role')) as { user_id: string; role: string }[];
}
const countLeads = (members: { role: string }[]) => members.filter((m) => m.role === 'lead').length;

/** A member's new role; the desk always keeps at least one lead. */
export function changeRole(db: Knex, deskId: string, userId: string, role: Role) {
  return db.transaction(async (trx) => {
    const members = await lockMembers(trx, deskId);
    const target = members.find((m) => m.user_id === userId);
    if (!target) throw notFound('no such member');
    if (target.role === 'lead' && role !== 'lead' && countLeads(members) === 1)
      throw new HttpError(409, 'last-lead', 'the desk needs a lead: make someone else lead first');
    await trx('desk_members').where({ desk_id: deskId, user_id: userId }).update({ role });
  });
}

/** A member off the desk; never the last lead. */
export function removeMember(db: Knex, deskId: string, userId: string) {
  return db.transaction(async (trx) => {
    const members = await lockMembers(trx, deskId);
    const target = members.find((m) => m.user_id === userId);
    if (!target) throw notFound('no such member');
    if (target.role === 'lead' && countLeads(members) === 1)
      throw new HttpError(
        409,
        'last-lead',
        'the last lead cannot leave: make someone else lead first',
      );
    await trx('desk_members').where({ desk_id: deskId, user_id: userId }).delete();
  });
}

/** Invites still open: not accepted, not withdrawn, not expired. */
export function listOpenInvites(db: Knex, deskId: string) {
  return db('invites')
    .where({ desk_id: deskId })
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .where('expires_at', '>', db.fn.now())
    .select('id', 'email', 'role', 'expires_at as expiresAt', 'created_at as createdAt')
    .orderBy('created_at', 'desc');
}

/** A new invite (refused for a present member) and its single-use token, stored hashed. */
export async function createInvite(
  db: Knex,
  invite: { deskId: string; email: string; role: Role; invitedBy: string },
) {
  const member = await db('desk_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.desk_id', invite.deskId)
    .whereRaw('lower(u.email) = ?', [invite.email])
    .first();
  if (member)
    throw new HttpError(409, 'already-member', 'that person is already on the desk', 'body.email');
  const desk = await db('desks').where({ id: invite.deskId }).first('name');
  const { token, hash } = newOneTimeToken();
  const [row] = await db('invites')
    .insert({
      desk_id: invite.deskId,
      email: invite.email,
      role: invite.role,
      token_hash: hash,
      invited_by: invite.invitedBy,
      expires_at: new Date(Date.now() + INVITE_DAYS * 86400_000),
    })
    .returning(['id', 'email', 'role', 'expires_at as expiresAt']);
  return { invite: row, token, deskName: desk.name as string };
}

export async function revokeInvite(db: Knex, deskId: string, inviteId: string) {
  const n = await db('invites')
    .where({ id: inviteId, desk_id: deskId })
    .whereNull('accepted_at')
    .update({ revoked_at: db.fn.now() });
  if (n === 0) throw notFound('no such invite');
}

/** Joins the desk of a valid, unused, unexpired invite addressed to this user's e-mail. */
export function acceptInvite(db: Knex, user: { id: string; email: string }, token: string) {
  return db.transaction(async (trx) => {
    const invite = await trx('invites')
      .where({ token_hash: hashToken(token) })
      .forUpdate()
      .first();
    if (!invite || invite.revoked_at)
      throw new HttpError(404, 'invite-unknown', 'this invite link is not valid');
    if (invite.accepted_at)
      throw new HttpError(410, 'invite-used', 'this invite link has been used already');
    if (new Date(invite.expires_at).getTime() < Date.now())
      throw new HttpError(
        410,
        'invite-expired',
        'this invite link has expired; ask the desk lead for a new one',
      );
    if (invite.email.toLowerCase() !== user.email.toLowerCase())
      throw new HttpError(
        403,
        'invite-other-email',
        `this invite is for ${invite.email}; sign in with that address`,
      );
    await trx('invites').where({ id: invite.id }).update({ accepted_at: trx.fn.now() });
    await trx('desk_members')
      .insert({ desk_id: invite.desk_id, user_id: user.id, role: invite.role })
      .onConflict(['desk_id', 'user_id'])
      .ignore();
    const desk = await trx('desks').where({ id: invite.desk_id }).first('id', 'name');
    const m = await trx('desk_members')
      .where({ desk_id: invite.desk_id, user_id: user.id })
      .first('role');
    return { ...desk, role: m.role };
  });
}
