/** Desks, their members and roles, and e-mail invites: parse, check access, call the service. */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { deskBody, inviteAcceptBody, inviteBody, roleBody } from '../../src/contracts';
import { isUuid, requireDeskRole } from '../access';
import { notFound, parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';
import * as desks from '../services/desks';

export { INVITE_DAYS } from '../services/desks';

export function desksRouter(db: Knex, auth: RequestHandler, mailer: Mailer, appUrl: string) {
  const r = Router();
  const param = (v: unknown) => {
    const s = String(v);
    if (!isUuid(s)) throw notFound();
    return s;
  };

  r.get('/desks', auth, async (req, res) => {
    res.json({ desks: await desks.listDesks(db, req.user!.id) });
  });

  r.post('/desks', auth, async (req, res) => {
    const body = parseOr400(deskBody, req.body, 'body');
    res.status(201).json({ desk: await desks.createDesk(db, req.user!.id, body.name) });
  });

  r.get('/desks/:deskId/members', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    await requireDeskRole(db, req.user!.id, deskId);
    res.json({ members: await desks.listMembers(db, deskId) });
  });

  /** Leads change roles; the desk always keeps at least one lead. */
  r.patch('/desks/:deskId/members/:userId', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const userId = param(req.params.userId);
    const body = parseOr400(roleBody, req.body, 'body');
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    await desks.changeRole(db, deskId, userId, body.role);
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
    await desks.removeMember(db, deskId, userId);
    res.json({ ok: true });
  });

  r.get('/desks/:deskId/invites', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    res.json({ invites: await desks.listOpenInvites(db, deskId) });
  });

  r.post('/desks/:deskId/invites', auth, async (req, res) => {
    const deskId = param(req.params.deskId);
    const body = parseOr400(inviteBody, req.body, 'body');
    await requireDeskRole(db, req.user!.id, deskId, ['lead']);
    const { invite, token, deskName } = await desks.createInvite(db, {
      deskId,
      email: body.email,
      role: body.role,
      invitedBy: req.user!.id,
    });
    // the link is built from the configured public URL, never from the request's Host
    await mailer.send({
      to: body.email,
      subject: `${req.user!.name} invites you to the desk "${deskName}" on Saltation`,
      text: [
        `${req.user!.name} invites you to join "${deskName}" as ${body.role}.`,
        '',
        `Accept within ${desks.INVITE_DAYS} days: ${appUrl}/invite?token=${token}`,
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
    await desks.revokeInvite(db, deskId, inviteId);
    res.json({ ok: true });
  });

  r.post('/invites/accept', auth, async (req, res) => {
    const body = parseOr400(inviteAcceptBody, req.body, 'body');
    res.json({ desk: await desks.acceptInvite(db, req.user!, body.token) });
  });
  return r;
}
