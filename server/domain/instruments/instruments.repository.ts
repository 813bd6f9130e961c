// The only code that touches the instruments table.
import type { Knex } from 'knex';

type Queryable = Knex | Knex.Transaction;

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

export function listInstrumentRows(db: Queryable, filters: { afterCode?: string; onlyIds?: string[] | null; limit: number }) {
  const query = db<InstrumentRow>('instruments')
    .orderBy('code')
    .limit(filters.limit + 1);
  if (filters.afterCode) query.where('code', '>', filters.afterCode);
  if (filters.onlyIds) query.whereIn('id', filters.onlyIds);
  return query;
}
