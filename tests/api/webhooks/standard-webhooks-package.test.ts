// Real deliveries verified by an independent implementation: the `standardwebhooks` npm package
// (1.1.1, the Standard Webhooks reference library for JavaScript, a devDependency).
import request from 'supertest';
import { Webhook } from 'standardwebhooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DeliveryWorker, startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, issueKey, seedDemoLab, type TestApp } from '../../helpers/test-app.ts';
import { startReceiver } from '../../helpers/webhook-receiver.ts';

let t: TestApp;
let lab: DemoLab;
let worker: DeliveryWorker;

beforeAll(async () => {
  t = await createTestApp({ webhookAllowPrivate: true });
  lab = await seedDemoLab(t.db);
  worker = startDeliveryWorker(t.ctx, { pollMs: 50 });
});
afterAll(async () => {
  await worker?.stop();
  await t?.close();
});

describe('deliveries checked by the standardwebhooks package', () => {
  it('verify, with the current and during a rotation with either secret', async () => {
    const receiver = await startReceiver(4381);
    try {
      const key = (await issueKey(t, ['samples:write', 'webhooks:write'])).secret;
      const auth = { authorization: `Bearer ${key}` };
      const endpoint = (
        await request(t.app)
          .post('/api/v1/webhook-endpoints')
          .set(auth)
          .send({ url: receiver.url, event_types: ['sample.created'] })
      ).body;
      const push = (code: string) =>
        request(t.app)
          .post('/api/v1/samples')
          .set(auth)
          .send({ sample_code: code, instrument_id: lab.foundry.id, method_id: lab.feMethod.id, burns: [{ values: { Mn: 0.7 } }] })
          .expect(201);
      await push('K24-6000-F1');
      // The first delivery must be signed before the rotation: wait for it.
      const [first] = await receiver.waitFor(1);
      const rotated = (await request(t.app).post(`/api/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).set(auth).send({})).body;
      await push('K24-6001-F1');
      const [, second] = await receiver.waitFor(2);
      const headers = (r: typeof first) => Object.fromEntries(Object.entries(r.headers).map(([k, v]) => [k, String(v)]));
      expect(new Webhook(endpoint.secret).verify(first.body, headers(first))).toMatchObject({ type: 'sample.created' });
      expect(() => new Webhook(rotated.secret).verify(first.body, headers(first))).toThrow();
      for (const secret of [endpoint.secret, rotated.secret]) {
        expect(new Webhook(secret).verify(second.body, headers(second))).toMatchObject({ type: 'sample.created' });
      }
      expect(() => new Webhook(endpoint.secret).verify(`${second.body} `, headers(second))).toThrow();
    } finally {
      await receiver.close();
    }
  });
});
