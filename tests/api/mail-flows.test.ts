import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiFixture, APP_URL } from '../support/api';

const api = apiFixture();
const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

describe('invites through the fake SMTP server', () => {
  it('mails a link built from the public URL; accepting joins with the role; a reused, expired, revoked or someone else’s token is refused', async () => {
    const lead = await api.user('inv-lead');
    const guest = await api.user('inv-guest');
    const desk = (await api.as(lead).post('/api/desks', { name: 'Invite desk' })).body.desk.id;
    const sent = await api
      .as(lead)
      .post(`/api/desks/${desk}/invites`, { email: guest.email, role: 'trader' })
      .set('Host', 'evil.example');
    expect(sent.status).toBe(201);
    const link = await api
      .mail()
      .linkFor(guest.email, /invites you to join "Invite desk" as trader/);
    expect(link.startsWith(`${APP_URL}/invite?token=`)).toBe(true);
    expect((await api.as(lead).get(`/api/desks/${desk}/invites`)).body.invites).toHaveLength(1);

    const intruder = await api.user('inv-intruder');
    const wrong = await api.as(intruder).post('/api/invites/accept', { token: tokenOf(link) });
    expect(wrong.status).toBe(403);
    const ok = await api.as(guest).post('/api/invites/accept', { token: tokenOf(link) });
    expect(ok.status).toBe(200);
    expect(ok.body.desk).toMatchObject({ id: desk, role: 'trader' });
    const members = (await api.as(lead).get(`/api/desks/${desk}/members`)).body.members;
    expect(members.find((m: { id: string }) => m.id === guest.id).role).toBe('trader');
    const reused = await api.as(guest).post('/api/invites/accept', { token: tokenOf(link) });
    expect([reused.status, reused.body.error.code]).toEqual([410, 'invite-used']);
    // the token is stored only as a hash
    const rows = await api.db()('invites').where({ desk_id: desk });
    expect(rows[0].token_hash).not.toContain(tokenOf(link));

    const late = await api.user('inv-late');
    await api.as(lead).post(`/api/desks/${desk}/invites`, { email: late.email, role: 'analyst' });
    const lateLink = await api.mail().linkFor(late.email, /invites you/);
    await api
      .db()('invites')
      .where({ email: late.email })
      .update({ expires_at: new Date(Date.now() - 1000) });
    const expired = await api.as(late).post('/api/invites/accept', { token: tokenOf(lateLink) });
    expect([expired.status, expired.body.error.code]).toEqual([410, 'invite-expired']);

    const revokedUser = await api.user('inv-revoked');
    const inv = await api
      .as(lead)
      .post(`/api/desks/${desk}/invites`, { email: revokedUser.email, role: 'analyst' });
    const revokedLink = await api.mail().linkFor(revokedUser.email, /invites you/);
    expect(
      (await api.as(lead).delete(`/api/desks/${desk}/invites/${inv.body.invite.id}`)).status,
    ).toBe(200);
    expect(
      (await api.as(revokedUser).post('/api/invites/accept', { token: tokenOf(revokedLink) }))
        .status,
    ).toBe(404);
  });

  it('keeps the last lead: no demotion, no leaving; leaving works once another lead exists', async () => {
    const lead = await api.user('last-lead');
    const desk = (await api.as(lead).post('/api/desks', { name: 'Lead desk' })).body.desk.id;
    const demote = await api
      .as(lead)
      .patch(`/api/desks/${desk}/members/${lead.id}`, { role: 'trader' });
    expect([demote.status, demote.body.error.code]).toEqual([409, 'last-lead']);
    const leave = await api.as(lead).delete(`/api/desks/${desk}/members/${lead.id}`);
    expect(leave.status).toBe(409);
    const second = await api.user('second-lead');
    await api.as(lead).post(`/api/desks/${desk}/invites`, { email: second.email, role: 'lead' });
    const token = tokenOf(await api.mail().linkFor(second.email, /invites you/));
    await api.as(second).post('/api/invites/accept', { token });
    expect((await api.as(lead).delete(`/api/desks/${desk}/members/${lead.id}`)).status).toBe(200);
    expect((await api.as(lead).get(`/api/desks/${desk}/members`)).status).toBe(404);
  });
});

describe('password change and reset', () => {
  it('a reset link arrives, works once, signs out other sessions, and the answer never tells whether an address exists', async () => {
    const u = await api.user('reset');
    const unknown = await request(api.app())
      .post('/api/auth/reset-request')
      .send({ email: `nobody-${randomUUID()}@example.test` });
    const known = await request(api.app()).post('/api/auth/reset-request').send({ email: u.email });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const link = await api.mail().linkFor(u.email, /reset the password/);
    expect(link.startsWith(`${APP_URL}/reset?token=`)).toBe(true);
    const reset = await request(api.app())
      .post('/api/auth/reset')
      .send({ token: tokenOf(link), newPassword: 'a-brand-new-password' });
    expect(reset.status).toBe(200);
    // the session from before the reset is over
    expect((await api.as(u).get('/api/me')).status).toBe(401);
    const again = await request(api.app())
      .post('/api/auth/reset')
      .send({ token: tokenOf(link), newPassword: 'another-new-password' });
    expect([again.status, again.body.error.code]).toEqual([410, 'reset-used']);
    const signin = await request(api.app())
      .post('/api/auth/signin')
      .send({ email: u.email, password: 'a-brand-new-password' });
    expect(signin.status).toBe(200);
  });

  it('a password change needs the current password, keeps this session and ends the others', async () => {
    const u = await api.user('change');
    const other = (
      await request(api.app())
        .post('/api/auth/signin')
        .send({ email: u.email, password: u.password })
    ).body.token;
    const wrong = await api
      .as(u)
      .post('/api/auth/password', { currentPassword: 'nope', newPassword: 'changed-password-1' });
    expect(wrong.status).toBe(403);
    const ok = await api.as(u).post('/api/auth/password', {
      currentPassword: u.password,
      newPassword: 'changed-password-1',
    });
    expect(ok.status).toBe(200);
    expect((await api.as({ token: ok.body.token }).get('/api/me')).status).toBe(200);
    expect((await api.as({ token: other }).get('/api/me')).status).toBe(401);
  });
});
