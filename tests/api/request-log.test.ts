// The request log: what is recorded, who sees it, filters and pages, redaction and truncation.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/domain/auth/session-token.ts';
import { recorderFor } from '../../server/domain/request-log/recorder.ts';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { createTestApp, createUser, expectProblem, issueKey, signedInAgent, TEST_PASSWORD, type TestApp } from '../helpers/test-app.ts';
import { testRoutes } from '../helpers/test-routes.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ requestLogBodyLimit: 512 }, { routes: [...v1Routes, ...testRoutes().routes] });
});
afterAll(() => t.close());

interface Summary {
  id: string;
  method: string;
  path: string;
  query: string;
  status: number;
  duration_ms: number;
  caller: { type: string; id: string | null; label: string | null };
  request_id: string;
}

async function entries(agent: request.Agent, query = ''): Promise<Summary[]> {
  const res = await agent.get(`/api/v1/request-log?limit=200${query}`);
  expect(res.status).toBe(200);
  return res.body.data;
}

describe('recording', () => {
  it('records method, path, query, status, duration, caller, request id and both bodies', async () => {
    const { agent, user } = await signedInAgent(t, 'integrator');
    const key = await issueKey(t, ['samples:read'], { owner: user });
    await request(t.app)
      .get('/api/v1/samples?limit=5')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-request-id', 'mes-poll-1')
      .expect(200);

    const [entry] = (await entries(agent)).filter((e) => e.request_id === 'mes-poll-1');
    expect(entry).toMatchObject({
      method: 'GET',
      path: '/api/v1/samples',
      query: 'limit=5',
      status: 200,
      caller: { type: 'api_key', id: key.id },
    });
    expect(entry.caller.label).toMatch(/\(mw_live_\w{6}…\)$/);
    expect(entry.duration_ms).toBeGreaterThanOrEqual(0);

    const detail = await agent.get(`/api/v1/request-log/${entry.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.response).toMatchObject({ body_kind: 'json', body: '{"data":[],"next_cursor":null}', body_truncated: false });
    expect(detail.body.response.headers['x-request-id']).toBe('mes-poll-1');
    expect(detail.body.request.headers.authorization).toBe('Bearer [redacted]');
    expect(detail.body.replayable).toBe(true);
  });

  it('records refused calls too: a bad key is logged as anonymous, with its 401', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    await request(t.app)
      .get('/api/v1/samples')
      .set('authorization', 'Bearer mw_live_nonsense')
      .set('x-request-id', 'bad-key-1')
      .expect(401);
    const [entry] = (await entries(agent)).filter((e) => e.request_id === 'bad-key-1');
    expect(entry).toMatchObject({ status: 401, caller: { type: 'anonymous', id: null } });
  });

  it('does not record health checks or the OpenAPI document', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    await request(t.app).get('/api/v1/health').set('x-request-id', 'health-probe').expect(200);
    await request(t.app).get('/api/v1/openapi.json').set('x-request-id', 'doc-fetch').expect(200);
    const ids = (await entries(agent)).map((e) => e.request_id);
    expect(ids).not.toContain('health-probe');
    expect(ids).not.toContain('doc-fetch');
  });
});

describe('redaction', () => {
  it('keeps no API key, password or cookie anywhere in the log', async () => {
    const admin = await createUser(t.db, 'admin');
    const agent = request.agent(t.app);
    const login = await agent.post('/api/v1/auth/login').send({ email: admin.email, password: TEST_PASSWORD }).expect(200);
    const cookie = String(login.headers['set-cookie']).match(new RegExp(`${SESSION_COOKIE}=([^;]+)`))![1];
    const created = await agent
      .post('/api/v1/api-keys')
      .send({ name: 'leak check', scopes: ['samples:read'] })
      .expect(201);
    const secret: string = created.body.secret;
    await request(t.app).get(`/api/v1/samples?note=${secret}`).set('authorization', `Bearer ${secret}`).expect(200);
    await agent.post('/api/v1/auth/password-reset/confirm').send({ token: 'some-reset-token-value', password: 'a new password here' });

    await recorderFor(t.ctx).drain(); // entries are written after the response; read them once written
    const everything = JSON.stringify(await t.db('request_log').select());
    for (const leaked of [secret, secret.slice(8, 30), TEST_PASSWORD, cookie, 'some-reset-token-value', 'a new password here']) {
      expect(everything).not.toContain(leaked);
    }
    const rows = await t.db('request_log').where({ path: '/api/v1/auth/login' });
    expect(JSON.parse(rows.at(-1).request_body)).toEqual({ email: admin.email, password: '[redacted]' });
    expect(JSON.parse(rows.at(-1).response_headers_json)['set-cookie']).toBe('[redacted]');
    const keyCall = await t.db('request_log').where({ path: '/api/v1/api-keys', method: 'POST' }).orderBy('id', 'desc').first();
    expect(JSON.parse(keyCall.request_headers_json).cookie).toBe('[redacted]');
    expect(JSON.parse(keyCall.response_body).secret).toBe('[redacted]');
    const query = await t.db('request_log').where({ path: '/api/v1/samples' }).orderBy('id', 'desc').first();
    expect(query.query).toBe('note=mw_live_%5Bredacted%5D');
  });
});

describe('bodies', () => {
  it('cuts bodies at REQUEST_LOG_BODY_LIMIT bytes and says so', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const name = 'Ä'.repeat(200); // two bytes each in UTF-8: the cut must not split one
    const res = await agent
      .post('/api/v1/api-keys')
      .set('x-request-id', 'long-body')
      .send({ name, scopes: ['samples:read'] })
      .expect(201);
    const [entry] = (await entries(agent)).filter((e) => e.request_id === 'long-body');
    const detail = (await agent.get(`/api/v1/request-log/${entry.id}`)).body;
    expect(detail.response.body_truncated).toBe(true);
    expect(detail.response.body_size).toBe(Buffer.byteLength(JSON.stringify(res.body)));
    expect(Buffer.byteLength(detail.response.body)).toBeLessThanOrEqual(512);
    expect(Buffer.byteLength(detail.response.body)).toBeGreaterThan(500);
    expect(detail.response.body).not.toContain('\uFFFD');
    expect(detail.request.body_truncated).toBe(false);
  });

  it('describes multipart uploads by file name, size and type without their content', async () => {
    const { agent, user } = await signedInAgent(t, 'admin');
    const key = await issueKey(t, ['imports:write'], { owner: user });
    const content = 'Sample,C,Mn\nK24-0412,0.21,0.80\n';
    await request(t.app)
      .post('/api/v1/test/upload')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-request-id', 'upload-1')
      .field('instrument', 'OES-1')
      .attach('file', Buffer.from(content), { filename: 'K24-0412.csv', contentType: 'text/csv' })
      .expect(201);
    const [entry] = (await entries(agent)).filter((e) => e.request_id === 'upload-1');
    const detail = (await agent.get(`/api/v1/request-log/${entry.id}`)).body;
    expect(detail.request.body_kind).toBe('multipart');
    expect(JSON.parse(detail.request.body)).toEqual({
      fields: { instrument: 'OES-1' },
      files: [{ field: 'file', name: 'K24-0412.csv', size: content.length, content_type: 'text/csv' }],
    });
    expect(detail.request.body).not.toContain('0.21');
    expect(detail.replayable).toBe(false);
  });

  it('keeps the bytes of a file out of the log also when the upload route moves the file onto the body', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const content = 'Sample,C,Mn\nK24-0412,0.21,0.80\n';
    // The import preview answers 422 here (the instrument and method do not exist): it is logged all the same.
    await agent
      .post('/api/v1/imports/preview')
      .set('x-request-id', 'upload-2')
      .field('instrument_id', 'ins_none')
      .field('method_id', 'mth_none')
      .attach('file', Buffer.from(content), { filename: 'K24-0412.csv', contentType: 'text/csv' })
      .expect(422);
    const [entry] = (await entries(agent)).filter((e) => e.request_id === 'upload-2');
    const detail = (await agent.get(`/api/v1/request-log/${entry.id}`)).body;
    expect(JSON.parse(detail.request.body)).toEqual({
      fields: { instrument_id: 'ins_none', method_id: 'mth_none' },
      files: [{ field: 'file', name: 'K24-0412.csv', size: content.length, content_type: 'text/csv' }],
    });
    expect(detail.request.body_truncated).toBe(false);
  });
});

describe('visibility, filters and pages', () => {
  it("shows admins every entry and others only their own calls and their keys' calls", async () => {
    const a = await signedInAgent(t, 'integrator');
    const b = await signedInAgent(t, 'integrator');
    const { agent: admin } = await signedInAgent(t, 'admin');
    const aKey = await issueKey(t, ['samples:read'], { owner: a.user });
    await request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${aKey.secret}`).set('x-request-id', 'a-key-call').expect(200);
    await b.agent.get('/api/v1/auth/me').set('x-request-id', 'b-own-call').expect(200);

    const seenByA = (await entries(a.agent)).map((e) => e.request_id);
    expect(seenByA).toContain('a-key-call');
    expect(seenByA).not.toContain('b-own-call');
    const seenByB = await entries(b.agent);
    expect(seenByB.map((e) => e.request_id)).toContain('b-own-call');
    expect(seenByB.map((e) => e.request_id)).not.toContain('a-key-call');
    const adminSees = (await entries(admin)).map((e) => e.request_id);
    expect(adminSees).toEqual(expect.arrayContaining(['a-key-call', 'b-own-call']));

    const aEntry = (await entries(a.agent)).find((e) => e.request_id === 'a-key-call')!;
    expectProblem(await b.agent.get(`/api/v1/request-log/${aEntry.id}`), 404);
  });

  it('filters by method, status, path prefix, caller and time, and pages newest first', async () => {
    const { agent, user } = await signedInAgent(t, 'integrator');
    const key = await issueKey(t, ['samples:read'], { owner: user });
    const since = new Date().toISOString();
    for (let i = 0; i < 5; i++) await request(t.app).get(`/api/v1/samples?i=${i}`).set('authorization', `Bearer ${key.secret}`).expect(200);
    await request(t.app).get('/api/v1/users').set('authorization', `Bearer ${key.secret}`).expect(403);

    expect((await entries(agent, `&caller_id=${key.id}`)).map((e) => e.query)).toEqual(['', 'i=4', 'i=3', 'i=2', 'i=1', 'i=0']);
    expect((await entries(agent, `&caller_id=${key.id}&status=4xx`)).map((e) => e.path)).toEqual(['/api/v1/users']);
    expect((await entries(agent, `&caller_id=${key.id}&status=200`)).length).toBe(5);
    expect((await entries(agent, `&caller_id=${key.id}&path_prefix=/api/v1/sam`)).length).toBe(5);
    expect((await entries(agent, `&caller_id=${key.id}&method=POST`)).length).toBe(0);
    expect((await entries(agent, `&caller_id=${key.id}&since=${since}`)).length).toBe(6);
    expect((await entries(agent, `&caller_id=${key.id}&until=${since}`)).length).toBe(0);

    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: request.Response = await agent.get(`/api/v1/request-log?caller_id=${key.id}&limit=4${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...page.body.data.map((e: Summary) => e.query));
      cursor = page.body.next_cursor;
    } while (cursor);
    expect(seen).toEqual(['', 'i=4', 'i=3', 'i=2', 'i=1', 'i=0']);
  });

  it('answers bad filters with 400 naming each field', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.get('/api/v1/request-log?method=BREW&status=6xx&since=yesterday');
    expectProblem(res, 400);
    expect(
      JSON.parse(res.text)
        .errors.map((e: { location: string }) => e.location)
        .sort(),
    ).toEqual(['query.method', 'query.since', 'query.status']);
  });
});
