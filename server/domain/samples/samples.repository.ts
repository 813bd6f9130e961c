// The only code that touches the samples and burns tables.
import { bulkInsert } from '../../db/bulk-insert.ts';
import type { ElementResult } from '../chemistry/element-result.ts';
import type { Unit } from '../chemistry/units.ts';
import type { Knex } from 'knex';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

/** A canonical burn value: exact % decimal string and qualifier. */
export interface StoredCell {
  v: string | null;
  q: '<' | '>' | 'nd' | null;
}

/** The value as received, kept for traceability. Stored only where it differs from the
 * canonical value (another unit, another spelling such as "0,75" or "n.d."): otherwise the
 * canonical % string is the received text. */
export interface RawCell {
  raw: string;
  unit: Unit;
}

/** One element's result as stored: the computed result (mass fractions in %), the mean before
 * drift correction, and the reporting decimals it was computed with. */
export interface StoredResult extends ElementResult {
  raw_mean: string | null;
  decimals: number;
}

export interface SampleRow {
  id: string;
  sample_code: string;
  heat: string | null;
  grade: string | null;
  kind: string | null;
  instrument_id: string;
  method_id: string;
  fields_json: string;
  status: 'draft' | 'released';
  source: 'push' | 'import';
  import_id: string | null;
  first_line: number | null;
  results_json: string;
  flags_json: string;
  /** SampleCorrection as JSON (server/domain/drift/correction-timeline.ts); null = no correction applied. */
  correction_json: string | null;
  /** The GradeEvaluation against the grade named, with the version used; null when the grade is not defined. */
  conformance_json: string | null;
  conforms: 'true' | 'false' | 'undecided' | null;
  /** Who created the sample or last changed its burns (an API key's owner); null for the demo seed. */
  changed_by_user_id: string | null;
  released_by_user_id: string | null;
  released_by_label: string | null;
  released_at: string | null;
  release_comment: string | null;
  /** Released although it did not conform (or could not be judged): a concession. */
  concession: boolean;
  revision: number;
  created_by_label: string;
  created_at: string;
  updated_at: string;
}

export interface SampleRowWithRefs extends SampleRow {
  instrument_code: string;
  method_code: string;
  burn_count: number | string;
}

export interface BurnRow {
  id: string;
  sample_id: string;
  burn_number: number;
  measured_at: string | null;
  values_json: string;
  raw_json: string;
  excluded: boolean | number;
  exclusion_reason: string | null;
  excluded_by: string | null;
  excluded_at: string | null;
  source_line: number | null;
  /** The correction set applied to this burn, and its values after correction (values_json shape). */
  correction_set_id: string | null;
  corrected_json: string | null;
}

/** A new sample's row, with its prepared documents when they were made with it (prepared-documents.ts). */
export type NewSampleRow = SampleRow & { summary_doc?: string; detail_doc?: string; doc_key?: string };

export async function insertSamples(db: Queryable, samples: NewSampleRow[], burns: BurnRow[]): Promise<void> {
  await bulkInsert(db, 'samples', samples as unknown as Record<string, unknown>[]);
  await bulkInsert(db, 'burns', burns as unknown as Record<string, unknown>[]);
}

/** Every column of SampleRow: the prepared documents (prepared-documents.repository.ts) are left out. */
const SAMPLE_COLUMNS: (keyof SampleRow)[] = [
  'id',
  'sample_code',
  'heat',
  'grade',
  'kind',
  'instrument_id',
  'method_id',
  'fields_json',
  'status',
  'source',
  'import_id',
  'first_line',
  'results_json',
  'flags_json',
  'correction_json',
  'conformance_json',
  'conforms',
  'changed_by_user_id',
  'released_by_user_id',
  'released_by_label',
  'released_at',
  'release_comment',
  'concession',
  'revision',
  'created_by_label',
  'created_at',
  'updated_at',
];

function withRefs(db: Queryable) {
  return db<SampleRow>('samples')
    .join('instruments', 'instruments.id', 'samples.instrument_id')
    .join('methods', 'methods.id', 'samples.method_id')
    .select<SampleRowWithRefs[]>(
      ...SAMPLE_COLUMNS.map((column) => `samples.${column}`),
      'instruments.code as instrument_code',
      'methods.code as method_code',
      db.raw('(select count(*) from burns where burns.sample_id = samples.id) as burn_count'),
    );
}

export function findSample(db: Queryable, id: string): Promise<SampleRowWithRefs | undefined> {
  return withRefs(db).where('samples.id', id).first();
}

/** The samples with these ids, in no particular order. */
export function findSamplesByIds(db: Queryable, ids: string[]): Promise<SampleRowWithRefs[]> {
  return withRefs(db).whereIn('samples.id', ids);
}

/** The burns of these samples, by sample and burn number. */
export function findBurnsOfSamples(db: Queryable, sampleIds: string[]): Promise<BurnRow[]> {
  return db<BurnRow>('burns').whereIn('sample_id', sampleIds).orderBy(['sample_id', 'burn_number']);
}

export function findBurns(db: Queryable, sampleId: string): Promise<BurnRow[]> {
  return db<BurnRow>('burns').where({ sample_id: sampleId }).orderBy('burn_number');
}

export async function updateBurn(db: Queryable, id: string, changes: Partial<BurnRow>): Promise<void> {
  await db<BurnRow>('burns').where({ id }).update(changes);
}

export async function updateSampleResults(
  db: Queryable,
  id: string,
  changes: Pick<SampleRow, 'results_json' | 'flags_json' | 'updated_at'> &
    Partial<Pick<SampleRow, 'correction_json' | 'conformance_json' | 'conforms' | 'changed_by_user_id'>>,
): Promise<void> {
  await db<SampleRow>('samples').where({ id }).update(changes);
}

