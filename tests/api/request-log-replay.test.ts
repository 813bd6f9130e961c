// POST /request-log/{id}/replay: the same call again, with the replaying caller's credentials.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { countRows, createTestApp, expectProblem, issueKey, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';
import { testRoutes } from '../helpers/test-routes.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ requestLogBodyLimit: 256 }, { routes: [...v1Routes, ...testRoutes().routes] });
});
afterAll(() => t.close());

async function entryId(agent: request.Agent, requestId: string): Promise<string> {
  const res = await agent.get('/api/v1/request-log?limit=200');
  const entry = res.body.data.find((e: { request_id: string }) => e.request_id === requestId);
  if (!entry) throw new Error(`no entry for ${requestId}`);
  return entry.id;
}

describe('replay', () => {
  it("sends a key's call again under the signed-in user and links the new entry", async () => {
    const { agent, user } = await signedInAgent(t, 'integrator');
    const key = await issueKey(t, ['samples:read'], { owner: user });
    await request(t.app)
      .get('/api/v1/samples?limit=3')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-request-id', 'to-replay')
      .expect(200);
    const original = await entryId(agent, 'to-replay');

    const replay = await agent.post(`/api/v1/request-log/${original}/replay`);
    expect(replay.status).toBe(201);
    expect(replay.headers.location).toBe(`/api/v1/request-log/${replay.body.id}`);
    expect(replay.body).toMatchObject({
      replay_of: original,
      method: 'GET',
      path: '/api/v1/samples',
      query: 'limit=3',
      status: 200,
      caller: { type: 'user', id: user.id },
      response: { body: '{"data":[],"next_cursor":null}' },
    });
    const listed = await agent.get(`/api/v1/request-log/${replay.body.id}`);
    expect(listed.body.replay_of).toBe(original);
  });

  it("uses the replaying request's own API key, so the key's scopes decide: a missing scope is the replay's own 403", async () => {
    const { agent: admin, user } = await signedInAgent(t, 'admin');
    await admin
      .post('/api/v1/users')
      .set('x-request-id', 'admin-invite')
      .send({ email: 'replayed@kestrelbend.test', name: 'Replayed', role: 'viewer' })
      .expect(201);
    const original = await entryId(admin, 'admin-invite');
    const logReader = await issueKey(t, ['request-log:read'], { owner: user });

    const replay = await request(t.app).post(`/api/v1/request-log/${original}/replay`).set('authorization', `Bearer ${logReader.secret}`);
    expect(replay.status).toBe(201);
    expect(replay.body).toMatchObject({ replay_of: original, status: 403, caller: { type: 'api_key', id: logReader.id } });
    expect(JSON.parse(replay.body.response.body)).toMatchObject({ required_scope: 'users:write' });
    expect(await countRows(t.db('users').where({ email: 'replayed@kestrelbend.test' }))).toBe(1);
  });

  it('replays a write with its JSON body and Idempotency-Key', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    await agent
      .post('/api/v1/users')
      .set('x-request-id', 'keyed-invite')
      .set('idempotency-key', 'invite-77')
      .send({ email: 'keyed@kestrelbend.test', name: 'Keyed', role: 'viewer' })
      .expect(201);
    const replay = await agent.post(`/api/v1/request-log/${await entryId(agent, 'keyed-invite')}/replay`);
    expect(replay.body.status).toBe(201);
    expect(replay.body.response.headers['idempotent-replayed']).toBe('true');
    expect(replay.body.request.headers['idempotency-key']).toBe('invite-77');
    expect(await countRows(t.db('users').where({ email: 'keyed@kestrelbend.test' }))).toBe(1);
  });

  it('refuses entries it cannot send again as they were, with a clear 422', async () => {
    const { agent, user } = await signedInAgent(t, 'admin');
    const key = await issueKey(t, ['imports:write', 'api-keys:write'], { owner: user });
    await request(t.app)
      .post('/api/v1/test/upload')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-request-id', 'multipart')
      .attach('file', Buffer.from('C\n0.2\n'), 'K24-0413.csv')
      .expect(201);
    await request(t.app)
      .post('/api/v1/api-keys')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-request-id', 'long')
      .send({ name: 'Ä'.repeat(200), scopes: ['imports:write', 'api-keys:write'] })
      .expect(201);
    await request(t.app)
      .post('/api/v1/auth/login')
      .set('x-request-id', 'sign-in')
      .send({ email: 'someone@kestrelbend.test', password: 'not the password' })
      .expect(401);

    const cases: [string, RegExp][] = [
      ['multipart', /Multipart uploads are not kept/],
      ['long', /longer than the log keeps \(256 bytes\)/],
      ['sign-in', /Sign-in and session calls are not replayed/],
    ];
    for (const [requestId, reason] of cases) {
      const id = await entryId(agent, requestId);
      expect((await agent.get(`/api/v1/request-log/${id}`)).body).toMatchObject({
        replayable: false,
        not_replayable_reason: expect.stringMatching(reason),
      });
      const res = await agent.post(`/api/v1/request-log/${id}/replay`);
      expectProblem(res, 422);
      expect(problemBody(res).detail).toMatch(reason);
    }
  });

  it('answers 404 for an entry the caller cannot see', async () => {
    const { agent: owner } = await signedInAgent(t, 'integrator');
    const { agent: stranger } = await signedInAgent(t, 'integrator');
    await owner.get('/api/v1/samples').set('x-request-id', 'private').expect(200);
    expectProblem(await stranger.post(`/api/v1/request-log/${await entryId(owner, 'private')}/replay`), 404);
  });

  it('cannot be pointed at another entry by a forged replay header', async () => {
    const { agent } = await signedInAgent(t, 'integrator');
    await agent.get('/api/v1/samples').set('x-request-id', 'forged').set('x-meltwire-replay', 'req_made_up').expect(200);
    const id = await entryId(agent, 'forged');
    const entry = (await agent.get(`/api/v1/request-log/${id}`)).body;
    expect(entry.replay_of).toBeNull();
    expect(entry.request.headers).not.toHaveProperty('x-meltwire-replay');
  });
});
