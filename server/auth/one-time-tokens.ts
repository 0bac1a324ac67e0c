/** Single-use tokens for invite and reset links: random, sent once, stored only as a hash. */
import { createHash, randomBytes } from 'node:crypto';

export function newOneTimeToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
