// The only code that touches the sample_revisions table. Revisions are appended, never changed.
import type { Queryable } from '../../db/transaction.ts';

export interface ElementChange {
  element: string;
  before: string | null;
  after: string | null;
}

export interface RevisionRow {
  id: string;
  sample_id: string;
  revision: number;
  document_json: string;
  reason: string | null;
  changes_json: string;
  created_by_label: string;
  created_at: string;
}

export async function insertRevision(db: Queryable, row: RevisionRow): Promise<void> {
  await db<RevisionRow>('sample_revisions').insert(row);
}

export function findRevision(db: Queryable, sampleId: string, revision: number): Promise<RevisionRow | undefined> {
  return db<RevisionRow>('sample_revisions').where({ sample_id: sampleId, revision }).first();
}

/** Oldest first, without the documents. */
export function listRevisions(db: Queryable, sampleId: string): Promise<Omit<RevisionRow, 'document_json'>[]> {
  return db<RevisionRow>('sample_revisions')
    .select('id', 'sample_id', 'revision', 'reason', 'changes_json', 'created_by_label', 'created_at')
    .where({ sample_id: sampleId })
    .orderBy('revision');
}
