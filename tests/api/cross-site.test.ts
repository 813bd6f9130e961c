// CSRF defence, generated from the OpenAPI document: every write sent with the session cookie
// from another origin (Origin header) or, without Origin, marked cross-site or same-site by the
// browser (Sec-Fetch-Site) is refused before it does anything; the console's own origin, clients
// that send neither header, and API keys are not affected.
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SCOPES } from '../../server/domain/auth/scopes.ts';
import { OPENAPI_FILE } from '../../server/openapi/write.ts';
import { createTestApp, createUser, expectProblem, issueKey, TEST_PASSWORD, type TestApp } from '../helpers/test-app.ts';

const document = JSON.parse(readFileSync(OPENAPI_FILE, 'utf8')) as { paths: Record<string, Record<string, { operationId: string }>> };
const writes = Object.entries(document.paths).flatMap(([path, methods]) =>
  Object.entries(methods)
    .filter(([method]) => ['post', 'put', 'patch', 'delete'].includes(method))
    .map(([method, operation]) => ({
      method,
      path,
      id: operation.operationId,
      url: `/api/v1${path.replace(/\{\w+\}/g, 'x_placeholder')}`,
    })),
);

const EVIL = 'http://evil.example';
let t: TestApp;
let cookie: string;
let key: string;

async function signIn(email: string): Promise<string> {
  const login = await request(t.app).post('/api/v1/auth/login').send({ email, password: TEST_PASSWORD });
  return login.headers['set-cookie'][0].split(';')[0];
}

beforeAll(async () => {
  t = await createTestApp();
  const admin = await createUser(t.db, 'admin');
  cookie = await signIn(admin.email);
  key = (await issueKey(t, [...SCOPES], { owner: admin })).secret;
});
afterAll(() => t.close());

function send(method: string, url: string, headers: Record<string, string>) {
  const agent = request(t.app);
  const call = agent[method as 'post'](url);
  for (const [name, value] of Object.entries(headers)) call.set(name, value);
  return call.send(method === 'delete' ? undefined : {});
}

const refusedAsCrossSite = (res: request.Response) => res.status === 403 && JSON.parse(res.text).type === '/problems/cross-site-request';

describe('cross-site writes with the session cookie', () => {
  it('covers every write operation of the document', () => {
    expect(writes.length).toBeGreaterThan(20);
  });

  it.each(writes.map((w) => [`${w.method.toUpperCase()} ${w.path}`, w] as const))('%s → 403 from another origin', async (_name, w) => {
    const res = await send(w.method, w.url, { cookie, origin: EVIL });
    expectProblem(res, 403);
    expect(JSON.parse(res.text)).toMatchObject({ type: '/problems/cross-site-request', title: 'Cross-site request refused' });
    const marked = await send(w.method, w.url, { cookie, 'sec-fetch-site': 'cross-site' });
    expect(refusedAsCrossSite(marked)).toBe(true);
    const sibling = await send(w.method, w.url, { cookie, 'sec-fetch-site': 'same-site' });
    expect(refusedAsCrossSite(sibling)).toBe(true);
  });

  it.each(writes.map((w) => [`${w.method.toUpperCase()} ${w.path}`, w] as const))(
    '%s → not refused from its own origin, without browser headers, or with an API key',
    async (_name, w) => {
      expect(refusedAsCrossSite(await send(w.method, w.url, { cookie, origin: t.config.publicUrl }))).toBe(false);
      expect(refusedAsCrossSite(await send(w.method, w.url, { cookie, 'sec-fetch-site': 'same-origin' }))).toBe(false);
      expect(refusedAsCrossSite(await send(w.method, w.url, { cookie }))).toBe(false);
      expect(refusedAsCrossSite(await send(w.method, w.url, { authorization: `Bearer ${key}`, origin: EVIL }))).toBe(false);
    },
  );

  it('refuses a multipart upload and a form replay from another origin, and leaves the session signed in', async () => {
    const cookie = await signIn((await createUser(t.db, 'admin')).email); // the calls above signed the first one out
    const upload = await request(t.app)
      .post('/api/v1/imports')
      .set({ cookie, origin: EVIL })
      .field('instrument_id', 'x')
      .field('method_id', 'y')
      .attach('file', Buffer.from('a,b\n1,2\n'), 'r.csv');
    expect(refusedAsCrossSite(upload)).toBe(true);
    const replay = await request(t.app).post('/api/v1/request-log/x/replay').set({ cookie, origin: EVIL }).type('form').send('a=1');
    expect(refusedAsCrossSite(replay)).toBe(true);
    const logout = await request(t.app).post('/api/v1/auth/logout').set({ cookie, origin: EVIL });
    expect(refusedAsCrossSite(logout)).toBe(true);
    expect((await request(t.app).get('/api/v1/auth/me').set({ cookie })).status).toBe(200);
  });

  it('refuses a sign-in sent by another site (no cookie yet)', async () => {
    const user = await createUser(t.db, 'viewer');
    const res = await request(t.app).post('/api/v1/auth/login').set({ origin: EVIL }).send({ email: user.email, password: TEST_PASSWORD });
    expect(refusedAsCrossSite(res)).toBe(true);
    expect(res.headers['set-cookie']).toBeUndefined();
  });
});
