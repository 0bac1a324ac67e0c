/**
 * Sessions are HS256 JWTs carrying only the user id (roles are read from the database on every
 * request). A token issued before the user's `tokens_valid_after` is refused, which is how
 * sign-out and password changes revoke sessions.
 */
import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'saltation_session';
export const SESSION_SECONDS = 12 * 3600;

export interface SessionClaims {
  sub: string;
  /** issue time in milliseconds (JWT's own iat has only whole seconds) */
  issuedAtMs: number;
}

export function issueToken(secret: string, userId: string, now = Date.now()): string {
  return jwt.sign({ ims: now }, secret, {
    algorithm: 'HS256',
    subject: userId,
    expiresIn: SESSION_SECONDS,
  });
}

export function verifyToken(secret: string, token: string): SessionClaims | null {
  try {
    const claims = jwt.verify(token, secret, { algorithms: ['HS256'] });
    if (
      typeof claims !== 'object' ||
      typeof claims.sub !== 'string' ||
      typeof claims.ims !== 'number'
    ) {
      return null;
    }
    return { sub: claims.sub, issuedAtMs: claims.ims };
  } catch {
    return null;
  }
}
