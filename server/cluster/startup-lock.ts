// Nodes starting at once on one PostgreSQL take turns to migrate and seed: the first holds a
// session advisory lock on a connection of its own while it works; the others wait for it and
// then find nothing left to do. (knex's own migration lock makes a second node fail instead of
// wait.) SQLite has one process per file: nothing to wait for.
import type { Db } from '../db/knex.ts';
import { isPostgres } from '../db/dialect.ts';

/** Any fixed number; the same on every node. */
const STARTUP_LOCK = 7_305_318_401;

interface PgConnection {
  query(text: string, values?: unknown[]): Promise<unknown>;
}

export async function withStartupLock<T>(db: Db, work: () => Promise<T>): Promise<T> {
  if (!isPostgres(db)) return work();
  const connection = (await db.client.acquireConnection()) as PgConnection;
  try {
    await connection.query('select pg_advisory_lock($1)', [STARTUP_LOCK]);
    try {
      return await work();
    } finally {
      await connection.query('select pg_advisory_unlock($1)', [STARTUP_LOCK]);
    }
  } finally {
    await db.client.releaseConnection(connection);
  }
}
