// Two workers on one database (two API nodes): each delivery is claimed by one of them, so every
// event reaches the receiver exactly once. On PostgreSQL this is FOR UPDATE SKIP LOCKED at work
// (run with TEST_DATABASE_URL); on SQLite the single writer serialises the claims.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, issueKey, seedDemoLab, type TestApp } from '../../helpers/test-app.ts';
import { startReceiver } from '../../helpers/webhook-receiver.ts';

let t: TestApp;
let lab: DemoLab;
let key: string;

beforeAll(async () => {
  t = await createTestApp({ webhookAllowPrivate: true });
  lab = await seedDemoLab(t.db);
  key = (await issueKey(t, ['samples:write', 'webhooks:write'])).secret;
});
afterAll(() => t.close());

describe('several workers', () => {
  it('deliver every event once between them', async () => {
    const receiver = await startReceiver(4361);
    const workers = [
      startDeliveryWorker(t.ctx, { pollMs: 20, concurrency: 4 }),
      startDeliveryWorker(t.ctx, { pollMs: 20, concurrency: 4 }),
    ];
    try {
      const auth = { authorization: `Bearer ${key}` };
      await request(t.app)
        .post('/api/v1/webhook-endpoints')
        .set(auth)
        .send({ url: receiver.url, event_types: ['sample.created'] })
        .expect(201);
      const samples = Array.from({ length: 40 }, (_, i) => ({
        sample_code: `K24-4${String(i).padStart(3, '0')}-F1`,
        instrument_id: lab.foundry.id,
        method_id: lab.feMethod.id,
        burns: [{ values: { Mn: 0.7 } }],
      }));
      for (let i = 0; i < samples.length; i += 10) {
        await request(t.app)
          .post('/api/v1/samples/batch')
          .set(auth)
          .send({ samples: samples.slice(i, i + 10) })
          .expect(201);
      }
      const got = await receiver.waitFor(40);
      await new Promise((resolve) => setTimeout(resolve, 300));
      expect(receiver.received).toHaveLength(40);
      expect(new Set(got.map((r) => r.headers['webhook-id'])).size).toBe(40);
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
      await receiver.close();
    }
  });
});
