/**
 * Production mode (SALTATION_MODE=production): a start without JWT_SECRET, SMTP_URL or APP_URL
 * stops with one message naming what is missing; /dev/mailbox answers 404; the JSON request
 * logs carry request id, user id, path, status and ms, and never a password or a token.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../server/bootstrap/postgres';
import { testDatabaseUrl } from '../support/database';
import { startInstance, type Instance } from '../support/instance';
import { testMail, type TestMail } from '../support/mail';
import { call, signUp } from '../support/sync-simulation';

let mail: TestMail;
let dataDir: string;
let instance: Instance;
const secret = 'production-test-secret-0123456789abcdef';

const productionEnv = () => ({
  SALTATION_MODE: 'production',
  HOST: '127.0.0.1',
  DATABASE_URL: testDatabaseUrl(),
  SALTATION_DATA_DIR: dataDir,
  JWT_SECRET: secret,
  SMTP_URL: mail.url,
  APP_URL: 'https://saltation.example.test',
});

beforeAll(async () => {
  mail = await testMail();
  dataDir = mkdtempSync(join(tmpdir(), 'saltation-prod-'));
  instance = await startInstance(await freePort(), productionEnv());
}, 60000);

afterAll(async () => {
  await instance?.stop();
  await mail.close();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('production mode', () => {
  it('refuses to start without SMTP_URL or JWT_SECRET, naming what is missing', async () => {
    const { SMTP_URL: _smtp, ...noSmtp } = productionEnv();
    void _smtp;
    const a = await startInstance(await freePort(), { ...noSmtp, SMTP_URL: '' }, false);
    expect(a.child.exitCode).toBe(1);
    expect(a.output()).toContain('Production mode needs SMTP_URL set');
    const b = await startInstance(
      await freePort(),
      { ...productionEnv(), JWT_SECRET: '', SMTP_URL: '' },
      false,
    );
    expect(b.child.exitCode).toBe(1);
    expect(b.output()).toContain('Production mode needs JWT_SECRET, SMTP_URL set');
  }, 60000);

  it('answers 404 at /dev/mailbox', async () => {
    const res = await fetch(`${instance.base}/dev/mailbox`);
    expect(res.status).toBe(404);
  });

  it('logs each request as JSON with its id, user, path, status and ms, and never a token or a password', async () => {
    const u = await signUp(instance.base, 'prod-logs');
    await call(instance.base, u.token, 'GET', '/me');
    await call(instance.base, null, 'POST', '/auth/reset-request', { email: u.email });
    const link = await mail.linkFor(u.email, /reset/i);
    const resetToken = new URL(link).searchParams.get('token')!;
    const newPassword = 'prod-logs-new-password-2';
    await call(instance.base, null, 'POST', '/auth/reset', {
      token: resetToken,
      newPassword,
    });
    await call(instance.base, u.token, 'GET', '/me').catch(() => undefined); // 401 now
    await new Promise((r) => setTimeout(r, 300));
    const output = instance.output();
    const lines = output
      .split('\n')
      .filter((l) => l.startsWith('{'))
      .map((l) => JSON.parse(l) as Record<string, unknown>);
    const me = lines.find(
      (l) => (l.req as { path?: string } | undefined)?.path === '/api/me' && l.userId === u.id,
    );
    expect(me).toMatchObject({ msg: 'request', res: { status: 200 }, userId: u.id });
    expect(typeof (me!.req as { id: unknown }).id).toBe('string');
    expect(typeof me!.ms).toBe('number');
    for (const secretText of [u.password, newPassword, u.token, resetToken, secret])
      expect(output).not.toContain(secretText);
  });
});
