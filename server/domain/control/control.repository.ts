// The only code that touches the control_* tables.
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export interface ControlSampleRow {
  id: string;
  instrument_id: string;
  method_id: string;
  code: string;
  description: string;
  kind: string;
  elements_json: string;
  rules_json: string;
  baseline_n: number;
  created_at: string;
  updated_at: string;
}

export interface ControlLimitRow {
  id: string;
  control_sample_id: string;
  element: string;
  centre: string;
  sd: string;
  source: string;
  valid_from: string;
  created_by_label: string;
  created_at: string;
}

export interface ControlPointRow {
  sample_id: string;
  control_sample_id: string;
  measured_at: string;
}

export interface ControlStatusRow {
  id: string;
  instrument_id: string;
  method_id: string;
  status: 'verify' | 'in_control';
  control_sample_id: string | null;
  sample_id: string | null;
  measured_at: string | null;
  violations_json: string | null;
  cause: string | null;
  action: string | null;
  created_by_label: string;
  created_at: string;
}

export function findControlSample(db: Queryable, id: string): Promise<ControlSampleRow | undefined> {
  return db<ControlSampleRow>('control_samples').where({ id }).first();
}

export function findControlSampleByCode(
  db: Queryable,
  instrumentId: string,
  methodId: string,
  code: string,
): Promise<ControlSampleRow | undefined> {
  return db<ControlSampleRow>('control_samples')
    .where({ instrument_id: instrumentId, method_id: methodId })
    .whereRaw('lower(code) = ?', [code.toLowerCase()])
    .first();
}

export function controlSamplesOf(db: Queryable, instrumentId: string, methodId: string): Promise<ControlSampleRow[]> {
  return db<ControlSampleRow>('control_samples').where({ instrument_id: instrumentId, method_id: methodId });
}

export async function insertControlSample(db: Queryable, row: ControlSampleRow): Promise<void> {
  await db<ControlSampleRow>('control_samples').insert(row);
}

export async function updateControlSampleRow(db: Queryable, id: string, changes: Partial<ControlSampleRow>): Promise<void> {
  await db<ControlSampleRow>('control_samples').where({ id }).update(changes);
}

const KEYSET: KeysetColumn<ControlSampleRow>[] = [
  { column: 'code', order: 'asc', key: 'code', valueOf: (row) => row.code },
  { column: 'id', order: 'asc', key: 'id', valueOf: (row) => row.id },
];

export function listControlSampleRows(
  db: Queryable,
  filters: { onlyInstrumentIds?: string[] | null; instrumentId?: string },
  page: PageRequest,
): Promise<Page<ControlSampleRow>> {
  const query = db<ControlSampleRow>('control_samples');
  if (filters.onlyInstrumentIds) query.whereIn('instrument_id', filters.onlyInstrumentIds);
  if (filters.instrumentId) query.where({ instrument_id: filters.instrumentId });
  return keysetPage(query, KEYSET, page);
}

export function limitsOf(db: Queryable, controlSampleId: string): Promise<ControlLimitRow[]> {
  return db<ControlLimitRow>('control_limits').where({ control_sample_id: controlSampleId }).orderBy(['element', 'valid_from', 'id']);
}

export async function insertLimits(db: Queryable, rows: ControlLimitRow[]): Promise<void> {
  if (rows.length) await db<ControlLimitRow>('control_limits').insert(rows);
}

export async function insertControlPoints(db: Queryable, rows: ControlPointRow[]): Promise<void> {
  if (rows.length) await db<ControlPointRow>('control_points').insert(rows);
}

export function findControlPoint(db: Queryable, sampleId: string): Promise<ControlPointRow | undefined> {
  return db<ControlPointRow>('control_points').where({ sample_id: sampleId }).first();
}

/** The points of a definition in measurement order, with each sample's stored results. */
export function pointsWithResults(
  db: Queryable,
  controlSampleId: string,
): Promise<{ sample_id: string; sample_code: string; measured_at: string; results_json: string }[]> {
  return db('control_points as p')
    .join('samples as s', 's.id', 'p.sample_id')
    .where('p.control_sample_id', controlSampleId)
    .orderBy([{ column: 'p.measured_at' }, { column: 'p.sample_id' }])
    .select('p.sample_id', 's.sample_code', 'p.measured_at', 's.results_json');
}

export function statusHistory(db: Queryable, instrumentId: string, methodId?: string): Promise<ControlStatusRow[]> {
  const query = db<ControlStatusRow>('control_status_changes').where({ instrument_id: instrumentId });
  if (methodId) query.where({ method_id: methodId });
  return query.orderBy([
    { column: 'created_at', order: 'desc' },
    { column: 'id', order: 'desc' },
  ]);
}

export async function insertStatusChange(db: Queryable, row: ControlStatusRow): Promise<void> {
  await db<ControlStatusRow>('control_status_changes').insert(row);
}

export async function latestPointAt(db: Queryable, controlSampleId: string): Promise<string | null> {
  const row = await db('control_points').where({ control_sample_id: controlSampleId }).max({ at: 'measured_at' }).first();
  return (row?.at as string | null | undefined) ?? null;
}

/** When the first burn of a sample was sparked, if the instrument said. */
export async function firstBurnMeasuredAt(db: Queryable, sampleId: string): Promise<string | null> {
  const row = await db('burns').where({ sample_id: sampleId }).whereNotNull('measured_at').min({ at: 'measured_at' }).first();
  return (row?.at as string | null | undefined) ?? null;
}
