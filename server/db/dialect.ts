// The one question repositories may ask about the database: which one it is. Differences stay few
// and named (docs/decisions/0003-sqlite-and-postgresql.md).
import type { Queryable } from './transaction.ts';

export function isPostgres(db: Queryable): boolean {
  return db.client.config.client === 'pg';
}
