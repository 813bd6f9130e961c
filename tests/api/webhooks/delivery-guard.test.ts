// The SSRF guard at connect time, and deliveries that outlive the process: an endpoint saved while
// its name resolved elsewhere is still refused when it resolves to loopback; pending deliveries,
// attempts cut short by a stop and leases left by a crashed worker are all sent after a restart.
import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DeliveryWorker, startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import { newWebhookSecret } from '../../../server/domain/webhooks/signature.ts';
import { insertEndpoint } from '../../../server/domain/webhooks/webhooks.repository.ts';
import { newId } from '../../../server/lib/ids.ts';
import { seedDemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, issueKey, type TestApp } from '../../helpers/test-app.ts';
import { startReceiver } from '../../helpers/webhook-receiver.ts';

async function pushSample(t: TestApp, code: string) {
  const lab = (await t.db('instruments').where({ code: 'OES-1' }).first()) ?? (await seedDemoLab(t.db)).foundry;
  const method = await t.db('methods').where({ code: 'FE-LA' }).first();
  const key = (await issueKey(t, ['samples:write'])).secret;
  const res = await request(t.app)
    .post('/api/v1/samples')
    .set({ authorization: `Bearer ${key}` })
    .send({ sample_code: code, instrument_id: lab.id, method_id: method.id, burns: [{ values: { Mn: 0.7 } }] });
  expect(res.status).toBe(201);
}

/** An endpoint row as if its URL had passed the check when saved (the name resolved elsewhere then). */
async function endpointRow(t: TestApp, url: string) {
  const now = new Date(Date.now() - 1000).toISOString();
  const id = newId('whe');
  await insertEndpoint(t.db, {
    id,
    url,
    description: null,
    event_types_json: JSON.stringify(['sample.created']),
    enabled: true,
    disabled_reason: null,
    secret: newWebhookSecret(),
    previous_secret: null,
    previous_secret_expires_at: null,
    failing_since: null,
    owner_user_id: null,
    created_by_label: 'test',
    created_at: now,
    updated_at: now,
  });
  return id;
}

describe('the SSRF guard at connect time', () => {
  let t: TestApp;
  let worker: DeliveryWorker;
  beforeAll(async () => {
    t = await createTestApp({ webhookAllowPrivate: false, webhookRetryDelays: [0, 0] });
    await seedDemoLab(t.db);
    worker = startDeliveryWorker(t.ctx, { pollMs: 50 });
  });
  afterAll(async () => {
    await worker.stop();
    await t.close();
  });

  it('refuses a name that now resolves to 127.0.0.1 (localhost) and a loopback literal, without connecting', async () => {
    const receiver = await startReceiver(4341);
    try {
      const byName = await endpointRow(t, 'http://localhost:4341/hooks');
      const byAddress = await endpointRow(t, 'http://127.0.0.1:4341/hooks');
      const mapped = await endpointRow(t, 'http://[::ffff:127.0.0.1]:4341/hooks');
      await pushSample(t, 'K24-3000-F1');
      const deliveries = t.db('webhook_deliveries').whereIn('endpoint_id', [byName, byAddress, mapped]);
      await expect.poll(async () => (await deliveries.clone()).map((d) => d.status)).toEqual(['failed', 'failed', 'failed']);
      const errors = Object.fromEntries((await deliveries.clone()).map((d) => [d.endpoint_id, d.last_error]));
      expect(errors[byName]).toMatch(/localhost resolves to (127\.0\.0\.1|::1) \(loopback\)/);
      expect(errors[byAddress]).toContain('127.0.0.1 is a loopback address');
      expect(errors[mapped]).toContain('loopback, inside IPv6');
      // Refused addresses are not retried: one attempt each.
      expect((await deliveries.clone()).map((d) => d.attempt_count)).toEqual([1, 1, 1]);
      expect(receiver.received).toHaveLength(0);
    } finally {
      await receiver.close();
    }
  });
});

describe('deliveries across a restart', () => {
  const dir = mkdtempSync('/tmp/wt-events-restart-');
  const databaseFile = join(dir, 'meltwire.db');
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('sends what was pending, and again what a stop cut short, with the same webhook-id', async () => {
    let answered = 0;
    const receiver = await startReceiver(4342, () => (answered++ === 0 ? { status: 200, hang: true } : { status: 204 }));
    const first = await createTestApp({ databaseFile, webhookAllowPrivate: true });
    await seedDemoLab(first.db);
    await endpointRow(first, receiver.url);
    // No worker yet: the event waits in the database.
    await pushSample(first, 'K24-3001-F1');
    const worker = startDeliveryWorker(first.ctx, { pollMs: 50 });
    await receiver.waitFor(1);
    await worker.stop(); // the first attempt is still waiting for an answer
    await first.close();

    const second = await createTestApp({ databaseFile, webhookAllowPrivate: true });
    const again = startDeliveryWorker(second.ctx, { pollMs: 50 });
    try {
      const got = await receiver.waitFor(2);
      expect(got[1].headers['webhook-id']).toBe(got[0].headers['webhook-id']);
      await expect.poll(async () => (await second.db('webhook_deliveries').first()).status).toBe('delivered');
      // The cut-short attempt left no record; the one that answered did.
      expect(await second.db('webhook_attempts').pluck('status_code')).toEqual([204]);

      // A crashed worker's lease: sent once it runs out.
      await pushSample(second, 'K24-3002-F1');
      await receiver.waitFor(3);
      const [latest] = await second.db('webhook_deliveries').orderBy('id', 'desc').limit(1);
      await second
        .db('webhook_deliveries')
        .where({ id: latest.id })
        .update({
          status: 'pending',
          next_attempt_at: new Date().toISOString(),
          locked_until: new Date(Date.now() + 300).toISOString(),
        });
      await receiver.waitFor(4);
      expect(receiver.received[3].at - receiver.received[2].at).toBeGreaterThanOrEqual(250);
    } finally {
      await again.stop();
      await second.close();
      await receiver.close();
    }
  });
});
