// Inserts many rows. Inside a SQLite transaction it runs one prepared better-sqlite3 statement
// per row (a bulk import inserts tens of thousands of rows; Knex compiling multi-row SQL was
// the slowest step). Those statements are synchronous, so every few milliseconds it lets the
// event loop run other requests (the transaction keeps the connection meanwhile). Elsewhere —
// PostgreSQL, or outside a transaction — it uses Knex in chunks.
import { setImmediate as nextTurn } from 'node:timers/promises';
import type { Database } from 'better-sqlite3';
import type { Knex } from 'knex';
import type { Queryable } from './transaction.ts';

type Row = Record<string, unknown>;

const KNEX_CHUNK = 200;
/** Longest stretch of synchronous inserts before the event loop gets a turn. */
const SLICE_MS = 8;

function bindable(value: unknown): unknown {
  if (value === undefined) return null;
  if (typeof value === 'boolean') return value ? 1 : 0;
  return value;
}

export async function bulkInsert(db: Queryable, table: string, rows: Row[]): Promise<void> {
  if (rows.length === 0) return;
  const transaction = db as Knex.Transaction;
  if (transaction.isTransaction && db.client.config.client === 'better-sqlite3') {
    // A transaction's client hands out the transaction's own connection.
    const connection = (await db.client.acquireConnection()) as Database;
    const columns = Object.keys(rows[0]);
    const statement = connection.prepare(
      `insert into "${table}" (${columns.map((c) => `"${c}"`).join(', ')}) values (${columns.map(() => '?').join(', ')})`,
    );
    let sliceStart = performance.now();
    for (let i = 0; i < rows.length; i++) {
      statement.run(columns.map((column) => bindable(rows[i][column])));
      if (i % 32 === 31 && performance.now() - sliceStart > SLICE_MS) {
        await nextTurn();
        sliceStart = performance.now();
      }
    }
    return;
  }
  for (let i = 0; i < rows.length; i += KNEX_CHUNK) await db(table).insert(rows.slice(i, i + KNEX_CHUNK));
}
