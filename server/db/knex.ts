// The one Knex instance factory: SQLite (embedded default) or PostgreSQL when DATABASE_URL is set.
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import Database from 'better-sqlite3';
import knexFactory, { type Knex } from 'knex';
import type { Config } from '../config.ts';
import { cacheStatements } from './statement-cache.ts';

export type Db = Knex;

/** `schema` (PostgreSQL only) isolates a database in its own schema: the tests use it. */
export function createDb(config: Pick<Config, 'databaseFile' | 'databaseUrl'>, options: { schema?: string } = {}): Db {
  if (config.databaseUrl) {
    return knexFactory({
      client: 'pg',
      connection: config.databaseUrl,
      pool: { min: 0, max: 10 },
      ...(options.schema ? { searchPath: [options.schema] } : {}),
    });
  }
  const filename = config.databaseFile;
  if (filename !== ':memory:') mkdirSync(dirname(filename), { recursive: true });
  return knexFactory({
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    pool: {
      afterCreate(connection: Database.Database, done: (error: Error | null, connection: unknown) => void) {
        cacheStatements(connection);
        connection.pragma('journal_mode = WAL');
        connection.pragma('foreign_keys = ON');
        connection.pragma('busy_timeout = 5000');
        connection.pragma('synchronous = NORMAL');
        done(null, connection);
      },
    },
  });
}

/**
 * A SQLite file is pinged on a short-lived read-only connection of its own: the pool's single
 * connection stays with a write transaction for as long as it runs (a large import: a second or
 * more), and WAL lets a second connection read meanwhile. In-memory databases use the pool.
 */
function sqliteFileOf(db: Db): string | undefined {
  const config = db.client.config as Knex.Config;
  const filename = (config.connection as { filename?: string } | undefined)?.filename;
  return config.client === 'better-sqlite3' && filename && filename !== ':memory:' ? filename : undefined;
}

/** True when the database answers a query that reads it. */
export async function pingDb(db: Db): Promise<boolean> {
  try {
    const file = sqliteFileOf(db);
    if (!file) {
      await db.raw('select 1 as ok');
      return true;
    }
    const probe = new Database(file, { readonly: true, fileMustExist: true, timeout: 200 });
    try {
      probe.prepare('select count(*) as n from sqlite_master').get();
    } finally {
      probe.close();
    }
    return true;
  } catch {
    return false;
  }
}
