// The one Knex instance factory: SQLite (embedded default) or PostgreSQL when DATABASE_URL is set.
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import knexFactory, { type Knex } from 'knex';
import type { Config } from '../config.ts';

export type Db = Knex;

interface SqliteConnection {
  pragma(source: string): unknown;
}

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
      afterCreate(connection: SqliteConnection, done: (error: Error | null, connection: unknown) => void) {
        connection.pragma('journal_mode = WAL');
        connection.pragma('foreign_keys = ON');
        connection.pragma('busy_timeout = 5000');
        connection.pragma('synchronous = NORMAL');
        done(null, connection);
      },
    },
  });
}

/** True when the database answers a trivial query. */
export async function pingDb(db: Db): Promise<boolean> {
  try {
    await db.raw('select 1 as ok');
    return true;
  } catch {
    return false;
  }
}
