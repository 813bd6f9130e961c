// kill -9 while a webhook is being delivered (the receiver holds the request open), then restart:
// the delivery is sent again with the same webhook-id as soon as the server is back, not after the
// lease the dead process held has run out, and it is recorded as delivered once.
import { describe, expect, it } from 'vitest';
import { DELIVERY_TIMEOUT_MS } from '../../../server/domain/webhooks/sender.ts';
import { startReceiver } from '../../helpers/webhook-receiver.ts';
import { readDatabaseFile, signIn, startServerProcess, useTemporaryDatabaseFile } from './server-process.ts';

const PORT = 4392;
const RECEIVER_PORT = 4393;
const database = useTemporaryDatabaseFile('meltwire-crash-delivery-');

async function call(url: string, cookie: string, path: string, body?: unknown) {
  const res = await fetch(`${url}/api/v1${path}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: { cookie, 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

function deliveries() {
  return readDatabaseFile(
    database.file,
    (db) =>
      db.prepare('select status, attempt_count, locked_until from webhook_deliveries').all() as {
        status: string;
        attempt_count: number;
        locked_until: string | null;
      }[],
  );
}

// The server process runs on SQLite (on PostgreSQL a lease runs out instead: another node may hold it).
describe.skipIf(process.env.TEST_DATABASE_URL)('kill -9 during a webhook delivery', () => {
  it('sends the delivery again with the same webhook-id right after the restart, and records it once', async () => {
    // The first request is held open; every later one is answered at once.
    const receiver = await startReceiver(RECEIVER_PORT, (n) => (n === 1 ? { status: 200, hang: true } : { status: 204 }));
    const env = { WEBHOOK_RETRY_DELAYS: '0,0,0' };
    let server = await startServerProcess(database.file, PORT, env);
    try {
      const cookie = await signIn(server.url);
      const endpoint = await call(server.url, cookie, '/webhook-endpoints', { url: receiver.url, event_types: ['sample.created'] });
      expect(endpoint.status).toBe(201);
      const instruments = (await call(server.url, cookie, '/instruments')).body.data as { id: string; code: string }[];
      const methods = (await call(server.url, cookie, '/methods')).body.data as { id: string; code: string }[];
      const pushed = await call(server.url, cookie, '/samples', {
        sample_code: 'CRASH-1',
        instrument_id: instruments.find((i) => i.code === 'OES-1')!.id,
        method_id: methods.find((m) => m.code === 'FE-LA')!.id,
        burns: [{ values: { C: 0.45, Mn: 0.75 } }],
      });
      expect(pushed.status).toBe(201);

      const [first] = await receiver.waitFor(1, 10_000);
      await server.kill();
      expect(deliveries()).toEqual([expect.objectContaining({ status: 'pending', attempt_count: 0, locked_until: expect.any(String) })]);

      const restarted = Date.now();
      server = await startServerProcess(database.file, PORT, env);
      const [, again] = await receiver.waitFor(2, 10_000);
      // Well inside the lease the dead process held (twice the attempt timeout).
      expect(again.at - restarted).toBeLessThan(DELIVERY_TIMEOUT_MS);
      expect(again.headers['webhook-id']).toBe(first.headers['webhook-id']);
      expect(JSON.parse(again.body)).toEqual(JSON.parse(first.body));

      const deadline = Date.now() + 10_000;
      while (deliveries()[0]?.status !== 'delivered' && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      expect(deliveries()).toEqual([expect.objectContaining({ status: 'delivered', attempt_count: 1, locked_until: null })]);
      await new Promise((r) => setTimeout(r, 1000));
      expect(receiver.received).toHaveLength(2);
    } finally {
      await server.stop();
      await receiver.close();
    }
  }, 60_000);
});
