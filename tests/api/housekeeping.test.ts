// Retention: request log entries older than REQUEST_LOG_RETENTION_DAYS and expired
// Idempotency-Key records go at start and then every interval, on a timer that never holds the
// process open and stops on shutdown.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startHousekeeping, sweepOnce } from '../../server/housekeeping.ts';
import { newId } from '../../server/lib/ids.ts';
import { createTestApp, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ requestLogRetentionDays: 30 });
});
afterAll(() => t.close());
afterEach(() => vi.restoreAllMocks());

const DAY = 24 * 60 * 60_000;

async function logEntryAged(days: number, db = t.db): Promise<string> {
  const id = newId('req');
  await db('request_log').insert({
    id,
    occurred_at: new Date(Date.now() - days * DAY).toISOString(),
    method: 'GET',
    path: '/api/v1/samples',
    query: '',
    status: 200,
    duration_ms: 1.5,
    caller_type: 'anonymous',
    request_id: id,
    request_headers_json: '{}',
    request_body_kind: 'none',
    request_body_size: 0,
    request_body_truncated: false,
    request_redacted: false,
    response_headers_json: '{}',
    response_body_kind: 'none',
    response_body_size: 0,
    response_body_truncated: false,
  });
  return id;
}

async function idempotencyKeyExpiring(inMs: number): Promise<string> {
  const key = newId('req');
  const now = new Date().toISOString();
  await t.db('idempotency_keys').insert({
    caller: 'user:usr_x',
    idempotency_key: key,
    fingerprint: 'f'.repeat(64),
    method: 'POST',
    path: '/api/v1/users',
    state: 'done',
    status: 201,
    created_at: now,
    locked_at: now,
    expires_at: new Date(Date.now() + inMs).toISOString(),
  });
  return key;
}

const logIds = async () => (await t.db('request_log').pluck('id')) as string[];

describe('housekeeping', () => {
  it('removes log entries past the retention period and expired idempotency keys, keeping the rest', async () => {
    const old = await logEntryAged(31);
    const recent = await logEntryAged(29);
    const expiredKey = await idempotencyKeyExpiring(-1000);
    const liveKey = await idempotencyKeyExpiring(60_000);
    const removed = await sweepOnce(t.ctx);
    expect(removed.requestLog).toBeGreaterThanOrEqual(1);
    expect(await logIds()).toContain(recent);
    expect(await logIds()).not.toContain(old);
    const keys = await t.db('idempotency_keys').pluck('idempotency_key');
    expect(keys).toContain(liveKey);
    expect(keys).not.toContain(expiredKey);
  });

  it("sweeps at start, then on every interval, on an unref'd timer that stop() clears", async () => {
    const setIntervalSpy = vi.spyOn(globalThis, 'setInterval');
    const atStart = await logEntryAged(40);
    const housekeeping = startHousekeeping(t.ctx, 50);
    await housekeeping.firstRun;
    expect(await logIds()).not.toContain(atStart);

    const timer = setIntervalSpy.mock.results[0].value as NodeJS.Timeout;
    expect(timer.hasRef()).toBe(false);

    const later = await logEntryAged(35);
    await vi.waitFor(async () => expect(await logIds()).not.toContain(later), { timeout: 2000, interval: 20 });

    await housekeeping.stop();
    const afterStop = await logEntryAged(50);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(await logIds()).toContain(afterStop);
  });

  it('removes events older than EVENT_RETENTION_DAYS (default 30)', async () => {
    const aged = (days: number) => ({
      id: newId('evt'),
      type: 'sample.created',
      occurred_at: new Date(Date.now() - days * DAY).toISOString(),
      data_json: '{}',
    });
    const [old, recent] = [aged(31), aged(29)];
    await t.db('events').insert([old, recent]);
    expect((await sweepOnce(t.ctx)).events).toBe(1);
    const ids = await t.db('events').pluck('id');
    expect(ids).toContain(recent.id);
    expect(ids).not.toContain(old.id);
  });

  it('follows REQUEST_LOG_RETENTION_DAYS', async () => {
    const short = await createTestApp({ requestLogRetentionDays: 1 });
    try {
      await logEntryAged(2, short.db);
      expect((await sweepOnce(short.ctx)).requestLog).toBe(1);
    } finally {
      await short.close();
    }
  });
});
