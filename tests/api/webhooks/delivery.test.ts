// Delivery end to end on the real app and a real SQLite database, to local receivers: a pushed
// sample arrives signed within a second; failed attempts are retried with one stable webhook-id;
// 410 disables the endpoint; Retry-After is honoured; redirects are not followed; both signatures
// are sent during a secret rotation.
import { createHmac } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDeliveryWorker, type DeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, issueKey, seedDemoLab, type TestApp } from '../../helpers/test-app.ts';
import { type Received, startReceiver } from '../../helpers/webhook-receiver.ts';

let t: TestApp;
let lab: DemoLab;
let worker: DeliveryWorker;
let key: string;
const bearer = () => ({ authorization: `Bearer ${key}` });

beforeAll(async () => {
  t = await createTestApp({ webhookAllowPrivate: true, webhookRetryDelays: [0, 0, 0] });
  lab = await seedDemoLab(t.db);
  key = (await issueKey(t, ['samples:write', 'samples:read', 'webhooks:write', 'webhooks:read', 'events:read'])).secret;
  worker = startDeliveryWorker(t.ctx, { pollMs: 50 });
});
afterAll(async () => {
  await worker.stop();
  await t.close();
});

async function subscribe(url: string, types = ['sample.created']) {
  const res = await request(t.app).post('/api/v1/webhook-endpoints').set(bearer()).send({ url, event_types: types });
  expect(res.status).toBe(201);
  return res.body as { id: string; secret: string };
}

async function push(code: string) {
  const res = await request(t.app)
    .post('/api/v1/samples')
    .set(bearer())
    .send({ sample_code: code, instrument_id: lab.foundry.id, method_id: lab.feMethod.id, burns: [{ values: { Mn: 0.75, C: 0.45 } }] });
  expect(res.status).toBe(201);
  return res.body as { id: string };
}

/** Verified here with node:crypto directly, as a receiver would, not with the server's signer. */
function signaturesOf(received: Received, secret: string): boolean {
  const id = String(received.headers['webhook-id']);
  const timestamp = String(received.headers['webhook-timestamp']);
  const expected = createHmac('sha256', Buffer.from(secret.slice('whsec_'.length), 'base64'))
    .update(`${id}.${timestamp}.${received.body}`)
    .digest('base64');
  return String(received.headers['webhook-signature'])
    .split(' ')
    .some((part) => part === `v1,${expected}`);
}

const deliveriesOf = (endpointId: string) => t.db('webhook_deliveries').where({ endpoint_id: endpointId });

