// For tests that kill the server process or run several nodes: the process helpers
// (tests/helpers/server-process.ts), a temporary database file and a direct read of it.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll } from 'vitest';

export { type ServerProcess, signIn, startServerProcess } from '../../helpers/server-process.ts';

/** A SQLite file in a fresh temporary folder for this test file, removed after it. */
export function useTemporaryDatabaseFile(prefix: string): { readonly file: string } {
  const state = { dir: '', file: '' };
  beforeAll(() => {
    state.dir = mkdtempSync(join(tmpdir(), prefix));
    state.file = join(state.dir, 'crash.db');
  });
  afterAll(() => rmSync(state.dir, { recursive: true, force: true }));
  return {
    get file() {
      return state.file;
    },
  };
}

/** Reads the database file directly, as it is on disk, while the server process may be running or dead. */
export function readDatabaseFile<T>(file: string, read: (db: Database.Database) => T): T {
  const db = new Database(file, { readonly: true });
  try {
    return read(db);
  } finally {
    db.close();
  }
}
