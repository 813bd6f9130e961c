import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { migrations } from '../../migrations/index.ts';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest, rollbackAll } from '../../server/db/migrate.ts';

describe('migrations', () => {
  it('lists every file in migrations/ exactly once, in name order', () => {
    const files = readdirSync(resolve(import.meta.dirname, '../../migrations'))
      .filter((name) => /^\d{14}_.+\.ts$/.test(name))
      .map((name) => name.replace(/\.ts$/, ''));
    expect(Object.keys(migrations)).toEqual(files.sort());
  });

  it('apply, roll back completely and apply again on SQLite', async () => {
    const db = createDb({ databaseFile: ':memory:' });
    try {
      expect(await migrateLatest(db)).toEqual(Object.keys(migrations));
      await rollbackAll(db);
      const tables = await db('sqlite_master').where({ type: 'table' }).pluck('name');
      const ours = tables.filter((name: string) => !name.startsWith('knex_') && !name.startsWith('sqlite_'));
      expect(ours).toEqual([]);
      expect(await migrateLatest(db)).toHaveLength(Object.keys(migrations).length);
      expect(await migrateLatest(db)).toEqual([]);
    } finally {
      await db.destroy();
    }
  });

  it('turns on WAL, foreign keys and a busy timeout', async () => {
    // WAL needs a file: an in-memory database always answers journal_mode "memory".
    const dir = mkdtempSync(join(tmpdir(), 'meltwire-pragmas-'));
    const db = createDb({ databaseFile: join(dir, 'pragmas.db') });
    try {
      const [{ journal_mode }] = await db.raw('pragma journal_mode');
      const [{ foreign_keys }] = await db.raw('pragma foreign_keys');
      const [{ timeout }] = await db.raw('pragma busy_timeout');
      expect(journal_mode).toBe('wal');
      expect(foreign_keys).toBe(1);
      expect(timeout).toBe(5000);
    } finally {
      await db.destroy();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
