import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '../../server/lib/secrets.ts';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('API keys', () => {
  it('shows the secret once, stores only its hash, and authenticates Bearer calls with the granted scopes', async () => {
    const { agent, user } = await signedInAgent(t, 'admin');
    const created = await agent.post('/api/v1/api-keys').send({ name: 'MES melt shop', scopes: ['samples:read'] });
    expect(created.status).toBe(201);
    expect(created.headers.location).toBe(`/api/v1/api-keys/${created.body.id}`);
    const secret: string = created.body.secret;
    expect(secret).toMatch(/^mw_live_[0-9A-Za-z]{38}$/);
    expect(created.body).toMatchObject({
      name: 'MES melt shop',
      scopes: ['samples:read'],
      status: 'active',
      created_by: { id: user.id },
      prefix: secret.slice(0, 14),
    });

    const row = await t.db('api_keys').where({ id: created.body.id }).first();
    expect(row.secret_hash).toBe(sha256Hex(secret));
    expect(JSON.stringify(await t.db('api_keys').select())).not.toContain(secret);

    const listed = await agent.get('/api/v1/api-keys');
    expect(JSON.stringify(listed.body)).not.toContain(secret);
    expect((await agent.get(`/api/v1/api-keys/${created.body.id}`)).body).not.toHaveProperty('secret');

    const bearer = (path: string) => request(t.app).get(path).set('authorization', `Bearer ${secret}`);
    expect((await bearer('/api/v1/samples')).status).toBe(200);
    const me = await bearer('/api/v1/auth/me');
    expect(me.body).toMatchObject({ auth: 'api_key', scopes: ['samples:read'] });
    expectProblem(await bearer('/api/v1/users'), 403);

    const afterUse = await agent.get(`/api/v1/api-keys/${created.body.id}`);
    expect(afterUse.body.last_used_at).not.toBeNull();
  });

  it('revokes at once', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const { body } = await agent.post('/api/v1/api-keys').send({ name: 'short-lived', scopes: ['samples:read'] });
    expect((await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${body.secret}`)).status).toBe(200);
    expect((await agent.delete(`/api/v1/api-keys/${body.id}`)).status).toBe(204);
    const res = await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${body.secret}`);
    expectProblem(res, 401);
    expect(problemBody(res).detail).toMatch(/revoked/);
    expect((await agent.get('/api/v1/api-keys')).body.data.map((k: { id: string }) => k.id)).not.toContain(body.id);
    expect((await agent.get('/api/v1/api-keys?include_revoked=true')).body.data.map((k: { id: string }) => k.id)).toContain(body.id);
  });

  it('grants only scopes the caller holds', async () => {
    const { agent } = await signedInAgent(t, 'integrator');
    const res = await agent.post('/api/v1/api-keys').send({ name: 'greedy', scopes: ['samples:read', 'users:write'] });
    expectProblem(res, 403);
    expect(problemBody(res)).toMatchObject({ scopes_not_held: ['users:write'] });
    expect((await agent.post('/api/v1/api-keys').send({ name: 'fair', scopes: ['samples:read', 'samples:write'] })).status).toBe(201);
  });

  it('validates names, scopes and expiry', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.post('/api/v1/api-keys').send({ name: '', scopes: ['samples:eat'], expires_at: '2000-01-01T00:00:00Z' });
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual(['body.expires_at', 'body.name', 'body.scopes.0']);
  });

  it('rolls a key: the replacement works at once and the old one lives for the overlap', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const old = (await agent.post('/api/v1/api-keys').send({ name: 'rolling', scopes: ['samples:read'] })).body;
    const rolled = await agent.post(`/api/v1/api-keys/${old.id}/roll`).send({ overlap_minutes: 30 });
    expect(rolled.status).toBe(201);
    expect(rolled.body.secret).not.toBe(old.secret);
    expect(rolled.body).toMatchObject({ name: 'rolling', scopes: ['samples:read'] });
    const oldNow = (await agent.get(`/api/v1/api-keys/${old.id}`)).body;
    expect(oldNow.replaced_by).toBe(rolled.body.id);
    const overlapEnd = Date.parse(oldNow.expires_at) - Date.now();
    expect(overlapEnd).toBeGreaterThan(29 * 60_000);
    expect(overlapEnd).toBeLessThanOrEqual(30 * 60_000);
    for (const secret of [old.secret, rolled.body.secret]) {
      expect((await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${secret}`)).status).toBe(200);
    }
    const immediate = await agent.post(`/api/v1/api-keys/${rolled.body.id}/roll`).send({ overlap_minutes: 0 });
    expect(immediate.status).toBe(201);
    expectProblem(await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${rolled.body.secret}`), 401);
  });

  it('lets non-admins see and manage only their own keys', async () => {
    const { agent: mine } = await signedInAgent(t, 'integrator');
    const { agent: theirs } = await signedInAgent(t, 'integrator');
    const key = (await mine.post('/api/v1/api-keys').send({ name: 'mine', scopes: ['samples:read'] })).body;
    expect((await theirs.get('/api/v1/api-keys')).body.data.map((k: { id: string }) => k.id)).not.toContain(key.id);
    expectProblem(await theirs.delete(`/api/v1/api-keys/${key.id}`), 404);
    expectProblem(await theirs.get(`/api/v1/api-keys/${key.id}`), 404);
  });

  it('suspends the keys of a disabled user', async () => {
    const { agent: admin } = await signedInAgent(t, 'admin');
    const { agent, user } = await signedInAgent(t, 'integrator');
    const key = (await agent.post('/api/v1/api-keys').send({ name: 'owner leaves', scopes: ['samples:read'] })).body;
    await admin.patch(`/api/v1/users/${user.id}`).send({ status: 'disabled' });
    const res = await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${key.secret}`);
    expectProblem(res, 401);
    expect(problemBody(res).detail).toMatch(/disabled/);
  });

  it('rejects a malformed Authorization header and a key with a broken checksum', async () => {
    expectProblem(await request(t.app).get('/api/v1/samples').set('authorization', 'Basic abc'), 401);
    const { agent } = await signedInAgent(t, 'admin');
    const { secret } = (await agent.post('/api/v1/api-keys').send({ name: 'typo', scopes: ['samples:read'] })).body as { secret: string };
    const typo = secret.slice(0, 20) + (secret[20] === 'a' ? 'b' : 'a') + secret.slice(21);
    const res = await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${typo}`);
    expectProblem(res, 401);
    expect(problemBody(res).detail).toMatch(/checksum/);
  });
});
