// The only code that touches sample_field_definitions.
import type { Queryable } from '../../db/transaction.ts';

export interface SampleFieldRow {
  key: string;
  label: string;
  description: string | null;
  position: number;
  updated_at: string;
}

export function listSampleFieldRows(db: Queryable): Promise<SampleFieldRow[]> {
  return db<SampleFieldRow>('sample_field_definitions').orderBy('position');
}

export async function replaceSampleFieldRows(db: Queryable, rows: SampleFieldRow[]): Promise<void> {
  await db('sample_field_definitions').delete();
  if (rows.length) await db<SampleFieldRow>('sample_field_definitions').insert(rows);
}
