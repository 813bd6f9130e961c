// bulkInsert inside a SQLite transaction runs synchronous prepared statements; on a large insert it
// still lets the event loop run in between, and every row arrives.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { bulkInsert } from '../../server/db/bulk-insert.ts';
import { createDb, type Db } from '../../server/db/knex.ts';
import { inTransaction } from '../../server/db/transaction.ts';

let db: Db;
beforeEach(async () => {
  db = createDb({ databaseFile: ':memory:' });
  await db.schema.createTable('rows', (table) => {
    table.integer('n').primary();
    table.text('payload');
  });
});
afterEach(() => db.destroy());

describe('bulkInsert in a SQLite transaction', () => {
  it('gives the event loop a turn during a large insert and stores every row', async () => {
    const rows = Array.from({ length: 50_000 }, (_, n) => ({ n, payload: `row ${n} `.repeat(20) }));
    const order: string[] = [];
    const inserting = inTransaction(db, async (trx) => {
      setTimeout(() => order.push('timer'), 0);
      await bulkInsert(trx, 'rows', rows);
      order.push('inserted');
    });
    await inserting;
    expect(order).toEqual(['timer', 'inserted']);
    expect(Number((await db('rows').count({ n: '*' }))[0].n)).toBe(rows.length);
  });
});
