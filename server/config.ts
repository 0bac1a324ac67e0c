/** Settings from the environment, with the defaults of the project's README. */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

export interface Config {
  port: number;
  dataDir: string;
  databaseUrl: string | undefined;
  smtpUrl: string | undefined;
  appUrl: string;
  jwtSecret: string;
}

export function readPort(value: string | undefined, fallback: number): number {
  if (value === undefined || value === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 65535) {
    throw new Error(`PORT must be a whole number from 1 to 65535, not "${value}"`);
  }
  return n;
}

/** The signing key: JWT_SECRET, or one generated once into the data folder. */
function jwtSecret(dataDir: string): string {
  const fromEnv = process.env.JWT_SECRET;
  if (fromEnv) return fromEnv;
  const file = join(dataDir, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = readPort(env.PORT, 4310);
  const dataDir = resolve(env.SALTATION_DATA_DIR || '.data');
  return {
    port,
    dataDir,
    databaseUrl: env.DATABASE_URL || undefined,
    smtpUrl: env.SMTP_URL || undefined,
    appUrl: (env.APP_URL || `http://127.0.0.1:${port}`).replace(/\/+$/, ''),
    jwtSecret: jwtSecret(dataDir),
  };
}
