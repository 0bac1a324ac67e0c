/** Desks, their members and roles, and e-mail invites. */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { deskSpace, isUuid, nextVersion, requireDeskRole } from '../access';
import { hashToken, newOneTimeToken } from '../auth/one-time-tokens';
import { HttpError, notFound, parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';

const role = z.enum(['lead', 'trader', 'analyst'], { error: 'must be lead, trader or analyst' });
const deskBody = z.object({ name: z.string().trim().min(1, 'must not be empty').max(100) });
const roleBody = z.object({ role });
const inviteBody = z.object({
  email: z.string().trim().toLowerCase().email('must be an e-mail address').max(254),
  role,
});
const acceptBody = z.object({ token: z.string().min(20).max(200) });
export const INVITE_DAYS = 7;

export function desksRouter(db: Knex, auth: RequestHandler, mailer: Mailer, appUrl: string) {
  const r = Router();
  const param = (v: unknown) => {
    const s = String(v);
    if (!isUuid(s)) throw notFound();
    return s;
  };

  r.get('/desks', auth, async (req, res) => {
    const desks = await db('desk_members as m')
      .join('desks as d', 'd.id', 'm.desk_id')
      .where('m.user_id', req.user!.id)
      .select('d.id', 'd.name', 'm.role')
      .orderBy('d.name');
    res.json({ desks });
  });

  r.post('/desks', auth, async (req, res) => {
    const body = parseOr400(deskBody, req.body, 'body');
    const desk = await db.transaction(async (trx) => {
      const [d] = await trx('desks')
        .insert({ name: body.name, created_by: req.user!.id })
        .returning(['id', 'name']);
      await trx('desk_members').insert({ desk_id: d.id, user_id: req.user!.id, role: 'lead' });
      await nextVersion(trx, deskSpace(d.id));
      return d;
    });
    res.status(201).json({ desk: { ...desk, role: 'lead' } });
  });

  r.get('/desks/:deskId/members', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    await requireDeskRole(db, req.user!.id, deskId);
    const members = await db('desk_members as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where('m.desk_id', deskId)
      .select('u.id', 'u.name', 'u.email', 'm.role', 'm.joined_at as joinedAt')
      .orderBy('u.name');
    res.json({ members });
  });

  /** Leads change roles; the desk always keeps at least one lead. */
  r.patch('/desks/:deskId/members/:userId', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const userId = param(req.params.userId);
    const body = parseOr400(roleBody, req.body, 'body');
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    await db.transaction(async (trx) => {
      const leads = await lockMembers(trx, deskId);
      const target = leads.find((m) => m.user_id === userId);
      if (!target) throw notFound('no such member');
      if (target.role === 'lead' && body.role !== 'lead' && countLeads(leads) === 1)
        throw new HttpError(
          409,
          'last-lead',
          'the desk needs a lead: make someone else lead first',
        );
      await trx('desk_members')
        .where({ desk_id: deskId, user_id: userId })
        .update({ role: body.role });
    });
    res.json({ ok: true, role: body.role });
  });

  /** A lead removes a member; any member removes themself (leaves); never the last lead. */
  r.delete('/desks/:deskId/members/:userId', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const userId = param(req.params.userId);
    const self = userId === req.user!.id;
    await requireDeskRole(
      db,
      req.user!.id,
      deskId,
      self ? ['lead', 'trader', 'analyst'] : ['lead'],
    );
    await db.transaction(async (trx) => {
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
    res.json({ ok: true });
  });

  r.get('/desks/:deskId/invites', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    const invites = await db('invites')
      .where({ desk_id: deskId })
      .whereNull('accepted_at')
      .whereNull('revoked_at')
      .where('expires_at', '>', db.fn.now())
      .select('id', 'email', 'role', 'expires_at as expiresAt', 'created_at as createdAt')
      .orderBy('created_at', 'desc');
    res.json({ invites });
  });

  r.post('/desks/:deskId/invites', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const body = parseOr400(inviteBody, req.body, 'body');
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    const member = await db('desk_members as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where('m.desk_id', deskId)
      .whereRaw('lower(u.email) = ?', [body.email])
      .first();
    if (member)
      throw new HttpError(
        409,
        'already-member',
        'that person is already on the desk',
        'body.email',
      );
    const desk = await db('desks').where({ id: deskId }).first('name');
    const { token, hash } = newOneTimeToken();
    const [invite] = await db('invites')
      .insert({
        desk_id: deskId,
        email: body.email,
        role: body.role,
        token_hash: hash,
        invited_by: req.user!.id,
        expires_at: new Date(Date.now() + INVITE_DAYS * 86400_000),
      })
      .returning(['id', 'email', 'role', 'expires_at as expiresAt']);
    // the link is built from the configured public URL, never from the request's Host
    await mailer.send({
      to: body.email,
      subject: `${req.user!.name} invites you to the desk "${desk.name}" on Saltation`,
      text: [
        `${req.user!.name} invites you to join "${desk.name}" as ${body.role}.`,
        '',
        `Accept within ${INVITE_DAYS} days: ${appUrl}/invite?token=${token}`,
        '',
        'Sign in (or create an account) with this e-mail address to accept. The link works once.',
      ].join('\n'),
    });
    res.status(201).json({ invite });
  });

  r.delete('/desks/:deskId/invites/:inviteId', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const inviteId = param(req.params.inviteId);
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    const n = await db('invites')
      .where({ id: inviteId, desk_id: deskId })
      .whereNull('accepted_at')
      .update({ revoked_at: db.fn.now() });
    if (n === 0) throw notFound('no such invite');
    res.json({ ok: true });
  });

  r.post('/invites/accept', auth, async (req, res) => {
    const body = parseOr400(acceptBody, req.body, 'body');
    const joined = await db.transaction(async (trx) => {
      const invite = await trx('invites')
        .where({ token_hash: hashToken(body.token) })
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
      if (invite.email.toLowerCase() !== req.user!.email.toLowerCase())
        throw new HttpError(
          403,
          'invite-other-email',
          `this invite is for ${invite.email}; sign in with that address`,
        );
      await trx('invites').where({ id: invite.id }).update({ accepted_at: trx.fn.now() });
      await trx('desk_members')
        .insert({ desk_id: invite.desk_id, user_id: req.user!.id, role: invite.role })
        .onConflict(['desk_id', 'user_id'])
        .ignore();
      const desk = await trx('desks').where({ id: invite.desk_id }).first('id', 'name');
      const m = await trx('desk_members')
        .where({ desk_id: invite.desk_id, user_id: req.user!.id })
        .first('role');
      return { ...desk, role: m.role };
    });
    res.json({ desk: joined });
  });
  return r;
}

async function lockMembers(trx: Knex.Transaction, deskId: string) {
  return (await trx('desk_members')
    .where({ desk_id: deskId })
    .forUpdate()
    .select('user_id', 'role')) as {
    user_id: string;
    role: string;
  }[];
}
const countLeads = (members: { role: string }[]) => members.filter((m) => m.role === 'lead').length;
