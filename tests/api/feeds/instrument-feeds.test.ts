// The agent heartbeat and the feed state people read from it (server/routes/v1/feeds.ts).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, issueKey, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

const STALE_MINUTES = 7;

let t: TestApp;
let lab: Awaited<ReturnType<typeof seedDemoLab>>;
let agentKey: string;
beforeAll(async () => {
  t = await createTestApp({ agentStaleMinutes: STALE_MINUTES });
  lab = await seedDemoLab(t.db);
  agentKey = (await issueKey(t, ['imports:write'])).secret;
});
afterAll(() => t.close());

const heartbeat = (instrumentId: string, body: object, key = agentKey) =>
  request(t.app).post(`/api/v1/instruments/${instrumentId}/agent-heartbeat`).set('authorization', `Bearer ${key}`).send(body);

/** Pretends the last heartbeat was `minutes` ago (the clock cannot be moved inside the server). */
const ageHeartbeat = (instrumentId: string, minutes: number) =>
  t
    .db('instrument_feeds')
    .where({ instrument_id: instrumentId })
    .update({ reported_at: new Date(Date.now() - minutes * 60_000).toISOString() });

describe('POST /api/v1/instruments/{id}/agent-heartbeat', () => {
  it('records what the agent reports and answers with the feed as people see it', async () => {
    const res = await heartbeat(lab.foundry.id, {
      agent_version: '0.1.0',
      host: 'SPARK-PC-1',
      queue_length: 3,
      last_success_at: '2026-12-03T10:15:00+01:00',
      last_file: { name: 'K24-0412.csv', at: '2026-12-03T09:15:00Z' },
      last_error: { message: 'server unreachable: ECONNREFUSED', at: '2026-12-03T09:20:00.000Z' },
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body).toEqual({
      instrument: { id: lab.foundry.id, code: 'OES-1' },
      state: 'alive',
      stale_after_minutes: STALE_MINUTES,
      reported_at: expect.any(String),
      agent: { version: '0.1.0', host: 'SPARK-PC-1', reported_by: expect.stringMatching(/^key /) },
      queue_length: 3,
      // Stored in UTC whatever offset the agent wrote.
      last_success_at: '2026-12-03T09:15:00.000Z',
      last_file: { name: 'K24-0412.csv', at: '2026-12-03T09:15:00.000Z' },
      last_error: { message: 'server unreachable: ECONNREFUSED', at: '2026-12-03T09:20:00.000Z' },
    });
    expect(Math.abs(Date.parse(res.body.reported_at) - Date.now())).toBeLessThan(5_000);
  });

  it('replaces the previous heartbeat: a recovered agent clears its last error', async () => {
    await heartbeat(lab.castHouse.id, {
      agent_version: '0.1.0',
      queue_length: 5,
      last_error: { message: 'HTTP 503', at: '2026-12-03T09:00:00Z' },
    });
    const res = await heartbeat(lab.castHouse.id, { agent_version: '0.1.1', queue_length: 0, last_error: null });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ queue_length: 0, last_error: null, last_file: null, agent: { version: '0.1.1', host: null } });
  });

  it.each([
    ['no body fields', {}, ['body.agent_version', 'body.queue_length']],
    ['a negative queue', { agent_version: '1', queue_length: -1 }, ['body.queue_length']],
    ['a fractional queue', { agent_version: '1', queue_length: 1.5 }, ['body.queue_length']],
    ['a date that is not ISO 8601', { agent_version: '1', queue_length: 0, last_success_at: 'yesterday' }, ['body.last_success_at']],
    ['an error without its time', { agent_version: '1', queue_length: 0, last_error: { message: 'x' } }, ['body.last_error.at']],
    ['a version that is too long', { agent_version: 'v'.repeat(41), queue_length: 0 }, ['body.agent_version']],
  ])('refuses %s with a 400 problem naming the fields', async (_case, body, locations) => {
    const res = await heartbeat(lab.foundry.id, body);
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors!.map((e) => e.location)
        .sort(),
    ).toEqual(locations);
  });

  it('answers 404 for an unknown instrument', async () => {
    const res = await heartbeat('ins_unknown', { agent_version: '1', queue_length: 0 });
    expectProblem(res, 404);
    expect(problemBody(res).detail).toContain('ins_unknown');
  });

  it('needs imports:write: a read-only key and a viewer get 403, an analyst may report', async () => {
    const readOnly = await issueKey(t, ['samples:read']);
    expectProblem(await heartbeat(lab.foundry.id, { agent_version: '1', queue_length: 0 }, readOnly.secret), 403);
    const { agent: viewer } = await signedInAgent(t, 'viewer');
    expectProblem(
      await viewer.post(`/api/v1/instruments/${lab.foundry.id}/agent-heartbeat`).send({ agent_version: '1', queue_length: 0 }),
      403,
    );
    const { agent: analyst } = await signedInAgent(t, 'analyst');
    const ok = await analyst.post(`/api/v1/instruments/${lab.foundry.id}/agent-heartbeat`).send({ agent_version: '1', queue_length: 0 });
    expect(ok.status).toBe(200);
  });

  it('answers 401 without credentials', async () => {
    expectProblem(
      await request(t.app).post(`/api/v1/instruments/${lab.foundry.id}/agent-heartbeat`).send({ agent_version: '1', queue_length: 0 }),
      401,
    );
  });

  it('refuses a key restricted to another instrument', async () => {
    const restricted = await issueKey(t, ['imports:write', 'samples:read'], { instrument_ids: [lab.castHouse.id] });
    expectProblem(await heartbeat(lab.foundry.id, { agent_version: '1', queue_length: 0 }, restricted.secret), 403);
    expect((await heartbeat(lab.castHouse.id, { agent_version: '1', queue_length: 0 }, restricted.secret)).status).toBe(200);
  });
});

