import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/demo';
import jwt from 'jsonwebtoken';
import { verifyToken } from '../../server/auth/tokens';
import { apiFixture } from '../support/api';
import { uniqueEmail } from '../support/database';

const api = apiFixture();
let app: ReturnType<typeof api.app>;

beforeAll(() => {
  app = api.app();
});

describe('health', () => {
  it('reports the database as up', async () => {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, database: 'up' });
  });
});

describe('accounts', () => {
  it('registers, signs in with a bearer token, reads /me, and a sign-out revokes the token', async () => {
    const email = uniqueEmail('reg');
    const reg = await request(app)
      .post('/api/auth/register')
      .send({ email, password: 'long enough pw', name: 'Test Person' });
    expect(reg.status).toBe(201);
    expect(reg.body.user.email).toBe(email);
    expect(reg.body.user).not.toHaveProperty('password_hash');

    const signin = await request(app)
      .post('/api/auth/signin')
      .send({ email: email.toUpperCase(), password: 'long enough pw' });
    expect(signin.status).toBe(200);
    expect(signin.headers['set-cookie']?.[0]).toMatch(
      /saltation_session=.*HttpOnly.*SameSite=Strict/i,
    );
    const token = signin.body.token as string;

    const me = await request(app).get('/api/me').set('Authorization', `Bearer ${token}`);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);

    expect(
      (await request(app).post('/api/auth/signout').set('Authorization', `Bearer ${token}`)).status,
    ).toBe(200);
    expect((await request(app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(
      401,
    );
  });

  it('lists the demo trader’s desk and role from the database', async () => {
    const trader = DEMO_USERS.find((u) => u.role === 'trader')!;
    const signin = await request(app)
      .post('/api/auth/signin')
      .send({ email: trader.email, password: trader.password });
    expect(signin.status).toBe(200);
    const me = await request(app)
      .get('/api/me')
      .set('Authorization', `Bearer ${signin.body.token}`);
    expect(me.body.desks).toEqual([expect.objectContaining({ role: 'trader' })]);
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const trader = DEMO_USERS.find((u) => u.role === 'trader')!;
    const wrong = await request(app)
      .post('/api/auth/signin')
      .send({ email: trader.email, password: 'not it' });
    const unknown = await request(app)
      .post('/api/auth/signin')
      .send({ email: uniqueEmail('nobody'), password: 'not it' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('refuses a tampered token, a token signed with "none", and no token at all with 401', async () => {
    const trader = DEMO_USERS.find((u) => u.role === 'trader')!;
    const { body } = await request(app)
      .post('/api/auth/signin')
      .send({ email: trader.email, password: trader.password });
    const [h, p] = (body.token as string).split('.');
    const none = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${p}.`;
    for (const t of [`${h}.${p}.AAAA`, none]) {
      expect((await request(app).get('/api/me').set('Authorization', `Bearer ${t}`)).status).toBe(
        401,
      );
    }
    expect((await request(app).get('/api/me')).status).toBe(401);
  });

  it('refuses expired and not-yet-valid tokens, also once a token has been verified and cached', async () => {
    const trader = DEMO_USERS.find((u) => u.role === 'trader')!;
    const { body } = await request(app)
      .post('/api/auth/signin')
      .send({ email: trader.email, password: trader.password });
    const claims = verifyToken('api-test-secret', body.token)!;
    const sub = claims.sub;
    const past = Math.floor(Date.now() / 1000) - 3600;
    const expired = jwt.sign({ ims: Date.now(), exp: past, sub }, 'api-test-secret', {
      algorithm: 'HS256',
    });
    const early = jwt.sign({ ims: Date.now(), sub, nbf: past + 7200 }, 'api-test-secret', {
      algorithm: 'HS256',
      expiresIn: 3600,
    });
    for (const t of [expired, early])
      expect((await request(app).get('/api/me').set('Authorization', `Bearer ${t}`)).status).toBe(
        401,
      );
    // the cached verification of a good token ends with the token's own expiry
    expect(verifyToken('api-test-secret', body.token)).not.toBeNull();
    expect(verifyToken('api-test-secret', body.token, Date.now() + 13 * 3600_000)).toBeNull();
    expect(verifyToken('another-secret', body.token)).toBeNull();
  });

  it('answers bad input with 4xx and a field path, never 500', async () => {
    const bad = await request(app)
      .post('/api/auth/register')
      .send({ email: 'not-an-email', password: 'x', name: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.path).toBe('body.email');
    const json = await request(app)
      .post('/api/auth/signin')
      .set('Content-Type', 'application/json')
      .send('{"email":');
    expect(json.status).toBe(400);
    expect(json.body.error.code).toBe('bad-json');
    const big = await request(app)
      .post('/api/auth/signin')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a'.repeat(2_000_000) }));
    expect(big.status).toBe(413);
    expect((await request(app).get('/api/no-such-route')).status).toBe(404);
  });
});
