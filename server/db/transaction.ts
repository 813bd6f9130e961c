// One way to query and to transact: every repository function takes a Queryable (the database or an
// open transaction), and every service opens its transaction with inTransaction().
import type { Knex } from 'knex';

/** The database or an open transaction: what every repository function takes. */
export type Queryable = Knex | Knex.Transaction;

/** A transaction, as services hand it to repositories. */
export type Transaction = Knex.Transaction;

/**
 * Runs fn in a transaction, reusing the caller's when db already is one, so that services compose:
 * a service called inside another's transaction joins it instead of opening a second one (which on
 * SQLite, with its single pooled connection, would wait for the first forever).
 */
export function inTransaction<T>(db: Queryable, fn: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  if (db.isTransaction) return fn(db as Knex.Transaction);
  return db.transaction(fn);
}
