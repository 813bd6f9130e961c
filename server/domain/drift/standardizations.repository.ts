// The only code that touches the standardizations table. A run's measurements and per-element
// corrections are JSON documents in its row; activation fills the activation columns once.
import type { RawCell, StoredCell } from '../samples/samples.repository.ts';
import type { CorrectionMode } from './correction-math.ts';
import type { CorrectionFlag } from './correction-flags.ts';
import type { ReferenceKind } from './reference-materials.repository.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export type StandardizationStatus = 'draft' | 'activated';

/** One reference's part in an element's correction. */
export interface ElementLevel {
  reference_material_id: string;
  code: string;
  kind: ReferenceKind;
  /** Certified value, %; null when the reference gives none for the element. */
  nominal: string | null;
  /** Mean of the reference's numeric burns, %; null when none measured the element. */
  measured: string | null;
  /** Numeric burns behind `measured`. */
  n: number;
}

export interface ElementCorrection {
  element: string;
  /** α as a decimal string; null when the element is not corrected by this set. */
  slope: string | null;
  /** β in %, decimal string; null when the element is not corrected by this set. */
  offset: string | null;
  previous_slope: string | null;
  previous_offset: string | null;
  flag: CorrectionFlag;
  reasons: string[];
  levels: ElementLevel[];
}

export interface StoredMeasurement {
  reference_material: { id: string; code: string; name: string; kind: ReferenceKind };
  burns: { values: Record<string, StoredCell>; raw: Record<string, RawCell> }[];
  /** Mean of the numeric burns per element, %. */
  means: Record<string, string>;
}

export interface StandardizationRow {
  id: string;
  instrument_id: string;
  method_id: string;
  mode: CorrectionMode;
  status: StandardizationStatus;
  flag: CorrectionFlag;
  measured_at: string;
  note: string | null;
  /** { name, sha256 } of the result file the burns were read from; null when typed. */
  source_file_json: string | null;
  measurements_json: string;
  corrections_json: string;
  base_set_id: string | null;
  created_by_label: string;
  created_at: string;
  activated_at: string | null;
  activated_by_label: string | null;
  effective_from: string | null;
  override_reason: string | null;
}

export async function insertStandardization(db: Queryable, row: StandardizationRow): Promise<void> {
  await db<StandardizationRow>('standardizations').insert(row);
}

export function findStandardization(db: Queryable, id: string): Promise<StandardizationRow | undefined> {
  return db<StandardizationRow>('standardizations').where({ id }).first();
}

export async function updateStandardizationActivation(
  db: Queryable,
  id: string,
  changes: Pick<StandardizationRow, 'status' | 'activated_at' | 'activated_by_label' | 'effective_from' | 'override_reason'>,
): Promise<void> {
  await db<StandardizationRow>('standardizations').where({ id }).update(changes);
}

export interface StandardizationRowWithRefs extends StandardizationRow {
  instrument_code: string;
  method_code: string;
}

function withRefs(db: Queryable) {
  return db<StandardizationRow>('standardizations')
    .join('instruments', 'instruments.id', 'standardizations.instrument_id')
    .join('methods', 'methods.id', 'standardizations.method_id')
    .select<StandardizationRowWithRefs[]>('standardizations.*', 'instruments.code as instrument_code', 'methods.code as method_code');
}

export function findStandardizationWithRefs(db: Queryable, id: string): Promise<StandardizationRowWithRefs | undefined> {
  return withRefs(db).where('standardizations.id', id).first();
}

export interface StandardizationFilters {
  instrumentId?: string;
  methodId?: string;
  status?: StandardizationStatus;
  flag?: CorrectionFlag;
  onlyInstrumentIds?: string[] | null;
}

const RUN_KEYSET: KeysetColumn<StandardizationRowWithRefs>[] = [
  { column: 'standardizations.measured_at', order: 'desc', key: 't', valueOf: (row) => row.measured_at },
  { column: 'standardizations.id', order: 'desc', key: 'id', valueOf: (row) => row.id },
];

/** Newest measurement first. */
export function listStandardizationRows(
  db: Queryable,
  filters: StandardizationFilters,
  page: PageRequest,
): Promise<Page<StandardizationRowWithRefs>> {
  const query = withRefs(db);
  if (filters.instrumentId) query.where('standardizations.instrument_id', filters.instrumentId);
  if (filters.methodId) query.where('standardizations.method_id', filters.methodId);
  if (filters.status) query.where('standardizations.status', filters.status);
  if (filters.flag) query.where('standardizations.flag', filters.flag);
  if (filters.onlyInstrumentIds) query.whereIn('standardizations.instrument_id', filters.onlyInstrumentIds);
  return keysetPage(query, RUN_KEYSET, page);
}

/** The activated set with the latest effective_from at or before `at` (the later activation on a tie). */
export function findSetInForce(
  db: Queryable,
  instrumentId: string,
  methodId: string,
  at: string,
): Promise<StandardizationRowWithRefs | undefined> {
  return withRefs(db)
    .where({
      'standardizations.instrument_id': instrumentId,
      'standardizations.method_id': methodId,
      'standardizations.status': 'activated',
    })
    .where('standardizations.effective_from', '<=', at)
    .orderBy([
      { column: 'standardizations.effective_from', order: 'desc' },
      { column: 'standardizations.activated_at', order: 'desc' },
    ])
    .first();
}

/** The latest measured_at among the activated runs of an instrument and method. */
export async function latestActivatedMeasuredAt(db: Queryable, instrumentId: string, methodId: string): Promise<string | null> {
  const row = await db<StandardizationRow>('standardizations')
    .where({ instrument_id: instrumentId, method_id: methodId, status: 'activated' })
    .max({ latest: 'measured_at' })
    .first();
  return (row as { latest?: string | null } | undefined)?.latest ?? null;
}

/** Every activated set of an instrument and method, in the order they take effect: only what a
 * correction timeline needs (every push and import reads it; the measurements are the bulk of a row). */
export function listActivatedRows(
  db: Queryable,
  instrumentId: string,
  methodId: string,
): Promise<Pick<StandardizationRow, 'id' | 'corrections_json' | 'effective_from'>[]> {
  return db<StandardizationRow>('standardizations')
    .select('id', 'corrections_json', 'effective_from')
    .where({ instrument_id: instrumentId, method_id: methodId, status: 'activated' })
    .orderBy([
      { column: 'effective_from', order: 'asc' },
      { column: 'activated_at', order: 'asc' },
    ]);
}

/** The methods an instrument has activated sets for. */
export async function methodsWithActivatedSets(db: Queryable, instrumentId: string): Promise<string[]> {
  const rows = await db<StandardizationRow>('standardizations')
    .where({ instrument_id: instrumentId, status: 'activated' })
    .distinct('method_id');
  return rows.map((r) => r.method_id);
}

/** The latest runs of an instrument (optionally one method), oldest first, for the drift chart. */
export async function listDriftRows(
  db: Queryable,
  filters: { instrumentId: string; methodId?: string; since?: string; until?: string; limit: number },
): Promise<StandardizationRowWithRefs[]> {
  const query = withRefs(db)
    .where('standardizations.instrument_id', filters.instrumentId)
    .orderBy([
      { column: 'standardizations.measured_at', order: 'desc' },
      { column: 'standardizations.id', order: 'desc' },
    ])
    .limit(filters.limit);
  if (filters.methodId) query.where('standardizations.method_id', filters.methodId);
  if (filters.since) query.where('standardizations.measured_at', '>=', filters.since);
  if (filters.until) query.where('standardizations.measured_at', '<', filters.until);
  return (await query).reverse();
}
