import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signSessionToken } from '../../server/domain/auth/session-token.ts';
import { createTestApp, createUser, expectProblem, problemBody, TEST_PASSWORD, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

function sessionCookie(res: request.Response): string {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const cookie = cookies.find((c) => c.startsWith('mw_session='));
  if (!cookie) throw new Error('no session cookie');
  return cookie;
}

describe('POST /api/v1/auth/login', () => {
  it('signs in with a case-insensitive e-mail and sets an httpOnly, SameSite=Lax cookie', async () => {
    const user = await createUser(t.db, 'analyst', { email: 'Omar.Reyes@KestrelBend.test' });
    const res = await request(t.app).post('/api/v1/auth/login').send({ email: 'omar.reyes@kestrelbend.test', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, role: 'analyst' });
    expect(res.body.scopes).toContain('imports:write');
    expect(res.body.scopes).not.toContain('users:write');
    const cookie = sessionCookie(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(res.body.user).not.toHaveProperty('password_hash');
  });

  it('gives the same 401 for an unknown e-mail, a wrong password and a disabled account', async () => {
    const user = await createUser(t.db, 'viewer');
    const disabled = await createUser(t.db, 'viewer', { status: 'disabled' });
    const answers = await Promise.all([
      request(t.app).post('/api/v1/auth/login').send({ email: 'nobody@kestrelbend.test', password: TEST_PASSWORD }),
      request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: 'wrong password!' }),
      request(t.app).post('/api/v1/auth/login').send({ email: disabled.email, password: TEST_PASSWORD }),
    ]);
    for (const res of answers) expectProblem(res, 401);
    const bodies = answers.map((res) => ({ ...problemBody(res), request_id: undefined }));
    expect(bodies[1]).toEqual(bodies[0]);
    expect(bodies[2]).toEqual(bodies[0]);
  });
});

describe('session lifecycle', () => {
  it('GET /auth/me returns the caller; logout ends the session server-side', async () => {
    const user = await createUser(t.db, 'manager');
    const login = await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD });
    const cookie = sessionCookie(login).split(';')[0];

    const me = await request(t.app).get('/api/v1/auth/me').set('cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ user: { email: user.email }, auth: 'session' });
    expect(Date.parse(me.body.session_expires_at)).toBeGreaterThan(Date.now());

    const logout = await request(t.app).post('/api/v1/auth/logout').set('cookie', cookie);
    expect(logout.status).toBe(204);

    // The old cookie value no longer works even though its signature is still valid.
    expectProblem(await request(t.app).get('/api/v1/auth/me').set('cookie', cookie), 401);
  });

  it('renews the cookie once less than half of its lifetime is left (sliding expiry)', async () => {
    const user = await createUser(t.db, 'viewer');
    const login = await request(t.app).post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD });
    const fresh = await request(t.app).get('/api/v1/auth/me').set('cookie', sessionCookie(login).split(';')[0]);
    expect(fresh.headers['set-cookie']).toBeUndefined();

    // A token with 5 of its 30 minutes left, for the same session.
    const claims = JSON.parse(Buffer.from(sessionCookie(login).split('.')[1], 'base64url').toString()) as { sid: string };
    const ageing = signSessionToken(t.config.sessionSecret, claims.sid, user.id, 5);
    const renewed = await request(t.app).get('/api/v1/auth/me').set('cookie', `mw_session=${ageing}`);
    expect(renewed.status).toBe(200);
    expect(sessionCookie(renewed)).toMatch(/Max-Age=1800/);
  });

  it('rejects a cookie signed with another secret', async () => {
    const user = await createUser(t.db, 'viewer');
    const forged = signSessionToken('x'.repeat(40), 'ses_forged', user.id, 30);
    expectProblem(await request(t.app).get('/api/v1/auth/me').set('cookie', `mw_session=${forged}`), 401);
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 problem+json with Retry-After and RateLimit headers after the limit', async () => {
    const limited = await createTestApp({ loginRateLimitPerMinute: 3 });
    try {
      const attempt = () =>
        request(limited.app).post('/api/v1/auth/login').send({ email: 'x@kestrelbend.test', password: 'nope-nope-nope' });
      for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
      const res = await attempt();
      expectProblem(res, 429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      expect(res.headers['ratelimit-policy']).toMatch(/q=3/);
      expect(res.headers.ratelimit).toMatch(/r=0/);
    } finally {
      await limited.close();
    }
  });

  it('counts per account too: one user attacked from many addresses is slowed as well', async () => {
    const limited = await createTestApp({ loginRateLimitPerMinute: 3, trustProxy: 1 });
    try {
      const attempt = (from: string, email = 'target@kestrelbend.test') =>
        request(limited.app).post('/api/v1/auth/login').set('x-forwarded-for', from).send({ email, password: 'nope-nope-nope' });
      for (let i = 0; i < 3; i++) expect((await attempt(`203.0.113.${i + 1}`)).status).toBe(401);
      const res = await attempt('203.0.113.99', 'TARGET@kestrelbend.test');
      expectProblem(res, 429);
      expect(JSON.parse(res.text).detail).toMatch(/for this account/);
      expect((await attempt('203.0.113.100', 'someone.else@kestrelbend.test')).status).toBe(401);
    } finally {
      await limited.close();
    }
  });

  it('does not believe X-Forwarded-For unless TRUST_PROXY says so', async () => {
    const limited = await createTestApp({ loginRateLimitPerMinute: 3 });
    try {
      const attempt = (i: number) =>
        request(limited.app)
          .post('/api/v1/auth/login')
          .set('x-forwarded-for', `198.51.100.${i}`)
          .send({ email: `user${i}@kestrelbend.test`, password: 'nope-nope-nope' });
      for (let i = 0; i < 3; i++) expect((await attempt(i)).status).toBe(401);
      const res = await attempt(9);
      expectProblem(res, 429);
      expect(JSON.parse(res.text).detail).toMatch(/from this address/);
    } finally {
      await limited.close();
    }
  });
});
