import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, createUser, expectProblem, signedInAgent, TEST_PASSWORD, waitForMail, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

function tokenFrom(text: string, path: string): string {
  const match = new RegExp(`${path}\\?token=([\\w%-]+)`).exec(text);
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return decodeURIComponent(match[1]);
}

describe('invitations', () => {
  it('invites by e-mail; the invitee accepts, chooses a password and signs in', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const invite = await agent.post('/api/v1/users').send({ email: 'Nadia.Park@kestrelbend.test', name: 'Nadia Park', role: 'analyst' });
    expect(invite.status).toBe(201);
    expect(invite.headers.location).toBe(`/api/v1/users/${invite.body.user.id}`);
    expect(invite.body).toMatchObject({ user: { status: 'invited', role: 'analyst' }, invitation_mail: { delivered: true } });

    const mail = await waitForMail(t.smtp, (m) => m.to.includes('Nadia.Park@kestrelbend.test'));
    expect(mail.subject).toMatch(/invited/i);
    const token = tokenFrom(mail.text, '/accept-invitation');

    // An invited user cannot sign in before accepting.
    expectProblem(
      await request(t.app).post('/api/v1/auth/login').send({ email: 'nadia.park@kestrelbend.test', password: 'anything-at-all' }),
      401,
    );

    const weak = await request(t.app).post('/api/v1/auth/accept-invitation').send({ token, password: 'short' });
    expectProblem(weak, 400);

    const accept = await request(t.app).post('/api/v1/auth/accept-invitation').send({ token, password: 'a good long password' });
    expect(accept.status).toBe(200);
    expect(accept.body.status).toBe('active');

    // The link works once.
    expectProblem(await request(t.app).post('/api/v1/auth/accept-invitation').send({ token, password: 'another long password' }), 422);

    const login = await request(t.app)
      .post('/api/v1/auth/login')
      .send({ email: 'nadia.park@kestrelbend.test', password: 'a good long password' });
    expect(login.status).toBe(200);
    expect(login.body.user.role).toBe('analyst');
  });

  it('refuses a second user with the same e-mail in another case (409)', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    await createUser(t.db, 'viewer', { email: 'dup@kestrelbend.test' });
    expectProblem(await agent.post('/api/v1/users').send({ email: 'DUP@kestrelbend.test', name: 'Dup', role: 'viewer' }), 409);
  });

  it('resends an invitation with a new link that replaces the old one', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const invite = await agent.post('/api/v1/users').send({ email: 'resend@kestrelbend.test', name: 'Re Send', role: 'viewer' });
    const first = tokenFrom((await waitForMail(t.smtp, (m) => m.to.includes('resend@kestrelbend.test'))).text, '/accept-invitation');
    t.smtp.outbox.clear();
    const resend = await agent.post(`/api/v1/users/${invite.body.user.id}/invitation`);
    expect(resend.status).toBe(202);
    const second = tokenFrom((await waitForMail(t.smtp, (m) => m.to.includes('resend@kestrelbend.test'))).text, '/accept-invitation');
    expect(second).not.toBe(first);
    expectProblem(
      await request(t.app).post('/api/v1/auth/accept-invitation').send({ token: first, password: 'a good long password' }),
      422,
    );
    expect(
      (await request(t.app).post('/api/v1/auth/accept-invitation').send({ token: second, password: 'a good long password' })).status,
    ).toBe(200);
  });
});

