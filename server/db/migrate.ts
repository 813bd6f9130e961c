import type { Knex } from 'knex';
import { migrations } from '../../migrations/index.ts';
import type { Db } from './knex.ts';

const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};

/** Applies pending migrations; returns the names applied in this run. */
export async function migrateLatest(db: Db): Promise<string[]> {
  const [, applied] = (await db.migrate.latest({ migrationSource })) as [number, string[]];
  return applied;
}

export async function rollbackAll(db: Db): Promise<void> {
  await db.migrate.rollback({ migrationSource }, true);
}
