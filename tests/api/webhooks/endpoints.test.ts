// Webhook endpoints: the secret shown once and kept out of GETs, logs and the audit trail; event
// types checked; secret rotation with an overlap; https and the SSRF guard when saving.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let guarded: TestApp;
let admin: request.Agent;
let guardedAdmin: request.Agent;

beforeAll(async () => {
  t = await createTestApp({ webhookAllowPrivate: true });
  guarded = await createTestApp({ webhookAllowPrivate: false });
  admin = (await signedInAgent(t, 'admin')).agent;
  guardedAdmin = (await signedInAgent(guarded, 'admin')).agent;
});
afterAll(async () => {
  await t.close();
  await guarded.close();
});

const endpoint = (extra: Record<string, unknown> = {}) => ({
  url: 'http://127.0.0.1:4399/hooks',
  event_types: ['sample.created', 'import.completed'],
  description: 'melt shop screen',
  ...extra,
});

describe('webhook endpoints', () => {
  it('creates an endpoint with a whsec_ secret shown once, and never shows it again', async () => {
    const created = await admin.post('/api/v1/webhook-endpoints').send(endpoint());
    expect(created.status).toBe(201);
    expect(created.headers.location).toBe(`/api/v1/webhook-endpoints/${created.body.id}`);
    expect(created.body).toMatchObject({
      url: 'http://127.0.0.1:4399/hooks',
      enabled: true,
      event_types: ['sample.created', 'import.completed'],
    });
    const secret: string = created.body.secret;
    expect(secret).toMatch(/^whsec_[A-Za-z0-9+/]{32}$/);

    const one = await admin.get(`/api/v1/webhook-endpoints/${created.body.id}`);
    const list = await admin.get('/api/v1/webhook-endpoints');
    for (const text of [one.text, list.text]) expect(text).not.toContain(secret.slice(6));
    expect(list.body.data.map((e: { id: string }) => e.id)).toContain(created.body.id);

    const logged = JSON.stringify(await t.db('request_log').select());
    const audited = JSON.stringify(await t.db('audit_events').where({ target_id: created.body.id }));
    expect(audited).toContain('webhook_endpoint.created');
    for (const text of [logged, audited]) expect(text).not.toContain(secret.slice(6));
  });

  it('refuses unknown event types and an empty list', async () => {
    const res = await admin.post('/api/v1/webhook-endpoints').send(endpoint({ event_types: ['sample.created', 'heat.tapped'] }));
    expectProblem(res, 400);
    expect(problemBody(res).errors?.[0].location).toBe('body.event_types.1');
    expectProblem(await admin.post('/api/v1/webhook-endpoints').send(endpoint({ event_types: [] })), 400);
  });

  it('changes, disables and deletes an endpoint', async () => {
    const { id } = (await admin.post('/api/v1/webhook-endpoints').send(endpoint())).body;
    const changed = await admin
      .patch(`/api/v1/webhook-endpoints/${id}`)
      .send({ enabled: false, event_types: ['import.failed'], description: null });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ enabled: false, event_types: ['import.failed'], description: null });
    expectProblem(await admin.patch(`/api/v1/webhook-endpoints/${id}`).send({}), 400);
    expect((await admin.delete(`/api/v1/webhook-endpoints/${id}`)).status).toBe(204);
    expectProblem(await admin.get(`/api/v1/webhook-endpoints/${id}`), 404);
  });

  it('rotates the secret, keeping the old one for 24 hours by default', async () => {
    const created = (await admin.post('/api/v1/webhook-endpoints').send(endpoint())).body;
    const rotated = await admin.post(`/api/v1/webhook-endpoints/${created.id}/rotate-secret`).send({});
    expect(rotated.status).toBe(200);
    expect(rotated.body.secret).toMatch(/^whsec_/);
    expect(rotated.body.secret).not.toBe(created.secret);
    const hours = (Date.parse(rotated.body.previous_secret_expires_at) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(23.9);
    expect(hours).toBeLessThanOrEqual(24);
    const again = await admin.post(`/api/v1/webhook-endpoints/${created.id}/rotate-secret`).send({ overlap_minutes: 0 });
    expect(again.body.previous_secret_expires_at).toBeNull();
  });

  it('needs webhooks:write to change and webhooks:read to look', async () => {
    const { agent: viewer } = await signedInAgent(t, 'viewer');
    expectProblem(await viewer.get('/api/v1/webhook-endpoints'), 403);
    const { agent: manager } = await signedInAgent(t, 'manager');
    expect((await manager.get('/api/v1/webhook-endpoints')).status).toBe(200);
    expectProblem(await manager.post('/api/v1/webhook-endpoints').send(endpoint()), 403);
  });
});

describe('which URLs may receive webhooks', () => {
  it.each([
    ['http://127.0.0.1:4399/hooks', 'loopback'],
    ['http://localhost:4399/hooks', 'localhost resolves to'],
    ['http://[::1]/hooks', 'loopback'],
    ['http://[::ffff:127.0.0.1]/hooks', 'loopback, inside IPv6'],
    ['http://169.254.169.254/latest/meta-data/', 'link-local'],
    ['http://10.20.30.40/hooks', 'private'],
    ['http://192.168.0.10/hooks', 'private'],
    ['http://100.64.0.7/hooks', 'CGNAT'],
    ['http://[fd00:ec2::254]/', 'unique local'],
    ['http://0.0.0.0:4399/', 'this network'],
  ])('refuses %s without WEBHOOK_ALLOW_PRIVATE', async (url, reason) => {
    const res = await guardedAdmin.post('/api/v1/webhook-endpoints').send(endpoint({ url }));
    expectProblem(res, 422);
    expect(problemBody(res).errors?.[0]).toMatchObject({ location: 'body.url', code: 'private_address' });
    expect(problemBody(res).errors?.[0].message).toContain(reason);
  });

  it('refuses a change of URL to a private address too', async () => {
    const { id } = (await guardedAdmin.post('/api/v1/webhook-endpoints').send(endpoint({ url: 'http://93.184.215.14/hooks' }))).body;
    expectProblem(await guardedAdmin.patch(`/api/v1/webhook-endpoints/${id}`).send({ url: 'http://127.0.0.1/' }), 422);
  });

  it('refuses credentials in the URL and schemes other than http(s)', async () => {
    const res = await admin.post('/api/v1/webhook-endpoints').send(endpoint({ url: 'http://user:pw@127.0.0.1:4399/' }));
    expect(problemBody(res).errors?.[0].code).toBe('url_credentials');
    expectProblem(await admin.post('/api/v1/webhook-endpoints').send(endpoint({ url: 'ftp://127.0.0.1/' })), 400);
  });

  it('requires https in production', async () => {
    const production = await createTestApp({ env: 'production', webhookAllowPrivate: false });
    try {
      const { agent } = await signedInAgent(production, 'admin');
      const res = await agent.post('/api/v1/webhook-endpoints').send(endpoint({ url: 'http://93.184.215.14/hooks' }));
      expectProblem(res, 422);
      expect(problemBody(res).errors?.[0].code).toBe('https_required');
    } finally {
      await production.close();
    }
  });
});