describe('roles and status', () => {
  it("changes a role, records before/after in the audit trail and ends the user's sessions", async () => {
    const { agent: admin } = await signedInAgent(t, 'admin');
    const { agent: target, user } = await signedInAgent(t, 'viewer');
    expect((await target.get('/api/v1/auth/me')).status).toBe(200);

    const res = await admin.patch(`/api/v1/users/${user.id}`).send({ role: 'manager' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('manager');

    expectProblem(await target.get('/api/v1/auth/me'), 401);

    const audit = await admin.get('/api/v1/audit-events').query({ action: 'user.updated', target_id: user.id });
    expect(audit.status).toBe(200);
    expect(audit.body.data).toHaveLength(1);
    expect(audit.body.data[0]).toMatchObject({
      before: { role: 'viewer' },
      after: { role: 'manager' },
      target: { type: 'user', id: user.id },
    });
  });

  it('never leaves the lab without an active admin (409)', async () => {
    const solo = await createTestApp();
    try {
      const { agent, user } = await signedInAgent(solo, 'admin');
      expectProblem(await agent.patch(`/api/v1/users/${user.id}`).send({ role: 'viewer' }), 409);
      expectProblem(await agent.patch(`/api/v1/users/${user.id}`).send({ status: 'disabled' }), 409);
    } finally {
      await solo.close();
    }
  });

  it('disabling a user blocks sign-in; enabling restores it', async () => {
    const { agent: admin } = await signedInAgent(t, 'admin');
    const user = await createUser(t.db, 'analyst');
    expect((await admin.patch(`/api/v1/users/${user.id}`).send({ status: 'disabled' })).status).toBe(200);
    expectProblem(await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD }), 401);
    expect((await admin.patch(`/api/v1/users/${user.id}`).send({ status: 'active' })).status).toBe(200);
    expect((await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD })).status).toBe(200);
  });

  it('rejects an empty change and unknown users', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    expectProblem(await agent.patch('/api/v1/users/usr_nobody').send({ role: 'viewer' }), 404);
    const user = await createUser(t.db, 'viewer');
    expectProblem(await agent.patch(`/api/v1/users/${user.id}`).send({}), 400);
  });

  it('lists users with cursor pagination in a stable order', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await agent.get('/api/v1/users').query({ limit: 2, ...(cursor ? { cursor } : {}) });
      expect(page.status).toBe(200);
      expect(page.body.data.length).toBeLessThanOrEqual(2);
      seen.push(...page.body.data.map((u: { id: string }) => u.id));
      cursor = page.body.next_cursor ?? undefined;
    } while (cursor);
    const all = await t.db('users').orderBy('id').pluck('id');
    expect(seen).toEqual(all);
    expectProblem(await agent.get('/api/v1/users').query({ cursor: 'garbage' }), 400);
  });
});

describe('password reset', () => {
  it('e-mails a link for an active account, sets the new password and ends sessions', async () => {
    const { agent, user } = await signedInAgent(t, 'analyst');
    const ask = await request(t.app).post('/api/v1/auth/password-reset').send({ email: user.email.toUpperCase() });
    expect(ask.status).toBe(202);
    const token = tokenFrom(
      (await waitForMail(t.smtp, (m) => m.to.includes(user.email) && /reset/i.test(m.subject))).text,
      '/reset-password',
    );

    expect((await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'brand new password' })).status).toBe(
      204,
    );
    expectProblem(await agent.get('/api/v1/auth/me'), 401);
    expectProblem(await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD }), 401);
    expect((await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: 'brand new password' })).status).toBe(200);
  });

  it('answers 202 for an unknown e-mail and sends nothing', async () => {
    t.smtp.outbox.clear();
    const res = await request(t.app).post('/api/v1/auth/password-reset').send({ email: 'ghost@kestrelbend.test' });
    expect(res.status).toBe(202);
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(t.smtp.outbox.messages()).toHaveLength(0);
  });
});

describe('outbox', () => {
  it('shows captured e-mail to admins only', async () => {
    const { agent: admin } = await signedInAgent(t, 'admin');
    await admin.post('/api/v1/users').send({ email: 'outbox@kestrelbend.test', name: 'Out Box', role: 'viewer' });
    await waitForMail(t.smtp, (m) => m.to.includes('outbox@kestrelbend.test'));
    const res = await admin.get('/api/v1/dev/outbox');
    expect(res.status).toBe(200);
    expect(res.body.data.some((m: { to: string[] }) => m.to.includes('outbox@kestrelbend.test'))).toBe(true);
    const { agent: manager } = await signedInAgent(t, 'manager');
    expectProblem(await manager.get('/api/v1/dev/outbox'), 403);
  });
});
