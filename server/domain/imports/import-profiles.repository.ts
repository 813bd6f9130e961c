// The only code that touches the import_profiles table.
import type { ImportProfileDefinition } from './import-profiles.schemas.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export interface ImportProfileRow {
  id: string;
  name: string;
  name_key: string;
  description: string | null;
  definition_json: string;
  revision: number;
  created_by: string | null;
  created_at: string;
  updated_at: string;
}

export function profileNameKey(name: string): string {
  return name.trim().toLowerCase();
}

export function toImportProfile(row: ImportProfileRow) {
  const definition = JSON.parse(row.definition_json) as ImportProfileDefinition;
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    ...definition,
    // Profiles saved before per-column decisions existed keep none.
    keep_columns: definition.keep_columns ?? [],
    // Profiles saved before time zones existed have none.
    time: { ...definition.time, time_zone: definition.time.time_zone ?? null },
    revision: Number(row.revision),
    created_at: row.created_at,
    updated_at: row.updated_at,
  };
}

export type ImportProfile = ReturnType<typeof toImportProfile>;

export async function insertImportProfile(db: Queryable, row: ImportProfileRow): Promise<void> {
  await db<ImportProfileRow>('import_profiles').insert(row);
}

export function findImportProfile(db: Queryable, id: string): Promise<ImportProfileRow | undefined> {
  return db<ImportProfileRow>('import_profiles').where({ id }).first();
}

export function findImportProfileByName(db: Queryable, name: string): Promise<ImportProfileRow | undefined> {
  return db<ImportProfileRow>('import_profiles')
    .where({ name_key: profileNameKey(name) })
    .first();
}

export async function updateImportProfileRow(db: Queryable, id: string, changes: Partial<ImportProfileRow>): Promise<void> {
  await db<ImportProfileRow>('import_profiles').where({ id }).update(changes);
}

const PROFILE_KEYSET: KeysetColumn<ImportProfileRow>[] = [{ column: 'id', order: 'asc', key: 'id', valueOf: (row) => row.id }];

export function listImportProfileRows(db: Queryable, page: PageRequest): Promise<Page<ImportProfileRow>> {
  return keysetPage(db<ImportProfileRow>('import_profiles'), PROFILE_KEYSET, page);
}
