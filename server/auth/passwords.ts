/** argon2id password hashes; unknown accounts verify against a dummy so timing does not tell. */
import argon2 from 'argon2';

const OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, OPTIONS);
}

let dummy: Promise<string> | undefined;

export async function verifyPassword(hash: string | undefined, password: string): Promise<boolean> {
  if (!hash) {
    dummy ??= hashPassword('not-a-real-password');
    await argon2.verify(await dummy, password).catch(() => false);
    return false;
  }
  return argon2.verify(hash, password).catch(() => false);
}