describe('GET /api/v1/instruments/{id}/feed and /api/v1/instrument-feeds', () => {
  it('shows no_agent for an instrument whose agent never reported', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const created = await (
      await signedInAgent(t, 'manager')
    ).agent
      .post('/api/v1/instruments')
      .send({ code: 'OES-7', name: 'Spare', site: 'Yard' });
    const res = await agent.get(`/api/v1/instruments/${created.body.id}/feed`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      instrument: { id: created.body.id, code: 'OES-7' },
      state: 'no_agent',
      stale_after_minutes: STALE_MINUTES,
      reported_at: null,
      agent: null,
      queue_length: null,
      last_success_at: null,
      last_file: null,
      last_error: null,
    });
  });

  it(`turns stale once the agent has been silent for more than ${STALE_MINUTES} minutes`, async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    await heartbeat(lab.foundry.id, { agent_version: '0.1.0', queue_length: 2 });
    await ageHeartbeat(lab.foundry.id, STALE_MINUTES - 1);
    expect((await agent.get(`/api/v1/instruments/${lab.foundry.id}/feed`)).body.state).toBe('alive');
    await ageHeartbeat(lab.foundry.id, STALE_MINUTES + 1);
    const stale = await agent.get(`/api/v1/instruments/${lab.foundry.id}/feed`);
    expect(stale.body).toMatchObject({ state: 'stale', queue_length: 2, agent: { version: '0.1.0' } });
    await heartbeat(lab.foundry.id, { agent_version: '0.1.0', queue_length: 0 });
    expect((await agent.get(`/api/v1/instruments/${lab.foundry.id}/feed`)).body.state).toBe('alive');
  });

  it('lists every instrument ordered by code with its feed', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const res = await agent.get('/api/v1/instrument-feeds');
    expect(res.status).toBe(200);
    const codes = res.body.data.map((f: { instrument: { code: string } }) => f.instrument.code);
    expect(codes).toEqual([...codes].sort());
    expect(codes).toEqual(expect.arrayContaining(['OES-1', 'OES-2', 'OES-7']));
    const byCode = new Map(res.body.data.map((f: { instrument: { code: string } }) => [f.instrument.code, f]));
    expect(byCode.get('OES-7')).toMatchObject({ state: 'no_agent' });
    expect(byCode.get('OES-1')).toMatchObject({ state: 'alive' });
  });

  it('needs samples:read and answers 404 for an unknown instrument', async () => {
    const writeOnly = await issueKey(t, ['imports:write']);
    const auth = { authorization: `Bearer ${writeOnly.secret}` };
    expectProblem(await request(t.app).get(`/api/v1/instruments/${lab.foundry.id}/feed`).set(auth), 403);
    expectProblem(await request(t.app).get('/api/v1/instrument-feeds').set(auth), 403);
    const { agent } = await signedInAgent(t, 'viewer');
    expectProblem(await agent.get('/api/v1/instruments/ins_unknown/feed'), 404);
  });

  it('shows a restricted key only its own instruments', async () => {
    const restricted = await issueKey(t, ['samples:read'], { instrument_ids: [lab.castHouse.id] });
    const auth = { authorization: `Bearer ${restricted.secret}` };
    const list = await request(t.app).get('/api/v1/instrument-feeds').set(auth);
    expect(list.body.data.map((f: { instrument: { id: string } }) => f.instrument.id)).toEqual([lab.castHouse.id]);
    expectProblem(await request(t.app).get(`/api/v1/instruments/${lab.foundry.id}/feed`).set(auth), 404);
  });
});
