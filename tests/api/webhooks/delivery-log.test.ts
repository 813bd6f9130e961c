// The delivery log and its actions: every attempt listed; retry one delivery; recover all that
// failed since a time; send a test event; an endpoint failing for five days is disabled and its
// owner told.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DeliveryWorker, startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import type { UserRow } from '../../../server/domain/users/users.repository.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, createUser, expectProblem, issueKey, seedDemoLab, type TestApp, waitForMail } from '../../helpers/test-app.ts';
import { type Receiver, startReceiver } from '../../helpers/webhook-receiver.ts';

let t: TestApp;
let lab: DemoLab;
let worker: DeliveryWorker;
let owner: UserRow;
let key: string;
let receiver: Receiver;
let status = 500;
const auth = () => ({ authorization: `Bearer ${key}` });

beforeAll(async () => {
  t = await createTestApp({ webhookAllowPrivate: true, webhookRetryDelays: [0, 0] });
  lab = await seedDemoLab(t.db);
  owner = await createUser(t.db, 'integrator');
  key = (await issueKey(t, ['samples:write', 'webhooks:write', 'webhooks:read', 'events:read'], { owner })).secret;
  receiver = await startReceiver(4371, () => ({ status, body: status >= 300 ? 'receiver says no' : '' }));
  worker = startDeliveryWorker(t.ctx, { pollMs: 50 });
});
afterAll(async () => {
  await worker.stop();
  await receiver.close();
  await t.close();
});

async function subscribe() {
  const res = await request(t.app)
    .post('/api/v1/webhook-endpoints')
    .set(auth())
    .send({ url: receiver.url, event_types: ['sample.created'] });
  return res.body as { id: string; secret: string };
}

async function push(code: string) {
  await request(t.app)
    .post('/api/v1/samples')
    .set(auth())
    .send({ sample_code: code, instrument_id: lab.foundry.id, method_id: lab.feMethod.id, burns: [{ values: { Mn: 0.7 } }] })
    .expect(201);
}

const log = async (endpointId: string, query: Record<string, string> = {}) =>
  (await request(t.app).get(`/api/v1/webhook-endpoints/${endpointId}/deliveries`).query(query).set(auth())).body.data as {
    id: string;
    status: string;
    attempts: number;
    event_id: string;
  }[];

describe('the delivery log', () => {
  it('lists every attempt, then sends a failed delivery again on request with the same webhook-id', async () => {
    status = 500;
    const endpoint = await subscribe();
    await push('K24-5000-F1');
    await expect.poll(async () => (await log(endpoint.id, { status: 'failed' })).length).toBe(1);
    const [failed] = await log(endpoint.id);
    const detail = (await request(t.app).get(`/api/v1/webhook-deliveries/${failed.id}`).set(auth())).body;
    expect(detail).toMatchObject({
      status: 'failed',
      attempts: 2,
      last_status_code: 500,
      next_attempt_at: null,
      event_type: 'sample.created',
    });
    expect(detail.attempt_log).toMatchObject([
      { number: 1, status_code: 500, outcome: 'retry', response_excerpt: 'receiver says no', error: null },
      { number: 2, status_code: 500, outcome: 'failed', next_attempt_at: null },
    ]);
    expect(detail.attempt_log[0].next_attempt_at).not.toBeNull();
    expect(detail.attempt_log[0].duration_ms).toBeGreaterThan(0);

    status = 200;
    const retried = await request(t.app).post(`/api/v1/webhook-deliveries/${failed.id}/retry`).set(auth());
    expect(retried.status).toBe(202);
    await expect.poll(async () => (await log(endpoint.id))[0].status).toBe('delivered');
    const sent = receiver.received.filter((r) => r.headers['webhook-id'] === failed.event_id);
    expect(sent).toHaveLength(3);
    await request(t.app).delete(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth()).expect(204);
  });

  it('recovers every delivery that failed since a time', async () => {
    status = 503;
    const endpoint = await subscribe();
    const since = new Date().toISOString();
    await push('K24-5001-F1');
    await push('K24-5002-F1');
    await expect.poll(async () => (await log(endpoint.id, { status: 'failed' })).length).toBe(2);
    status = 204;
    const res = await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/recover`).set(auth()).send({ since });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ requeued: 2 });
    await expect.poll(async () => (await log(endpoint.id, { status: 'delivered' })).length).toBe(2);
    expectProblem(
      await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/recover`).set(auth()).send({ since: '2999-01-01T00:00:00Z' }),
      400,
    );
    await request(t.app).delete(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth()).expect(204);
  });

  it('sends a signed meltwire.test event to one endpoint, outside the feed', async () => {
    status = 200;
    const endpoint = await subscribe();
    const before = receiver.received.length;
    const res = await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/test`).set(auth());
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ event_type: 'meltwire.test', status: 'pending' });
    const got = (await receiver.waitFor(before + 1))[before];
    expect(got.headers['webhook-id']).toBe(res.body.event_id);
    expect(JSON.parse(got.body)).toMatchObject({ type: 'meltwire.test', data: { endpoint_id: endpoint.id } });
    expectProblem(await request(t.app).get(`/api/v1/events/${res.body.event_id}`).set(auth()), 404);
    const feed = await request(t.app).get('/api/v1/events').query({ limit: 500 }).set(auth());
    expect(feed.body.data.map((e: { id: string }) => e.id)).not.toContain(res.body.event_id);

    await request(t.app).patch(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth()).send({ enabled: false });
    expectProblem(await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/test`).set(auth()), 409);
  });

  it('disables an endpoint whose every attempt has failed for five days, and tells its owner', async () => {
    status = 500;
    const endpoint = await subscribe();
    const sixDaysAgo = new Date(Date.now() - 6 * 24 * 3_600_000).toISOString();
    await t.db('webhook_endpoints').where({ id: endpoint.id }).update({ failing_since: sixDaysAgo });
    await push('K24-5003-F1');
    await expect
      .poll(async () => (await request(t.app).get(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth())).body.enabled)
      .toBe(false);
    const mail = await waitForMail(t.smtp, (m) => m.to.includes(owner.email) && m.subject.includes('disabled'));
    expect(mail.text).toContain('failed for 5 days');
    const enabled = await request(t.app).patch(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth()).send({ enabled: true });
    expect(enabled.body).toMatchObject({ enabled: true, disabled_reason: null, failing_since: null });
    await request(t.app).delete(`/api/v1/webhook-endpoints/${endpoint.id}`).set(auth()).expect(204);
  });

  it('answers 404 for unknown endpoints and deliveries', async () => {
    expectProblem(await request(t.app).get('/api/v1/webhook-endpoints/whe_nope/deliveries').set(auth()), 404);
    expectProblem(await request(t.app).get('/api/v1/webhook-deliveries/whd_nope').set(auth()), 404);
    expectProblem(await request(t.app).post('/api/v1/webhook-deliveries/whd_nope/retry').set(auth()), 404);
  });
});
