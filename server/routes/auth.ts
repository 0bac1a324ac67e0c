/** Accounts: register, sign in (JSON token and session cookie), sign out, current user. */
import { Router, type Response } from 'express';
import rateLimit from 'express-rate-limit';
import type { LimitStore } from '../auth/rate-limit-store';
import type { Knex } from 'knex';
import { registerBody, signinBody } from '../../src/contracts';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { requireUser } from '../auth/session';
import { issueToken, SESSION_COOKIE, SESSION_SECONDS } from '../auth/tokens';
import { HttpError, parseOr400 } from '../errors';
import * as accounts from '../services/accounts';
import { listDesks } from '../services/desks';

export function setSessionCookie(res: Response, token: string, secure: boolean) {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'strict',
    secure,
    maxAge: SESSION_SECONDS * 1000,
    path: '/',
  });
}

export function authRouter(
  db: Knex,
  secret: string,
  secureCookies: boolean,
  limitStore: LimitStore,
): Router {
  const r = Router();
  // The limiters run before argon2, so a flood of bad sign-ins cannot starve the thread pool;
  // their counters live in PostgreSQL, shared by every instance.
  const perAddress = rateLimit({
    store: limitStore('signin-address'),
    windowMs: 60_000,
    limit: 30,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  });
  const perAccount = rateLimit({
    store: limitStore('signin-account'),
    windowMs: 15 * 60_000,
    limit: 10,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) =>
      `acct:${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    skipSuccessfulRequests: true,
  });

  r.post('/auth/register', perAddress, async (req, res) => {
    const body = parseOr400(registerBody, req.body, 'body');
    const user = await accounts.createUser(db, {
      email: body.email,
      name: body.name,
      passwordHash: await hashPassword(body.password),
    });
    res.status(201).json({ user });
  });

  r.post('/auth/signin', perAddress, perAccount, async (req, res) => {
    const body = parseOr400(signinBody, req.body, 'body');
    const row = await accounts.findUserByEmail(db, body.email);
    const ok = await verifyPassword(row?.password_hash, body.password);
    if (!row || !ok) throw new HttpError(401, 'bad-credentials', 'e-mail or password is wrong');
    const token = issueToken(secret, row.id);
    setSessionCookie(res, token, secureCookies);
    res.json({ user: { id: row.id, email: row.email, name: row.name }, token });
  });

  r.post('/auth/signout', requireUser(db, secret), async (req, res) => {
    await accounts.endSessions(db, req.user!.id);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.json({ ok: true });
  });

  r.get('/me', requireUser(db, secret), async (req, res) => {
    res.json({ user: req.user, desks: await listDesks(db, req.user!.id) });
  });
  return r;
}
