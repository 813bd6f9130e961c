// Database error shapes that callers turn into domain answers, for both SQLite and PostgreSQL.

/** A UNIQUE or PRIMARY KEY constraint refused the row. */
export function isUniqueViolation(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  // better-sqlite3 reports SQLITE_CONSTRAINT_PRIMARYKEY / _UNIQUE; PostgreSQL reports SQLSTATE 23505.
  return code === 'SQLITE_CONSTRAINT_PRIMARYKEY' || code === 'SQLITE_CONSTRAINT_UNIQUE' || code === '23505';
}

/**
 * PostgreSQL refused a value the request carried: a NUL character or a byte sequence it cannot
 * store (22021, 22P05), text longer than its column (22001), a number out of range (22003).
 * SQLite stores all of these, so only PostgreSQL raises them.
 */
export function isUnstorableValue(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return code === '22021' || code === '22P05' || code === '22001' || code === '22003';
}
