// Rolling a key: the caller chooses the overlap (within its limits), the answer says when the old
// key stops, and the old key never outlives its own expiry. Every scope offered guards an operation.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SCOPES } from '../../server/domain/auth/scopes.ts';
import { requiredScope } from '../../server/http/route.ts';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const minutesFromNow = (iso: string) => (Date.parse(iso) - Date.now()) / 60_000;

describe('rolling an API key', () => {
  it('keeps the old key for the overlap chosen and says until when', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const old = (await agent.post('/api/v1/api-keys').send({ name: 'day overlap', scopes: ['samples:read'] })).body;
    const rolled = await agent.post(`/api/v1/api-keys/${old.id}/roll`).send({ overlap_minutes: 1440 });
    expect(rolled.status).toBe(201);
    expect(rolled.body.previous.id).toBe(old.id);
    expect(minutesFromNow(rolled.body.previous.expires_at)).toBeGreaterThan(1439);
    expect(minutesFromNow(rolled.body.previous.expires_at)).toBeLessThanOrEqual(1440);
    expect((await agent.get(`/api/v1/api-keys/${old.id}`)).body.expires_at).toBe(rolled.body.previous.expires_at);
    expect((await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${old.secret}`)).status).toBe(200);
  });

  it('never lets the old key outlive its own expiry', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const expires = new Date(Date.now() + 10 * 60_000).toISOString();
    const old = (await agent.post('/api/v1/api-keys').send({ name: 'short', scopes: ['samples:read'], expires_at: expires })).body;
    const rolled = await agent.post(`/api/v1/api-keys/${old.id}/roll`).send({ overlap_minutes: 600 });
    expect(rolled.body.previous.expires_at).toBe(old.expires_at);
  });

  it('refuses an overlap outside 0–10080 minutes, in words', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const old = (await agent.post('/api/v1/api-keys').send({ name: 'limits', scopes: ['samples:read'] })).body;
    const tooLong = await agent.post(`/api/v1/api-keys/${old.id}/roll`).send({ overlap_minutes: 20_000 });
    expectProblem(tooLong, 400);
    expect(problemBody(tooLong).errors).toEqual([
      { location: 'body.overlap_minutes', message: 'overlap_minutes must be at most 10080', code: 'too_big' },
    ]);
    const fractional = await agent.post(`/api/v1/api-keys/${old.id}/roll`).send({ overlap_minutes: 1.5 });
    expect(problemBody(fractional).errors).toEqual([
      { location: 'body.overlap_minutes', message: 'overlap_minutes must be a whole number', code: 'invalid_type' },
    ]);
    expect((await agent.get(`/api/v1/api-keys/${old.id}`)).body).toMatchObject({ status: 'active', expires_at: null, replaced_by: null });
  });
});

describe('scopes', () => {
  it('offers only scopes that some operation requires (none for features not built)', () => {
    const required = new Set(v1Routes.map((route) => requiredScope(route.access)).filter(Boolean));
    expect(SCOPES.filter((scope) => !required.has(scope))).toEqual([]);
  });
});
