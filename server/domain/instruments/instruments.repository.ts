// The only code that touches the instruments table.
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export interface InstrumentRow {
  id: string;
  code: string;
  name: string;
  site: string;
  created_at: string;
  updated_at: string;
}

export type Instrument = InstrumentRow;

export function findInstrument(db: Queryable, id: string): Promise<InstrumentRow | undefined> {
  return db<InstrumentRow>('instruments').where({ id }).first();
}

export function findInstrumentByCode(db: Queryable, code: string): Promise<InstrumentRow | undefined> {
  return db<InstrumentRow>('instruments').whereRaw('lower(code) = ?', [code.toLowerCase()]).first();
}

export async function insertInstrument(db: Queryable, row: InstrumentRow): Promise<void> {
  await db<InstrumentRow>('instruments').insert(row);
}

export async function updateInstrumentRow(db: Queryable, id: string, changes: Partial<InstrumentRow>): Promise<void> {
  await db<InstrumentRow>('instruments').where({ id }).update(changes);
}

const INSTRUMENT_KEYSET: KeysetColumn<InstrumentRow>[] = [{ column: 'code', order: 'asc', key: 'code', valueOf: (row) => row.code }];

/** Ordered by code. */
export function listInstrumentRows(db: Queryable, filters: { onlyIds?: string[] | null }, page: PageRequest): Promise<Page<InstrumentRow>> {
  const query = db<InstrumentRow>('instruments');
  if (filters.onlyIds) query.whereIn('id', filters.onlyIds);
  return keysetPage(query, INSTRUMENT_KEYSET, page);
}
