// API conventions every route inherits: problem responses, request ids, headers, health.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ bodyLimit: '2kb' });
});
afterAll(() => t.close());

describe('GET /api/v1/health', () => {
  it('reports status, version and a working database', async () => {
    const res = await request(t.app).get('/api/v1/health');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body).toMatchObject({ status: 'ok', version: t.config.version, database: { ok: true, client: 'sqlite' } });
    expect(Date.parse(res.body.time)).not.toBeNaN();
  });

  it('answers while a write transaction holds the database connection (SQLite file, WAL)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'meltwire-health-'));
    const file = await createTestApp({ databaseFile: join(dir, 'health.db') });
    try {
      let release!: () => void;
      const held = new Promise<void>((resolve) => (release = resolve));
      const order: string[] = [];
      const writing = file.db.transaction(async (trx) => {
        await trx('audit_events').count({ n: '*' });
        await held;
        order.push('transaction');
      });
      const res = await request(file.app).get('/api/v1/health');
      order.push('health');
      release();
      await writing;
      expect(res.status).toBe(200);
      expect(res.body.database.ok).toBe(true);
      expect(order).toEqual(['health', 'transaction']);
    } finally {
      await file.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('problem responses (RFC 9457)', () => {
  it('answers an unknown API route with 404 problem+json', async () => {
    const res = await request(t.app).get('/api/v1/no-such-thing');
    expectProblem(res, 404);
    expect(problemBody(res)).toMatchObject({ type: '/problems/not-found', instance: '/api/v1/no-such-thing' });
  });

  it('answers malformed JSON with 400', async () => {
    const res = await request(t.app).post('/api/v1/auth/login').set('content-type', 'application/json').send('{"email": ');
    expectProblem(res, 400);
    expect(problemBody(res).type).toBe('/problems/malformed-json');
  });

  it('answers a body over the limit with 413', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/login')
      .send({ email: 'a@b.test', password: 'x'.repeat(5000) });
    expectProblem(res, 413);
    expect(problemBody(res).detail).toContain('2kb');
  });

  it('answers invalid input with 400 and one entry per field in errors[]', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.post('/api/v1/users').send({ email: 'not-an-email', role: 'wizard' });
    expectProblem(res, 400);
    const locations = problemBody(res)
      .errors?.map((e) => e.location)
      .sort();
    expect(locations).toEqual(['body.email', 'body.name', 'body.role']);
  });

  it('answers an unauthenticated call to a guarded route with 401', async () => {
    const res = await request(t.app).get('/api/v1/samples');
    expectProblem(res, 401);
  });

  it('answers a viewer on an admin route with 403 naming the scope', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const res = await agent.get('/api/v1/users');
    expectProblem(res, 403);
    expect(problemBody(res)).toMatchObject({ required_scope: 'users:read' });
  });

  it('answers an unexpected failure with 500 and no stack trace', async () => {
    const broken = await createTestApp();
    await broken.db.destroy();
    const res = await request(broken.app).post('/api/v1/auth/login').send({ email: 'a@kestrelbend.test', password: 'whatever-long' });
    expectProblem(res, 500);
    expect(res.text).not.toMatch(/at .*\.ts:\d+/);
    expect(res.text).not.toContain('Error:');
    await broken.smtp.close();
  });
});

describe('request ids and headers', () => {
  it('echoes a well-formed x-request-id and puts it in problems', async () => {
    const res = await request(t.app).get('/api/v1/samples').set('x-request-id', 'mes-call-42');
    expect(res.headers['x-request-id']).toBe('mes-call-42');
    expect(problemBody(res).request_id).toBe('mes-call-42');
  });

  it('replaces a malformed x-request-id with a generated one', async () => {
    const res = await request(t.app).get('/api/v1/health').set('x-request-id', 'bad id with spaces');
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('sets security headers', async () => {
    const res = await request(t.app).get('/api/v1/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