describe('webhook delivery', () => {
  it('delivers a pushed sample as a signed sample.created within a second', async () => {
    const receiver = await startReceiver(4331);
    try {
      const endpoint = await subscribe(receiver.url);
      const started = Date.now();
      const sample = await push('K24-2000-F1');
      const [got] = await receiver.waitFor(1, 1000);
      expect(got.at - started).toBeLessThan(1000);
      expect(signaturesOf(got, endpoint.secret)).toBe(true);
      expect(Math.abs(Number(got.headers['webhook-timestamp']) - Date.now() / 1000)).toBeLessThan(300);
      expect(got.headers['content-type']).toBe('application/json');
      const body = JSON.parse(got.body);
      const detail = await request(t.app).get(`/api/v1/samples/${sample.id}`).set(bearer());
      expect(body).toEqual({ type: 'sample.created', timestamp: expect.any(String), sequence: expect.any(Number), data: detail.body });

      // The same event as the pull feed, under the same id.
      const event = await request(t.app).get(`/api/v1/events/${got.headers['webhook-id']}`).set(bearer());
      expect(event.body).toMatchObject({ type: 'sample.created', occurred_at: body.timestamp, sequence: body.sequence, data: detail.body });
    } finally {
      await receiver.close();
    }
  });

  it('retries a receiver that fails its first two attempts, with one stable webhook-id', async () => {
    const receiver = await startReceiver(4332, (n) =>
      n <= 2 ? { status: n === 1 ? 500 : 503, body: 'down for maintenance' } : { status: 200 },
    );
    try {
      const endpoint = await subscribe(receiver.url);
      await push('K24-2001-F1');
      const got = await receiver.waitFor(3);
      expect(new Set(got.map((r) => r.headers['webhook-id'])).size).toBe(1);
      expect(got.every((r) => signaturesOf(r, endpoint.secret))).toBe(true);
      expect(new Set(got.map((r) => r.body)).size).toBe(1);
      await expect.poll(async () => (await deliveriesOf(endpoint.id))[0]?.status).toBe('delivered');
      const [delivery] = await deliveriesOf(endpoint.id);
      const attempts = await t.db('webhook_attempts').where({ delivery_id: delivery.id }).orderBy('number');
      expect(attempts.map((a) => [a.status_code, a.outcome])).toEqual([
        [500, 'retry'],
        [503, 'retry'],
        [200, 'delivered'],
      ]);
      expect(attempts[0].response_excerpt).toBe('down for maintenance');
    } finally {
      await receiver.close();
    }
  });

  it('gives up after the last delay, and disables the endpoint when the receiver answers 410', async () => {
    const failing = await startReceiver(4333, () => ({ status: 500 }));
    const gone = await startReceiver(4334, () => ({ status: 410 }));
    try {
      const a = await subscribe(failing.url);
      const b = await subscribe(gone.url);
      await push('K24-2002-F1');
      await failing.waitFor(3);
      await expect.poll(async () => (await deliveriesOf(a.id))[0]?.status).toBe('failed');
      expect((await deliveriesOf(a.id))[0].attempt_count).toBe(3);
      await expect.poll(async () => (await request(t.app).get(`/api/v1/webhook-endpoints/${b.id}`).set(bearer())).body.enabled).toBe(false);
      const endpoint = (await request(t.app).get(`/api/v1/webhook-endpoints/${b.id}`).set(bearer())).body;
      expect(endpoint.disabled_reason).toContain('410');
      expect(gone.received).toHaveLength(1);
      await push('K24-2003-F1');
      await failing.waitFor(6);
      expect(gone.received).toHaveLength(1);
      await request(t.app).patch(`/api/v1/webhook-endpoints/${a.id}`).set(bearer()).send({ enabled: false });
    } finally {
      await failing.close();
      await gone.close();
    }
  });

  it('honours Retry-After on 429', async () => {
    const receiver = await startReceiver(4335, (n) => (n === 1 ? { status: 429, headers: { 'retry-after': '1' } } : { status: 204 }));
    try {
      await subscribe(receiver.url);
      await push('K24-2004-F1');
      const got = await receiver.waitFor(2, 4000);
      expect(got[1].at - got[0].at).toBeGreaterThanOrEqual(950);
    } finally {
      await receiver.close();
    }
  });

  it('does not follow a redirect', async () => {
    const target = await startReceiver(4336);
    const redirecting = await startReceiver(4337, () => ({ status: 307, headers: { location: target.url } }));
    try {
      const endpoint = await subscribe(redirecting.url);
      await push('K24-2005-F1');
      await expect.poll(async () => (await deliveriesOf(endpoint.id))[0]?.status).toBe('failed');
      expect(redirecting.received).toHaveLength(1);
      expect(target.received).toHaveLength(0);
      expect((await deliveriesOf(endpoint.id))[0].last_status_code).toBe(307);
    } finally {
      await target.close();
      await redirecting.close();
    }
  });

  it('signs with both secrets, space-separated, during a rotation', async () => {
    const receiver = await startReceiver(4338);
    try {
      const endpoint = await subscribe(receiver.url);
      const rotated = await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).set(bearer()).send({});
      await push('K24-2006-F1');
      const [got] = await receiver.waitFor(1);
      expect(String(got.headers['webhook-signature']).split(' ')).toHaveLength(2);
      expect(signaturesOf(got, endpoint.secret)).toBe(true);
      expect(signaturesOf(got, rotated.body.secret)).toBe(true);
    } finally {
      await receiver.close();
    }
  });

  it('sends each subscriber only the types it asked for', async () => {
    const receiver = await startReceiver(4339);
    try {
      await subscribe(receiver.url, ['sample.created']);
      for (const code of ['K24-2010-F1', 'K24-2011-F1', 'K24-2012-F1']) await push(code);
      const got = await receiver.waitFor(3);
      expect(got.map((r) => JSON.parse(r.body).data.sample_code).sort()).toEqual(['K24-2010-F1', 'K24-2011-F1', 'K24-2012-F1']);
      expect(got.every((r) => JSON.parse(r.body).type === 'sample.created')).toBe(true);
    } finally {
      await receiver.close();
    }
  });
});
