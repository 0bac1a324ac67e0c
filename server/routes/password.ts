/**
 * Password change (signed in) and reset by an e-mailed single-use link. Both end every other
 * session (tokens issued before the change are refused); the answer to a reset request never
 * says whether the address has an account.
 */
import { Router, type RequestHandler, type Response } from 'express';
import rateLimit from 'express-rate-limit';
import type { Knex } from 'knex';
import {
  passwordChangeBody as changeBody,
  resetBody,
  resetRequestBody as requestBody,
} from '../../src/contracts';
import { hashToken, newOneTimeToken } from '../auth/one-time-tokens';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { issueToken } from '../auth/tokens';
import { HttpError, parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';

export const RESET_MINUTES = 60;

export function passwordRouter(
  db: Knex,
  secret: string,
  auth: RequestHandler,
  mailer: Mailer,
  appUrl: string,
  setSession: (res: Response, token: string) => void,
  log: (line: string) => void,
) {
  const r = Router();
  const limit = rateLimit({
    windowMs: 15 * 60_000,
    limit: 20,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  });

  r.post('/auth/password', limit, auth, async (req, res) => {
    const body = parseOr400(changeBody, req.body, 'body');
    const row = await db('users').where({ id: req.user!.id }).first('password_hash');
    if (!(await verifyPassword(row?.password_hash, body.currentPassword)))
      throw new HttpError(
        403,
        'bad-credentials',
        'the current password is wrong',
        'body.currentPassword',
      );
    const now = new Date();
    await db('users')
      .where({ id: req.user!.id })
      .update({ password_hash: await hashPassword(body.newPassword), tokens_valid_after: now });
    // this browser stays signed in with a fresh session; every other one is signed out
    const token = issueToken(secret, req.user!.id, now.getTime());
    setSession(res, token);
    res.json({ ok: true, token });
  });

  r.post('/auth/reset-request', limit, async (req, res) => {
    const body = parseOr400(requestBody, req.body, 'body');
    const user = await db('users')
      .whereRaw('lower(email) = ?', [body.email])
      .first('id', 'email', 'name');
    if (user) {
      const { token, hash } = newOneTimeToken();
      await db('password_resets').insert({
        token_hash: hash,
        user_id: user.id,
        expires_at: new Date(Date.now() + RESET_MINUTES * 60_000),
      });
      // not awaited: a known address answers as fast as an unknown one
      void mailer
        .send({
          to: user.email,
          subject: 'Reset your Saltation password',
          text: [
            `Someone asked to reset the password of ${user.email} on Saltation.`,
            '',
            `Choose a new one within ${RESET_MINUTES} minutes: ${appUrl}/reset?token=${token}`,
            '',
            'The link works once. If you did not ask for this, ignore this message.',
          ].join('\n'),
        })
        .catch((e: Error) => log(`reset mail to ${user.id} failed: ${e.message}`));
    }
    res
      .status(202)
      .json({ ok: true, message: 'if that address has an account, a reset link is on its way' });
  });

  r.post('/auth/reset', limit, async (req, res) => {
    const body = parseOr400(resetBody, req.body, 'body');
    await db.transaction(async (trx) => {
      const row = await trx('password_resets')
        .where({ token_hash: hashToken(body.token) })
        .forUpdate()
        .first();
      if (!row) throw new HttpError(404, 'reset-unknown', 'this reset link is not valid');
      if (row.used_at)
        throw new HttpError(410, 'reset-used', 'this reset link has been used already');
      if (new Date(row.expires_at).getTime() < Date.now())
        throw new HttpError(410, 'reset-expired', 'this reset link has expired; ask for a new one');
      await trx('password_resets')
        .where({ token_hash: row.token_hash })
        .update({ used_at: trx.fn.now() });
      await trx('users')
        .where({ id: row.user_id })
        .update({
          password_hash: await hashPassword(body.newPassword),
          tokens_valid_after: new Date(),
        });
    });
    res.json({ ok: true });
  });
  return r;
}
