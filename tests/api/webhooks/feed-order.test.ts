// The webhooks and the pull feed carry the same events in the same order. Attempts are started in
// feed order; with several in flight to one endpoint (the default) they may arrive in another
// order, so each body carries the event's feed `sequence`; with one in flight they arrive in feed
// order as they are.
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import { createTestApp, issueKey, seedDemoLab } from '../../helpers/test-app.ts';
import { startReceiver } from '../../helpers/webhook-receiver.ts';

const SAMPLES = 30;
const cleanups: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
});

/** A fresh app and receiver; pushes SAMPLES samples and returns what arrived and what the feed says. */
async function deliverAndRead(port: number, perEndpoint: number | undefined) {
  const t = await createTestApp({ webhookAllowPrivate: true, webhookRetryDelays: [0, 0, 0] });
  cleanups.push(() => t.close());
  const lab = await seedDemoLab(t.db);
  const key = (await issueKey(t, ['samples:write', 'webhooks:write', 'events:read'])).secret;
  const bearer = { authorization: `Bearer ${key}` };
  const receiver = await startReceiver(port);
  cleanups.push(() => receiver.close());
  const worker = startDeliveryWorker(t.ctx, { pollMs: 50, perEndpoint });
  cleanups.push(() => worker.stop());

  const feedBefore = (await request(t.app).get('/api/v1/events?limit=500').set(bearer)).body as { next_cursor: string | null };
  const endpoint = await request(t.app)
    .post('/api/v1/webhook-endpoints')
    .set(bearer)
    .send({ url: receiver.url, event_types: ['sample.created'] });
  expect(endpoint.status).toBe(201);
  for (let i = 1; i <= SAMPLES; i++) {
    const pushed = await request(t.app)
      .post('/api/v1/samples')
      .set(bearer)
      .send({ sample_code: `ORD-${i}`, instrument_id: lab.foundry.id, method_id: lab.feMethod.id, burns: [{ values: { C: 0.2 } }] });
    expect(pushed.status).toBe(201);
  }
  const arrived = (await receiver.waitFor(SAMPLES, 10_000)).map((r) => {
    const body = JSON.parse(r.body) as { sequence: number; data: { sample_code: string } };
    return { id: String(r.headers['webhook-id']), sequence: body.sequence, code: body.data.sample_code };
  });
  const after = feedBefore.next_cursor ? `&after=${feedBefore.next_cursor}` : '';
  const feed = await request(t.app).get(`/api/v1/events?types=sample.created&limit=500${after}`).set(bearer);
  expect(feed.status).toBe(200);
  const feedEvents = (feed.body.data as { id: string; sequence: number; data: { sample_code: string } }[]).map((e) => ({
    id: e.id,
    sequence: e.sequence,
    code: e.data.sample_code,
  }));
  return { arrived, feedEvents };
}

describe('webhooks and the pull feed', () => {
  it('carry the same events, and the bodies put them back in feed order (default: several in flight)', async () => {
    const { arrived, feedEvents } = await deliverAndRead(4343, undefined);
    expect(feedEvents.map((e) => e.code)).toEqual(Array.from({ length: SAMPLES }, (_, i) => `ORD-${i + 1}`));
    expect([...arrived].sort((a, b) => a.sequence - b.sequence)).toEqual(feedEvents);
  });

  it('arrive in feed order as they are with one attempt in flight per endpoint', async () => {
    const { arrived, feedEvents } = await deliverAndRead(4344, 1);
    expect(arrived).toEqual(feedEvents);
  });
});
