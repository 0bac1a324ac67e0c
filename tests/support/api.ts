/** API test fixture: the app on the test database with a fake SMTP mailbox, and user helpers. */
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../server/app';
import { testDb, uniqueEmail } from './database';
import { testMail, type TestMail } from './mail';

export const APP_URL = 'http://app.saltation.test';

export interface TestUser {
  id: string;
  email: string;
  name: string;
  password: string;
  token: string;
}

export function apiFixture() {
  let db: Knex | undefined;
  let app: Express | undefined;
  let mail: TestMail | undefined;
  beforeAll(async () => {
    db = testDb();
    mail = await testMail();
    app = createApp({
      db,
      jwtSecret: 'api-test-secret',
      log: () => undefined,
      // each test file counts its own sign-ins, as separate services would
      rateLimitScope: `test-${Math.random().toString(36).slice(2)}:`,
      mailer: mail.mailer,
      appUrl: APP_URL,
    });
  });
  afterAll(async () => {
    await db?.destroy();
    await mail?.close();
  });
  const fixture = {
    app: () => app!,
    db: () => db!,
    mail: () => mail!,
    /** registers and signs in a new user */
    async user(label: string): Promise<TestUser> {
      const email = uniqueEmail(label);
      const password = `${label}-password-1`;
      const reg = await request(app!)
        .post('/api/auth/register')
        .send({ email, password, name: label });
      if (reg.status !== 201)
        throw new Error(`register ${label}: ${reg.status} ${JSON.stringify(reg.body)}`);
      const signin = await request(app!).post('/api/auth/signin').send({ email, password });
      return { id: reg.body.user.id, email, name: label, password, token: signin.body.token };
    },
    /** a request as this user (bearer token) */
    as(user: { token: string }) {
      const bearer = (r: request.Test) => r.set('Authorization', `Bearer ${user.token}`);
      return {
        get: (url: string) => bearer(request(app!).get(url)),
        post: (url: string, body?: object) => bearer(request(app!).post(url)).send(body ?? {}),
        patch: (url: string, body?: object) => bearer(request(app!).patch(url)).send(body ?? {}),
        delete: (url: string) => bearer(request(app!).delete(url)),
      };
    },
  };
  return fixture;
}
