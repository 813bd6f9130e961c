// JSON bodies are checked right after parsing: nested more than 64 levels → 400 before any other
// work (Idempotency-Key included), recorded in the request log like any refused call; GET bodies
// are not read.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, countRows, expectProblem, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let admin: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  admin = (await signedInAgent(t, 'admin')).agent;
});
afterAll(() => t.close());

const arrays = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;
const objects = (depth: number) => `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`;

function post(body: string, requestId: string, headers: Record<string, string> = {}) {
  return admin
    .post('/api/v1/samples')
    .set({ 'content-type': 'application/json', 'x-request-id': requestId, ...headers })
    .send(body);
}

async function loggedEntry(requestId: string) {
  const list = await admin.get('/api/v1/request-log').query({ limit: 200 });
  const summary = list.body.data.find((e: { request_id: string }) => e.request_id === requestId);
  expect(summary, `no request-log entry for ${requestId}`).toBeDefined();
  return (await admin.get(`/api/v1/request-log/${summary.id}`)).body;
}

describe('JSON depth', () => {
  it.each([
    ['arrays', arrays(10_000)],
    ['objects', objects(10_000)],
  ])('10,000 levels of %s: 400 json-too-deep, recorded in the request log', async (kind, body) => {
    const res = await post(body, `deep-${kind}`);
    expectProblem(res, 400);
    expect(problemBody(res)).toMatchObject({ type: '/problems/json-too-deep', max_depth: 64 });
    const entry = await loggedEntry(`deep-${kind}`);
    expect(entry).toMatchObject({ method: 'POST', path: '/api/v1/samples', status: 400 });
    expect(entry.request).toMatchObject({ body_kind: 'json', body_truncated: true, body_size: Buffer.byteLength(body) });
    expect(entry.request.body).toContain('[nested deeper than 64 levels]');
    expect(entry.response.body).toContain('json-too-deep');
  });

  it('with an Idempotency-Key: 400 too, and no key is kept', async () => {
    for (const body of [arrays(10_000), objects(10_000)]) {
      const res = await post(body, `deep-key-${body.length}`, { 'idempotency-key': `deep-${body.length}` });
      expectProblem(res, 400);
      expect(problemBody(res).type).toBe('/problems/json-too-deep');
    }
    expect(await countRows(t.db('idempotency_keys'))).toBe(0);
    await loggedEntry(`deep-key-${arrays(10_000).length}`);
  });

  it('64 levels are read (and refused by the schema); 65 are not read', async () => {
    const at64 = await post(arrays(64), 'depth-64');
    expectProblem(at64, 400);
    expect(problemBody(at64).type).toBe('/problems/validation-failed');
    const at65 = await post(arrays(65), 'depth-65');
    expect(problemBody(at65).type).toBe('/problems/json-too-deep');
    expect(problemBody(await post(objects(65), 'depth-65o')).type).toBe('/problems/json-too-deep');
  });

  it('applies to every JSON route, public ones included', async () => {
    const res = await admin.post('/api/v1/auth/login').set('content-type', 'application/json').send(objects(100));
    expectProblem(res, 400);
    expect(problemBody(res).type).toBe('/problems/json-too-deep');
  });
});

describe('GET bodies', () => {
  it('are not read: a broken or deep body on a GET changes nothing', async () => {
    for (const body of ['{', arrays(10_000)]) {
      const res = await admin.get('/api/v1/auth/me').set('content-type', 'application/json').send(body);
      expect(res.status, res.text).toBe(200);
    }
  });
});
