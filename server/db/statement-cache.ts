// Knex hands better-sqlite3 every query as SQL text, and better-sqlite3 compiles it again each
// time (about a tenth of a request's CPU in a profile of GET /samples/{id}). The same few
// statements run on every request, so each connection keeps its most recent compiled ones.
// A compiled statement survives schema changes (SQLite recompiles it when the schema moved on),
// and Knex runs each one to completion (all/run) before the next, so sharing one is safe.
import type { Database, Statement } from 'better-sqlite3';

/** Distinct SQL texts kept per connection; lists with IN (…) of varying length make new texts. */
const CACHED_STATEMENTS = 500;

export function cacheStatements(connection: Database): void {
  const compile = connection.prepare.bind(connection);
  const cache = new Map<string, Statement>();
  connection.prepare = ((source: string) => {
    let statement = cache.get(source);
    if (statement) {
      // Most recently used last, so the oldest is the first key.
      cache.delete(source);
    } else {
      statement = compile(source);
      if (cache.size >= CACHED_STATEMENTS) cache.delete(cache.keys().next().value!);
    }
    cache.set(source, statement);
    return statement;
  }) as Database['prepare'];
}
