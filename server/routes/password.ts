/**
 * Password change (signed in) and reset by an e-mailed single-use link. Both end every other
 * session (tokens issued before the change are refused); the answer to a reset request never
 * says whether the address has an account.
 */
import { Router, type RequestHandler, type Response } from 'express';
import rateLimit from 'express-rate-limit';
import type { LimitStore } from '../auth/rate-limit-store';
import type { Knex } from 'knex';
import {
  passwordChangeBody as changeBody,
  resetBody,
  resetRequestBody as requestBody,
} from '../../src/contracts';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { issueToken } from '../auth/tokens';
import { HttpError, parseOr400 } from '../errors';
import * as accounts from '../services/accounts';
import type { Mailer } from '../mail/mailer';

export { RESET_MINUTES } from '../services/accounts';

export function passwordRouter(
  db: Knex,
  secret: string,
  auth: RequestHandler,
  mailer: Mailer,
  appUrl: string,
  setSession: (res: Response, token: string) => void,
  log: (line: string) => void,
  limitStore: LimitStore,
) {
  const r = Router();
  const limit = rateLimit({
    store: limitStore('password'),
    windowMs: 15 * 60_000,
    limit: 20,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  });

  r.post('/auth/password', limit, auth, async (req, res) => {
    const body = parseOr400(changeBody, req.body, 'body');
    const current = await accounts.passwordHashOf(db, req.user!.id);
    if (!(await verifyPassword(current, body.currentPassword)))
      throw new HttpError(
        403,
        'bad-credentials',
        'the current password is wrong',
        'body.currentPassword',
      );
    const now = new Date();
    await accounts.setPassword(db, req.user!.id, await hashPassword(body.newPassword), now);
    // this browser stays signed in with a fresh session; every other one is signed out
    const token = issueToken(secret, req.user!.id, now.getTime());
    setSession(res, token);
    res.json({ ok: true, token });
  });

  r.post('/auth/reset-request', limit, async (req, res) => {
    const body = parseOr400(requestBody, req.body, 'body');
    const user = await accounts.findUserByEmail(db, body.email);
    if (user) {
      const token = await accounts.createReset(db, user.id);
      // not awaited: a known address answers as fast as an unknown one
      void mailer
        .send({
          to: user.email,
          subject: 'Reset your Saltation password',
          text: [
            `Someone asked to reset the password of ${user.email} on Saltation.`,
            '',
            `Choose a new one within ${accounts.RESET_MINUTES} minutes: ${appUrl}/reset?token=${token}`,
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
    await accounts.resetPassword(db, body.token, () => hashPassword(body.newPassword));
    res.json({ ok: true });
  });
  return r;
}
