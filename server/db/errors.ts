// Database error shapes that callers turn into domain answers, for both SQLite and PostgreSQL.

/** A UNIQUE or PRIMARY KEY constraint refused the row. */
export function isUniqueViolation(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  // better-sqlite3 reports SQLITE_CONSTRAINT_PRIMARYKEY / _UNIQUE; PostgreSQL reports SQLSTATE 23505.
  return code === 'SQLITE_CONSTRAINT_PRIMARYKEY' || code === 'SQLITE_CONSTRAINT_UNIQUE' || code === '23505';
}
