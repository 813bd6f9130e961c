// Idempotency-Key on writes: replay, mismatch, in flight, per caller, 24 h, 5xx, uploads.
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { IDEMPOTENCY_TTL_MS, STALE_CLAIM_MS } from '../../server/http/idempotency.ts';
import { OPENAPI_FILE } from '../../server/openapi/write.ts';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { countRows, createTestApp, expectProblem, issueKey, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';
import { testRoutes } from '../helpers/test-routes.ts';

let t: TestApp;
let extra: ReturnType<typeof testRoutes>;
let writer: string;

beforeAll(async () => {
  extra = testRoutes();
  t = await createTestApp({}, { routes: [...v1Routes, ...extra.routes] });
  writer = (await issueKey(t, ['samples:write', 'imports:write'])).secret;
});
afterAll(() => t.close());

const post = (path: string, key: string, secret = writer) =>
  request(t.app).post(`/api/v1${path}`).set('authorization', `Bearer ${secret}`).set('idempotency-key', key);

describe('Idempotency-Key', () => {
  it('replays the stored response (status, body, Location) and does the write once', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const invite = { email: 'twice@kestrelbend.test', name: 'Twice', role: 'viewer' };
    const first = await agent.post('/api/v1/users').set('idempotency-key', 'invite-twice-1').send(invite);
    expect(first.status).toBe(201);
    expect(first.headers['idempotent-replayed']).toBeUndefined();

    const again = await agent
      .post('/api/v1/users')
      .set('idempotency-key', 'invite-twice-1')
      .send({ role: 'viewer', name: 'Twice', email: 'twice@kestrelbend.test' });
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.headers.location).toBe(first.headers.location);
    expect(again.headers['content-type']).toBe(first.headers['content-type']);
    expect(again.body).toEqual(first.body);
    expect(await countRows(t.db('users').where({ email: invite.email }))).toBe(1);
    expect(await countRows(t.db('audit_events').where({ action: 'user.invited', target_id: first.body.user.id }))).toBe(1);
  });

  it('answers 422 when the key comes back with a different body or for another operation', async () => {
    expect((await post('/test/flaky-write', 'reuse-1').send({ value: 'a' })).status).toBe(201);
    const otherBody = await post('/test/flaky-write', 'reuse-1').send({ value: 'b' });
    expectProblem(otherBody, 422);
    expect(problemBody(otherBody).detail).toMatch(/different request body/);
    const otherPath = await post('/test/slow-write', 'reuse-1').send({ value: 'a' });
    expectProblem(otherPath, 422);
    expect(problemBody(otherPath).detail).toContain('POST /api/v1/test/flaky-write');
  });

  it('answers 409 while the first request with the key is still running, then replays it', async () => {
    const held = extra.hold();
    const first = post('/test/slow-write', 'slow-1')
      .send({ value: 'x' })
      .then((res) => res);
    await held.inside;
    const during = await post('/test/slow-write', 'slow-1').send({ value: 'x' });
    expectProblem(during, 409);
    expect(problemBody(during).detail).toMatch(/still being processed/);
    held.release();
    const done = await first;
    expect(done.status).toBe(201);
    const after = await post('/test/slow-write', 'slow-1').send({ value: 'x' });
    expect(after.status).toBe(201);
    expect(after.headers['idempotent-replayed']).toBe('true');
    expect(after.body).toEqual(done.body);
  });

  it('frees a claim nobody renews after a 30 s lease (its request died), not before', async () => {
    const held = extra.hold();
    const first = post('/test/slow-write', 'lease-1')
      .send({ value: 'x' })
      .then((res) => res);
    await held.inside;
    const claimedAgo = (ms: number) =>
      t
        .db('idempotency_keys')
        .where({ idempotency_key: 'lease-1' })
        .update({ locked_at: new Date(Date.now() - ms).toISOString() });
    await claimedAgo(20_000);
    expectProblem(await post('/test/slow-write', 'lease-1').send({ value: 'x' }), 409);
    await claimedAgo(STALE_CLAIM_MS + 1000);
    const retry = post('/test/slow-write', 'lease-1')
      .send({ value: 'x' })
      .then((res) => res);
    held.release();
    expect((await retry).status).toBe(201);
    await first;
  });

  it('keeps keys per caller: two keys using the same Idempotency-Key each get their own write', async () => {
    const other = (await issueKey(t, ['samples:write'])).secret;
    const mine = await post('/test/flaky-write', 'shared-name').send({ value: 'same' });
    const theirs = await post('/test/flaky-write', 'shared-name', other).send({ value: 'same' });
    expect(mine.status).toBe(201);
    expect(theirs.status).toBe(201);
    expect(theirs.headers['idempotent-replayed']).toBeUndefined();
    expect(theirs.body.call).not.toBe(mine.body.call);
  });

  it('does not keep 5xx answers, so a retry runs again', async () => {
    extra.failNextCall();
    expectProblem(await post('/test/flaky-write', 'flaky-1').send({ value: 'v' }), 500);
    const retry = await post('/test/flaky-write', 'flaky-1').send({ value: 'v' });
    expect(retry.status).toBe(201);
    expect(retry.headers['idempotent-replayed']).toBeUndefined();
  });

  it('keeps 4xx answers and replays them', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const bad = await agent.post('/api/v1/users').set('idempotency-key', 'bad-invite').send({ email: 'nope' });
    expectProblem(bad, 400);
    const again = await agent.post('/api/v1/users').set('idempotency-key', 'bad-invite').send({ email: 'nope' });
    expectProblem(again, 400);
    expect(again.headers['idempotent-replayed']).toBe('true');
  });

  it('replays PATCH and DELETE too', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const { user } = await signedInAgent(t, 'viewer');
    const patch = () => agent.patch(`/api/v1/users/${user.id}`).set('idempotency-key', 'rename-1').send({ name: 'Renamed once' });
    expect((await patch()).status).toBe(200);
    const replayed = await patch();
    expect(replayed.headers['idempotent-replayed']).toBe('true');
    expect(await countRows(t.db('audit_events').where({ target_id: user.id, action: 'user.updated' }))).toBe(1);

    const key = (await agent.post('/api/v1/api-keys').send({ name: 'to revoke', scopes: ['samples:read'] })).body;
    const revoke = () => agent.delete(`/api/v1/api-keys/${key.id}`).set('idempotency-key', 'revoke-1');
    expect((await revoke()).status).toBe(204);
    const second = await revoke();
    expect(second.status).toBe(204);
    expect(second.headers['idempotent-replayed']).toBe('true');
  });

  it('accepts up to 255 characters and answers 400 naming the header beyond', async () => {
    expect((await post('/test/flaky-write', 'k'.repeat(255)).send({ value: 'long' })).status).toBe(201);
    const res = await post('/test/flaky-write', 'k'.repeat(256)).send({ value: 'long' });
    expectProblem(res, 400);
    expect(problemBody(res).errors?.[0]).toMatchObject({ location: 'header.Idempotency-Key' });
  });

  it('does not store anonymous calls', async () => {
    for (let i = 0; i < 2; i++) {
      const res = await request(t.app)
        .post('/api/v1/auth/password-reset')
        .set('idempotency-key', 'anon-1')
        .send({ email: 'nobody@kestrelbend.test' });
      expect(res.status).toBe(202);
      expect(res.headers['idempotent-replayed']).toBeUndefined();
    }
    expect(await countRows(t.db('idempotency_keys').where({ idempotency_key: 'anon-1' }))).toBe(0);
  });

  it('forgets a key after 24 hours', async () => {
    expect((await post('/test/flaky-write', 'day-old').send({ value: 'first' })).status).toBe(201);
    const row = await t.db('idempotency_keys').where({ idempotency_key: 'day-old' }).first();
    expect(Date.parse(row.expires_at) - Date.parse(row.created_at)).toBe(IDEMPOTENCY_TTL_MS);
    await t
      .db('idempotency_keys')
      .where({ idempotency_key: 'day-old' })
      .update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    const reused = await post('/test/flaky-write', 'day-old').send({ value: 'another request' });
    expect(reused.status).toBe(201);
    expect(reused.headers['idempotent-replayed']).toBeUndefined();
  });

  it("never stores a new API key's secret: a retry gets 409 naming the key instead of a replay", async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const create = () =>
      agent
        .post('/api/v1/api-keys')
        .set('idempotency-key', 'new-key-1')
        .send({ name: 'MES', scopes: ['samples:read'] });
    const first = await create();
    expect(first.status).toBe(201);
    const retry = await create();
    expectProblem(retry, 409);
    expect(problemBody(retry)).toMatchObject({ resource: first.headers.location });
    const stored = JSON.stringify(await t.db('idempotency_keys').select());
    expect(stored).not.toContain(first.body.secret);
    expect(await countRows(t.db('api_keys').where({ name: 'MES' }))).toBe(1);
  });

  it('fingerprints uploaded files: the same file replays, another file with the same name is a 422', async () => {
    const upload = (content: string) => post('/test/upload', 'upload-1').attach('file', Buffer.from(content), 'K24-0412.csv');
    const first = await upload('C,Mn\n0.21,0.80\n');
    expect(first.status).toBe(201);
    const same = await upload('C,Mn\n0.21,0.80\n');
    expect(same.headers['idempotent-replayed']).toBe('true');
    expect(same.body).toEqual(first.body);
    expectProblem(await upload('C,Mn\n0.22,0.80\n'), 422);
  });

  it('is documented as an optional header on every POST, PUT, PATCH and DELETE', () => {
    const document = JSON.parse(readFileSync(OPENAPI_FILE, 'utf8')) as {
      paths: Record<
        string,
        Record<string, { parameters?: { name: string; in: string; required?: boolean }[]; responses: Record<string, unknown> }>
      >;
    };
    let writes = 0;
    for (const [path, operations] of Object.entries(document.paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        const header = operation.parameters?.find((p) => p.name === 'Idempotency-Key');
        if (['post', 'put', 'patch', 'delete'].includes(method)) {
          writes += 1;
          expect(header, `${method} ${path}`).toMatchObject({ in: 'header', required: false });
          expect(operation.responses, `${method} ${path}`).toHaveProperty('422');
        } else {
          expect(header, `${method} ${path}`).toBeUndefined();
        }
      }
    }
    expect(writes).toBeGreaterThan(5);
  });
});
