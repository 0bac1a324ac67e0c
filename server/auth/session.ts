/** Resolves the caller from a bearer token or the session cookie; 401 when there is none. */
import type { NextFunction, Request, Response } from 'express';
import type { Knex } from 'knex';
import { HttpError } from '../errors';
import { isUuid } from '../access';
import { prepared } from '../prepared';
import { SESSION_COOKIE, verifyToken } from './tokens';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  /** the caller's desks and roles, read with the user on this request */
  memberships: { deskId: string; role: 'lead' | 'trader' | 'analyst' }[];
}

declare module 'express-serve-static-core' {
  interface Request {
    user?: SessionUser;
    /** when the caller's session token was issued (the events stream re-checks it) */
    sessionIssuedAtMs?: number;
  }
}

function tokenFrom(req: Request): string | undefined {
  const header = req.get('authorization');
  if (header?.startsWith('Bearer ')) return header.slice(7).trim();
  const cookies = (req as Request & { cookies?: Record<string, string> }).cookies;
  return cookies?.[SESSION_COOKIE];
}

export function requireUser(db: Knex, secret: string) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = tokenFrom(req);
    const claims = token ? verifyToken(secret, token) : null;
    if (!claims || !isUuid(claims.sub))
      return next(new HttpError(401, 'unauthenticated', 'sign in first'));
    // a prepared statement: this runs on every authenticated request
    const [user] = await prepared<{
      id: string;
      email: string;
      name: string;
      tokens_valid_after: Date;
      memberships: SessionUser['memberships'];
    }>(
      db,
      'session-user',
      `select u.id, u.email, u.name, u.tokens_valid_after,
         coalesce((select json_agg(json_build_object('deskId', m.desk_id, 'role', m.role))
                   from desk_members m where m.user_id = u.id), '[]'::json) as memberships
       from users u where u.id = $1`,
      [claims.sub],
    );
    if (!user || new Date(user.tokens_valid_after).getTime() > claims.issuedAtMs) {
      return next(new HttpError(401, 'unauthenticated', 'session expired; sign in again'));
    }
    req.user = { id: user.id, email: user.email, name: user.name, memberships: user.memberships };
    req.sessionIssuedAtMs = claims.issuedAtMs;
    next();
  };
}
