/**
 * Users, their passwords and sessions, and password resets in the database. Each function
 * takes the db handle first; hashing and token checks stay with the caller.
 */
import type { Knex } from 'knex';
import { hashToken, newOneTimeToken } from '../auth/one-time-tokens';
import { HttpError } from '../errors';

export const RESET_MINUTES = 60;

export function findUserByEmail(db: Knex, email: string) {
  return db('users').whereRaw('lower(email) = ?', [email]).first();
}

/** A new account; refused when the address has one. */
export async function createUser(
  db: Knex,
  user: { email: string; name: string; passwordHash: string },
) {
  if (await findUserByEmail(db, user.email))
    throw new HttpError(409, 'email-taken', 'an account with this e-mail exists', 'body.email');
  const [row] = await db('users')
    .insert({ email: user.email, name: user.name, password_hash: user.passwordHash })
    .returning(['id', 'email', 'name']);
  return row as { id: string; email: string; name: string };
}

/** Every token issued before now stops working (sign-out everywhere). */
export async function endSessions(db: Knex, userId: string) {
  await db('users').where({ id: userId }).update({ tokens_valid_after: db.fn.now() });
}

export async function passwordHashOf(db: Knex, userId: string): Promise<string | undefined> {
  return (await db('users').where({ id: userId }).first('password_hash'))?.password_hash;
}

/** A new password; sessions from before `validAfter` end. */
export async function setPassword(db: Knex, userId: string, hash: string, validAfter: Date) {
  await db('users')
    .where({ id: userId })
    .update({ password_hash: hash, tokens_valid_after: validAfter });
}

/** A single-use reset token for the user, stored hashed, valid for RESET_MINUTES. */
export async function createReset(db: Knex, userId: string): Promise<string> {
  const { token, hash } = newOneTimeToken();
  await db('password_resets').insert({
    token_hash: hash,
    user_id: userId,
    expires_at: new Date(Date.now() + RESET_MINUTES * 60_000),
  });
  return token;
}

/** Spends a valid, unused, unexpired reset token on a new password (and ends the sessions). */
export function resetPassword(db: Knex, token: string, newHash: () => Promise<string>) {
  return db.transaction(async (trx) => {
    const row = await trx('password_resets')
      .where({ token_hash: hashToken(token) })
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
      .update({ password_hash: await newHash(), tokens_valid_after: new Date() });
  });
}
