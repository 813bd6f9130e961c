// examples/webhook-receiver.ts run as an integrator runs it (tsx, its own process) against a live
// server: it is down when the events happen and still gets every one once it starts; a delivery
// sent again is answered but handled once (de-duplicated by webhook-id); a forged request is refused.
// Its lines are compared with the pull feed: the same events.
import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApiKey } from '../../../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../../../server/domain/auth/auth.service.ts';
import { findUserByEmail } from '../../../server/domain/users/users.repository.ts';
import { type DeliveryWorker, startDeliveryWorker } from '../../../server/domain/webhooks/delivery-worker.ts';
import { DEMO_USERS } from '../../../server/seed/demo-users.ts';
import { startLiveServer } from '../../helpers/live-server.ts';

const ROOT = resolve(import.meta.dirname, '../../..');
const RECEIVER_PORT = 4394;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let worker: DeliveryWorker;
let key: string;
let dir: string;

beforeAll(async () => {
  server = await startLiveServer({ console: false, config: { webhookAllowPrivate: true, webhookRetryDelays: [0, 1, 1, 1, 1, 1] } });
  worker = startDeliveryWorker(server.ctx, { pollMs: 100 });
  const admin = await findUserByEmail(server.db, DEMO_USERS[0].email);
  const scopes = ['samples:write', 'samples:read', 'webhooks:write', 'webhooks:read', 'events:read'] as const;
  key = (await createApiKey(server.ctx, sessionAuthContext(admin!, 'receiver-test'), { name: 'receiver', scopes: [...scopes] })).secret;
  dir = mkdtempSync(join(tmpdir(), 'meltwire-receiver-'));
});
afterAll(async () => {
  await worker?.stop();
  await server?.stop();
  rmSync(dir, { recursive: true, force: true });
});

async function api(path: string, body?: unknown) {
  const res = await fetch(`${server.url}/api/v1${path}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> & { data: Record<string, unknown>[] } };
}

/** The cursor after the last event now in the feed; null while the feed is empty. */
async function feedEnd(): Promise<string | null> {
  let cursor: string | null = null;
  for (;;) {
    const { status, body: page } = await api(`/events?limit=500${cursor ? `&after=${cursor}` : ''}`);
    expect(status).toBe(200);
    cursor = page.next_cursor as string | null;
    if (!page.has_more) return cursor;
  }
}

function startExample(secret: string): { child: ChildProcess; lines: string[]; waitForLines(n: number): Promise<void> } {
  const child = spawn(process.execPath, ['--import', 'tsx', 'examples/webhook-receiver.ts'], {
    cwd: ROOT,
    env: { ...process.env, WEBHOOK_SECRET: secret, PORT: String(RECEIVER_PORT), SEEN_FILE: join(dir, 'seen.txt') },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: string[] = [];
  let buffered = '';
  child.stdout!.on('data', (chunk) => {
    buffered += String(chunk);
    const complete = buffered.split('\n');
    buffered = complete.pop()!;
    lines.push(...complete);
  });
  return {
    child,
    lines,
    async waitForLines(n) {
      const deadline = Date.now() + 20_000;
      while (lines.length < n) {
        if (Date.now() > deadline) throw new Error(`the receiver printed ${lines.length} of ${n} lines`);
        await new Promise((r) => setTimeout(r, 50));
      }
    },
  };
}

describe('examples/webhook-receiver.ts', () => {
  it('gets every event sent while it was down, once each, and they are the events of the feed', async () => {
    const endpoint = await api('/webhook-endpoints', { url: `http://127.0.0.1:${RECEIVER_PORT}/hooks`, event_types: ['sample.created'] });
    expect(endpoint.status).toBe(201);
    const secret = String(endpoint.body.secret);
    const feedStart = await feedEnd();
    const [instrument] = (await api('/instruments')).body.data;
    const [method] = (await api('/methods')).body.data.filter((m) => m.code === 'FE-LA');
    const codes = ['RX-001', 'RX-002', 'RX-003', 'RX-004'];
    for (const code of codes) {
      const pushed = await api('/samples', {
        sample_code: code,
        instrument_id: instrument.id,
        method_id: method.id,
        burns: [{ values: { C: 0.2 } }],
      });
      expect(pushed.status).toBe(201);
    }
    // Nobody listens yet: the first attempts fail to connect and are retried.
    const deadline = Date.now() + 10_000;
    const failedAttempts = async () =>
      (await server.db('webhook_deliveries').where({ endpoint_id: endpoint.body.id }).where('attempt_count', '>=', 1)).length;
    while ((await failedAttempts()) < codes.length && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
    expect(await failedAttempts()).toBe(codes.length);

    const receiver = startExample(secret);
    try {
      await receiver.waitForLines(codes.length);
      const feed = (await api(`/events?${feedStart ? `after=${feedStart}&` : ''}types=sample.created&limit=100`)).body.data;
      const printed = receiver.lines.map((line) => line.split('  '));
      expect(printed.map(([id, type, code]) => ({ id, type, code })).sort((a, b) => a.code.localeCompare(b.code))).toEqual(
        feed.map((event) => ({ id: event.id, type: 'sample.created', code: (event.data as { sample_code: string }).sample_code })),
      );

      // Sent again on request: answered, not handled twice.
      const [delivery] = (await api(`/webhook-endpoints/${endpoint.body.id}/deliveries`)).body.data;
      expect((await api(`/webhook-deliveries/${delivery.id}/retry`, {})).status).toBe(202);
      const resentDeadline = Date.now() + 10_000;
      const attemptsOf = async () => (await api(`/webhook-deliveries/${delivery.id}`)).body.attempt_log as { status_code: number }[];
      while ((await attemptsOf()).filter((a) => a.status_code === 204).length < 2 && Date.now() < resentDeadline)
        await new Promise((r) => setTimeout(r, 100));
      expect((await attemptsOf()).filter((a) => a.status_code === 204)).toHaveLength(2);
      expect(receiver.lines).toHaveLength(codes.length);
      expect(readFileSync(join(dir, 'seen.txt'), 'utf8').trim().split('\n').sort()).toEqual(feed.map((e) => e.id).sort());

      // A request that is not signed with the secret is refused.
      const forged = await fetch(`http://127.0.0.1:${RECEIVER_PORT}/hooks`, {
        method: 'POST',
        headers: { 'webhook-id': 'msg_forged', 'webhook-timestamp': String(Math.floor(Date.now() / 1000)), 'webhook-signature': 'v1,AAAA' },
        body: '{"type":"sample.created","timestamp":"2026-12-03T00:00:00Z","data":{}}',
      });
      expect(forged.status).toBe(400);
      expect(receiver.lines).toHaveLength(codes.length);
    } finally {
      receiver.child.kill('SIGTERM');
    }
  }, 60_000);
});
