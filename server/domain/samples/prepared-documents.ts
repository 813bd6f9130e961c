// Prepared documents: each sample's API representation in % (its list entry, and the single
// sample with burns and provenance), made when the sample changes and served as stored text.
// A document is served only while its key matches the row as it is now — the representation's
// version, updated_at (every write to a sample sets it) and the instrument and method codes it
// shows — so a write path that does not prepare costs speed, never correctness: the sample is then
// computed afresh. Other units are converted from the stored results on every request.
import { setImmediate as nextTurn } from 'node:timers/promises';
import type { Queryable } from '../../db/transaction.ts';
import { PreparedJson } from '../../lib/prepared-json.ts';
import type { z } from '../../lib/zod.ts';
import { findImportMeta, type ImportMeta } from '../imports/imports.repository.ts';
import type { PageRequest } from '../../db/keyset.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import {
  type DocumentState,
  findPreparedDetail,
  listDocumentStates,
  listPreparedSummaries,
  type PreparedDocuments,
  writePreparedDocuments,
} from './prepared-documents.repository.ts';
import { isSampleVisible } from './sample-access.ts';
import {
  type BurnRow,
  findBurnsOfSamples,
  findSamplesByIds,
  type SampleFilters,
  type SampleOrder,
  type SampleRow,
  type SampleRowWithRefs,
} from './samples.repository.ts';
import type { SampleListSchema, SampleSchema } from './samples.schemas.ts';
import { loadSampleDetail, toSampleExtras, toSampleSummary } from './sample-view.ts';

/**
 * The version of what toSampleSummary and toSampleDetail return. Change it with any change to the
 * representation: documents made under another version are never served (and are prepared again
 * at the next start). tests/api/samples/prepared-documents.test.ts pins a fingerprint to it.
 */
export const DOCUMENT_VERSION = 1;

/** At most this many samples per query while preparing (bound parameters stay well below SQLite's limit). */
const BATCH = 200;

export type SampleListJson = PreparedJson<z.input<typeof SampleListSchema>>;
export type SampleJson = PreparedJson<z.input<typeof SampleSchema>>;

export function documentKey(state: Pick<DocumentState, 'updated_at' | 'instrument_code' | 'method_code'>): string {
  return JSON.stringify([DOCUMENT_VERSION, state.updated_at, state.instrument_code, state.method_code]);
}

/** Whether a stored document may be served for the row as it is now. */
export function isCurrent(state: DocumentState, document: string | null): document is string {
  return document !== null && state.doc_key === documentKey(state);
}

/** The codes a new sample's documents show, by instrument and method id. */
export interface DocumentCodes {
  instrumentCode(id: string): string;
  methodCode(id: string): string;
}

/** The stored columns of a sample about to be inserted (no import: a pushed sample). */
export function documentsOfNewSample(
  sample: SampleRow,
  burns: BurnRow[],
  codes: DocumentCodes,
): Pick<PreparedDocuments, 'summary_doc' | 'detail_doc' | 'doc_key'> {
  const row = {
    ...sample,
    instrument_code: codes.instrumentCode(sample.instrument_id),
    method_code: codes.methodCode(sample.method_id),
    burn_count: burns.length,
  };
  return documentsOf(row, burns, undefined);
}

function documentsOf(
  row: SampleRowWithRefs,
  burns: BurnRow[],
  importMeta: ImportMeta | undefined,
): Pick<PreparedDocuments, 'summary_doc' | 'detail_doc' | 'doc_key'> {
  const summary = JSON.stringify(toSampleSummary(row, '%'));
  const extras = JSON.stringify(toSampleExtras(row, burns, importMeta, '%'));
  // JSON.stringify({ ...summary, ...extras }) without writing the summary twice: its keys, then the extras'.
  return { summary_doc: summary, detail_doc: `${summary.slice(0, -1)},${extras.slice(1)}`, doc_key: documentKey(row) };
}

