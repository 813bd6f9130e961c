// The feed never skips an event when transactions commit out of order (PostgreSQL only: SQLite
// has one writer, so a later sequence cannot commit first). Two real transactions are interleaved
// on the same database as the app; the feed is read over HTTP.
import type { Knex } from 'knex';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { recordEvent } from '../../../server/domain/events/events.repository.ts';
import { createTestApp, issueKey, type TestApp } from '../../helpers/test-app.ts';

const postgres = Boolean(process.env.TEST_DATABASE_URL);

let t: TestApp;
let reader: string;

beforeAll(async () => {
  if (!postgres) return;
  t = await createTestApp();
  reader = (await issueKey(t, ['events:read'])).secret;
});
afterAll(() => t?.close());

async function feedAfter(after: string | null) {
  const res = await request(t.app)
    .get('/api/v1/events')
    .query(after ? { after } : {})
    .set({ authorization: `Bearer ${reader}` });
  expect(res.status).toBe(200);
  return res.body as { data: { sequence: number; data: { n: string } }[]; next_cursor: string | null };
}

/** What is ready can lag while another test's transaction is open on the same cluster: wait for it. */
async function eventually(after: string | null, expected: string[]) {
  let page = await feedAfter(after);
  await vi.waitFor(
    async () => {
      page = await feedAfter(after);
      expect(page.data.map((e) => e.data.n)).toEqual(expected);
    },
    { timeout: 5000, interval: 50 },
  );
  return page;
}

const record = (trx: Knex.Transaction, n: string) => recordEvent(trx, 'sample.created', { n });

describe.skipIf(!postgres)('the feed under out-of-order commits (PostgreSQL)', () => {
  it('holds back event 2 while the transaction holding event 1 is open, then returns 1 then 2', async () => {
    const start = (await feedAfter(null)).next_cursor;
    const t1 = await t.db.transaction();
    const t2 = await t.db.transaction();
    try {
      await record(t1, 'one');
      await record(t2, 'two');
      await t2.commit();

      const early = await feedAfter(start);
      expect(early.data).toEqual([]);
      expect(early.next_cursor).toBe(start);

      await t1.commit();
      const later = await eventually(start, ['one', 'two']);
      expect(later.data[0].sequence).toBeLessThan(later.data[1].sequence);
    } finally {
      if (!t1.isCompleted()) await t1.rollback();
      if (!t2.isCompleted()) await t2.rollback();
    }
  });

  it('never skips the event of a transaction that began later but took its sequence earlier', async () => {
    // X gets its transaction id first but records its event last; Y records first and commits last.
    // Ordering by sequence alone would hand out X's event and then never Y's, which sorts before it.
    const start = (await feedAfter(null)).next_cursor;
    const x = await t.db.transaction();
    const y = await t.db.transaction();
    try {
      await x.raw('select pg_current_xact_id()');
      await y.raw('select pg_current_xact_id()');
      await record(y, 'y');
      await record(x, 'x');
      await x.commit();

      const first = await eventually(start, ['x']);

      await y.commit();
      const second = await eventually(first.next_cursor, ['y']);
      expect(second.data[0].sequence).toBeLessThan(first.data[0].sequence);
    } finally {
      if (!x.isCompleted()) await x.rollback();
      if (!y.isCompleted()) await y.rollback();
    }
  });

  it('moves past an event whose transaction rolled back', async () => {
    const start = (await feedAfter(null)).next_cursor;
    const lost = await t.db.transaction();
    await record(lost, 'lost');
    const kept = await t.db.transaction();
    await record(kept, 'kept');
    await kept.commit();
    expect((await feedAfter(start)).data).toEqual([]);
    await lost.rollback();
    await eventually(start, ['kept']);
  });
});
