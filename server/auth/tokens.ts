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

/**
 * Tokens that verified recently, by their exact text, until they expire: the signature check
 * is the most expensive step of an authenticated request. Revocation is unaffected (it is
 * checked against the database on every request), and a cache entry is only ever made by a
 * successful jwt.verify with the same secret.
 */
const verified = new Map<string, SessionClaims & { expMs: number; secret: string }>();
const CACHE_LIMIT = 10_000;

export function verifyToken(secret: string, token: string, now = Date.now()): SessionClaims | null {
  const hit = verified.get(token);
  if (hit && hit.secret === secret) {
    if (now < hit.expMs) return { sub: hit.sub, issuedAtMs: hit.issuedAtMs };
    verified.delete(token);
    return null;
  }
  try {
    const claims = jwt.verify(token, secret, { algorithms: ['HS256'] });
    if (
      typeof claims !== 'object' ||
      typeof claims.sub !== 'string' ||
      typeof claims.ims !== 'number' ||
      typeof claims.exp !== 'number'
    ) {
      return null;
    }
    if (verified.size >= CACHE_LIMIT) verified.clear();
    verified.set(token, {
      sub: claims.sub,
      issuedAtMs: claims.ims,
      expMs: claims.exp * 1000,
      secret,
    });
    return { sub: claims.sub, issuedAtMs: claims.ims };
  } catch {
    return null;
  }
}