/** Makes and stores the documents of these samples; returns each one's single-sample text by id. */
export async function prepareSampleDocuments(db: Queryable, ids: string[]): Promise<Map<string, string>> {
  const details = new Map<string, string>();
  for (let i = 0; i < ids.length; i += BATCH) {
    const batch = ids.slice(i, i + BATCH);
    const rows = await findSamplesByIds(db, batch);
    const burns = new Map<string, BurnRow[]>();
    for (const burn of await findBurnsOfSamples(db, batch)) burns.set(burn.sample_id, [...(burns.get(burn.sample_id) ?? []), burn]);
    const imports = new Map<string, ImportMeta | undefined>();
    for (const importId of new Set(rows.map((row) => row.import_id).filter((id) => id !== null)))
      imports.set(importId, await findImportMeta(db, importId));
    const documents: PreparedDocuments[] = rows.map((row) => {
      const prepared = documentsOf(row, burns.get(row.id) ?? [], row.import_id ? imports.get(row.import_id) : undefined);
      details.set(row.id, prepared.detail_doc);
      return { id: row.id, updated_at: row.updated_at, ...prepared };
    });
    await writePreparedDocuments(db, documents);
  }
  return details;
}

/** List entries of these samples computed afresh, by id. */
export async function freshSummaries(db: Queryable, ids: string[]): Promise<Map<string, string>> {
  const rows = ids.length ? await findSamplesByIds(db, ids) : [];
  return new Map(rows.map((row) => [row.id, JSON.stringify(toSampleSummary(row, '%'))]));
}

/** Prepares every sample whose documents are missing or stale (the demo seed, and the back-fill after
 * each start, which also covers renamed instruments and methods); returns how many. */
export async function prepareStaleDocuments(db: Queryable): Promise<number> {
  let prepared = 0;
  let after: string | null = null;
  for (;;) {
    const states = await listDocumentStates(db, after, 1000);
    if (!states.length) return prepared;
    const stale = states.filter((state) => state.doc_key !== documentKey(state)).map((state) => state.id);
    if (stale.length) await prepareSampleDocuments(db, stale);
    prepared += stale.length;
    after = states[states.length - 1].id;
    await nextTurn();
  }
}

/** GET /samples in %: the page assembled from stored list entries (a stale one computed afresh). */
export async function preparedSamplesPage(
  db: Queryable,
  filters: SampleFilters,
  order: SampleOrder,
  page: PageRequest,
): Promise<SampleListJson> {
  const rows = await listPreparedSummaries(db, filters, order, page);
  const fresh = await freshSummaries(
    db,
    rows.data.filter((row) => !isCurrent(row, row.summary_doc)).map((row) => row.id),
  );
  const entries = rows.data.map((row) => fresh.get(row.id) ?? row.summary_doc);
  return new PreparedJson(`{"data":[${entries.join(',')}],"next_cursor":${JSON.stringify(rows.next_cursor)}}`);
}

/** GET /samples/{id} in %: the stored document, or the sample computed afresh when it is stale. */
export async function preparedSampleDetail(db: Queryable, auth: AuthContext, id: string): Promise<SampleJson> {
  const row = await findPreparedDetail(db, id);
  if (row && isSampleVisible(auth, row) && isCurrent(row, row.detail_doc)) return new PreparedJson(row.detail_doc);
  return new PreparedJson(JSON.stringify(await loadSampleDetail(db, auth, id, '%')));
}

const pendingByDb = new WeakMap<Queryable, Set<string>>();

/**
 * Prepares these samples' documents after the current request, a batch at a time (for writes that
 * touch many samples at once: an import, a grade's new version). Until then their reads are
 * computed afresh. A failure (say the server is stopping) only leaves them to the next start.
 */
export function prepareDocumentsSoon(db: Queryable, ids: string[], onError: (error: unknown) => void): void {
  if (!ids.length) return;
  const pending = pendingByDb.get(db);
  if (pending) {
    for (const id of ids) pending.add(id);
    return;
  }
  const queue = new Set(ids);
  pendingByDb.set(db, queue);
  const drain = async () => {
    try {
      while (queue.size) {
        const batch = [...queue].slice(0, BATCH);
        for (const id of batch) queue.delete(id);
        await prepareSampleDocuments(db, batch);
        await nextTurn();
      }
    } catch (error) {
      onError(error);
    } finally {
      pendingByDb.delete(db);
    }
  };
  setImmediate(() => void drain()).unref();
}
