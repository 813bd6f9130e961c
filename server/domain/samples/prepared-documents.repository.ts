// The only code that touches the samples' prepared documents (summary_doc, detail_doc, doc_key).
import type { Queryable } from '../../db/transaction.ts';
import { keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';
import { SAMPLE_KEYSETS, type SampleFilters, type SampleOrder, type SampleRow, whereSamples } from './samples.repository.ts';

/** What decides whether a stored document may be served: the row's state it must have been made from. */
export interface DocumentState {
  id: string;
  instrument_id: string;
  created_at: string;
  updated_at: string;
  instrument_code: string;
  method_code: string;
  doc_key: string | null;
}

export interface PreparedSummaryRow extends DocumentState {
  summary_doc: string | null;
}

export interface PreparedDetailRow extends DocumentState {
  detail_doc: string | null;
}

export interface PreparedDocuments {
  id: string;
  /** The row's updated_at the documents were made from: they are written only while it still holds. */
  updated_at: string;
  summary_doc: string;
  detail_doc: string;
  doc_key: string;
}

function documentStates(db: Queryable) {
  return db<SampleRow>('samples')
    .join('instruments', 'instruments.id', 'samples.instrument_id')
    .join('methods', 'methods.id', 'samples.method_id')
    .select(
      'samples.id',
      'samples.instrument_id',
      'samples.created_at',
      'samples.updated_at',
      'samples.doc_key',
      'instruments.code as instrument_code',
      'methods.code as method_code',
    );
}

/** The page of GET /samples with each sample's stored list document (same filters and order as listSampleRows). */
export function listPreparedSummaries(
  db: Queryable,
  filters: SampleFilters,
  order: SampleOrder,
  page: PageRequest,
): Promise<Page<PreparedSummaryRow>> {
  const query = documentStates(db).select('samples.summary_doc');
  return keysetPage<PreparedSummaryRow>(whereSamples(query, filters), SAMPLE_KEYSETS[order], { ...page, order });
}

export function findPreparedDetail(db: Queryable, id: string): Promise<PreparedDetailRow | undefined> {
  return documentStates(db).select('samples.detail_doc').where('samples.id', id).first();
}

/** Document states of every sample after `afterId` (by id), `limit` at a time: the back-fill walks them. */
export function listDocumentStates(db: Queryable, afterId: string | null, limit: number): Promise<DocumentState[]> {
  const query = documentStates(db).orderBy('samples.id').limit(limit);
  if (afterId) query.where('samples.id', '>', afterId);
  return query;
}

/** Stores documents, each only if its sample has not changed since they were made. */
export async function writePreparedDocuments(db: Queryable, documents: PreparedDocuments[]): Promise<void> {
  for (const { id, updated_at, ...columns } of documents) {
    await db('samples').where({ id, updated_at }).update(columns);
  }
}
