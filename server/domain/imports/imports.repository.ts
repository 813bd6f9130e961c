// The only code that touches the imports table.
import type { ImportReport } from './import-report.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export interface ImportRow {
  id: string;
  instrument_id: string;
  method_id: string;
  profile_id: string | null;
  file_name: string;
  content_type: string;
  size_bytes: number;
  sha256: string;
  content: Buffer;
  mode: 'all_or_nothing' | 'per_sample';
  report_json: string;
  created_by_type: string;
  created_by_id: string | null;
  created_by_label: string;
  created_at: string;
}

export type ImportMeta = Omit<ImportRow, 'content'>;

const META_COLUMNS = [
  'id',
  'instrument_id',
  'method_id',
  'profile_id',
  'file_name',
  'content_type',
  'size_bytes',
  'sha256',
  'mode',
  'report_json',
  'created_by_type',
  'created_by_id',
  'created_by_label',
  'created_at',
] as const;

export function toImport(row: ImportMeta) {
  return {
    id: row.id,
    instrument_id: row.instrument_id,
    method_id: row.method_id,
    profile_id: row.profile_id,
    file: { name: row.file_name, content_type: row.content_type, size_bytes: Number(row.size_bytes), sha256: row.sha256 },
    mode: row.mode,
    report: JSON.parse(row.report_json) as ImportReport,
    created_by: row.created_by_label,
    created_at: row.created_at,
  };
}

export async function insertImport(db: Queryable, row: ImportRow): Promise<void> {
  await db<ImportRow>('imports').insert(row);
}

export function findImportMeta(db: Queryable, id: string): Promise<ImportMeta | undefined> {
  return db<ImportRow>('imports')
    .select(...META_COLUMNS)
    .where({ id })
    .first();
}

export function findImportBySha(db: Queryable, sha256: string): Promise<ImportMeta | undefined> {
  return db<ImportRow>('imports')
    .select(...META_COLUMNS)
    .where({ sha256 })
    .first();
}

export function findImportFile(
  db: Queryable,
  id: string,
): Promise<Pick<ImportRow, 'instrument_id' | 'file_name' | 'content' | 'sha256' | 'report_json'> | undefined> {
  return db<ImportRow>('imports').select('instrument_id', 'file_name', 'content', 'sha256', 'report_json').where({ id }).first();
}

const IMPORT_KEYSET: KeysetColumn<ImportMeta>[] = [{ column: 'id', order: 'desc', key: 'id', valueOf: (row) => row.id }];

/** Newest first (ids sort by creation time). */
export function listImportRows(
  db: Queryable,
  filters: { instrumentId?: string; onlyInstrumentIds?: string[] | null },
  page: PageRequest,
): Promise<Page<ImportMeta>> {
  const query = db<ImportRow>('imports').select(...META_COLUMNS);
  if (filters.instrumentId) query.where('instrument_id', filters.instrumentId);
  if (filters.onlyInstrumentIds) query.whereIn('instrument_id', filters.onlyInstrumentIds);
  return keysetPage(query, IMPORT_KEYSET, page);
}