/** Draft samples naming a grade (any case): their verdicts follow the grade's latest version. */
export function findDraftSamplesOfGrade(
  db: Queryable,
  gradeCode: string,
): Promise<Pick<SampleRow, 'id' | 'sample_code' | 'heat' | 'grade' | 'instrument_id' | 'results_json' | 'conforms'>[]> {
  return db<SampleRow>('samples')
    .select('id', 'sample_code', 'heat', 'grade', 'instrument_id', 'results_json', 'conforms')
    .where('status', 'draft')
    .whereRaw('lower(grade) = ?', [gradeCode.trim().toLowerCase()]);
}

export async function markSampleReleased(
  db: Queryable,
  id: string,
  release: Pick<SampleRow, 'released_by_user_id' | 'released_by_label' | 'released_at' | 'release_comment' | 'concession' | 'updated_at'>,
): Promise<void> {
  await db<SampleRow>('samples')
    .where({ id, status: 'draft' })
    .update({ ...release, status: 'released' });
}

/** An amendment's changes to a released sample: its identity, results and verdict, and the next revision. */
export async function updateAmendedSample(
  db: Queryable,
  id: string,
  changes: Pick<
    SampleRow,
    'heat' | 'grade' | 'fields_json' | 'results_json' | 'flags_json' | 'conformance_json' | 'conforms' | 'revision' | 'updated_at'
  >,
): Promise<void> {
  await db<SampleRow>('samples').where({ id, status: 'released' }).update(changes);
}

export async function updateSampleConformance(
  db: Queryable,
  id: string,
  changes: Pick<SampleRow, 'conformance_json' | 'conforms' | 'updated_at'>,
): Promise<void> {
  await db<SampleRow>('samples').where({ id }).update(changes);
}

export interface SampleFilters {
  heat?: string;
  grade?: string;
  sample_code?: string;
  instrument_id?: string;
  method_id?: string;
  import_id?: string;
  status?: string;
  kind?: string;
  exclude_kind?: string;
  flag?: string;
  conforms?: 'true' | 'false' | 'undecided';
  created_from?: string;
  created_to?: string;
  updated_since?: string;
  onlyInstrumentIds?: string[] | null;
}

export type SampleOrder = 'created_desc' | 'updated_asc';

/** Keyset orders of sample lists; they read only what every sample row has (id and times). */
export const SAMPLE_KEYSETS: Record<SampleOrder, KeysetColumn<Pick<SampleRow, 'id' | 'created_at' | 'updated_at'>>[]> = {
  created_desc: [
    { column: 'samples.created_at', order: 'desc', key: 't', valueOf: (row) => row.created_at },
    { column: 'samples.id', order: 'desc', key: 'id', valueOf: (row) => row.id },
  ],
  updated_asc: [
    { column: 'samples.updated_at', order: 'asc', key: 't', valueOf: (row) => row.updated_at },
    { column: 'samples.id', order: 'asc', key: 'id', valueOf: (row) => row.id },
  ],
};

/** The filters of GET /samples, the one place they are turned into SQL: lists, counts and exports share it. */
export function whereSamples(query: Knex.QueryBuilder, filters: SampleFilters): Knex.QueryBuilder {
  if (filters.heat) query.where('samples.heat', filters.heat);
  if (filters.grade) query.where('samples.grade', filters.grade);
  if (filters.sample_code) query.where('samples.sample_code', filters.sample_code);
  if (filters.instrument_id) query.where('samples.instrument_id', filters.instrument_id);
  if (filters.method_id) query.where('samples.method_id', filters.method_id);
  if (filters.import_id) query.where('samples.import_id', filters.import_id);
  if (filters.status) query.where('samples.status', filters.status);
  if (filters.kind) query.where('samples.kind', filters.kind);
  const excluded = filters.exclude_kind;
  if (excluded) query.where((q) => q.whereNull('samples.kind').orWhereNot('samples.kind', excluded));
  if (filters.flag) query.where('samples.flags_json', 'like', `%${JSON.stringify(filters.flag)}%`);
  if (filters.conforms) query.where('samples.conforms', filters.conforms);
  if (filters.created_from) query.where('samples.created_at', '>=', filters.created_from);
  if (filters.created_to) query.where('samples.created_at', '<', filters.created_to);
  if (filters.updated_since) query.where('samples.updated_at', '>=', filters.updated_since);
  if (filters.onlyInstrumentIds) query.whereIn('samples.instrument_id', filters.onlyInstrumentIds);
  return query;
}

/** Filtered samples in a stable order. */
export function listSampleRows(
  db: Queryable,
  filters: SampleFilters,
  order: SampleOrder,
  page: PageRequest,
): Promise<Page<SampleRowWithRefs>> {
  return keysetPage<SampleRowWithRefs>(whereSamples(withRefs(db), filters), SAMPLE_KEYSETS[order], { ...page, order });
}

/** How many samples match the filters. */
export async function countSampleRows(db: Queryable, filters: SampleFilters): Promise<number> {
  const [row] = await whereSamples(db<SampleRow>('samples'), filters).count({ n: '*' });
  return Number(row.n);
}

export type SampleColumnsRow = Pick<SampleRow, 'id' | 'results_json' | 'fields_json' | 'created_at' | 'updated_at'>;

/** The same samples in the same order as listSampleRows, with only what names their results and fields. */
export function listSampleColumnRows(
  db: Queryable,
  filters: SampleFilters,
  order: SampleOrder,
  page: PageRequest,
): Promise<Page<SampleColumnsRow>> {
  const query = db<SampleRow>('samples').select('id', 'results_json', 'fields_json', 'created_at', 'updated_at');
  return keysetPage<SampleColumnsRow>(whereSamples(query, filters), SAMPLE_KEYSETS[order], { ...page, order });
}
