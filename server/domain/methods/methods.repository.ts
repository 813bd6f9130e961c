// The only code that touches the methods table.
import type { OutputUnit } from '../chemistry/units.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Queryable } from '../../db/transaction.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import { DEFAULT_DRIFT_LIMITS, DEFAULT_REPORTING, type DriftLimits, type MethodReporting } from './methods.schemas.ts';

export interface MethodElement {
  element: string;
  decimals: number;
  working_range_low: string | null;
  working_range_high: string | null;
  detection_limit: string | null;
  repeatability_sd: string | null;
}

export interface MethodRow {
  id: string;
  code: string;
  name: string;
  matrix: string;
  default_unit: OutputUnit;
  elements_json: string;
  /** DriftLimits as JSON; null = DEFAULT_DRIFT_LIMITS. */
  drift_limits_json?: string | null;
  /** MethodReporting as JSON; null = DEFAULT_REPORTING. */
  reporting_json?: string | null;
  created_at: string;
  updated_at: string;
}

export interface Method extends Omit<MethodRow, 'elements_json' | 'drift_limits_json' | 'reporting_json'> {
  elements: MethodElement[];
  drift_limits: DriftLimits;
  reporting: MethodReporting;
}

function toMethod(row: MethodRow): Method {
  const { elements_json, drift_limits_json, reporting_json, ...rest } = row;
  return {
    ...rest,
    elements: JSON.parse(elements_json) as MethodElement[],
    // Limits and rules added later default one by one, so a stored subset stays valid.
    drift_limits: { ...DEFAULT_DRIFT_LIMITS, ...(drift_limits_json ? (JSON.parse(drift_limits_json) as Partial<DriftLimits>) : {}) },
    reporting: { ...DEFAULT_REPORTING, ...(reporting_json ? (JSON.parse(reporting_json) as Partial<MethodReporting>) : {}) },
  };
}

function toMethodRow(method: Method): MethodRow {
  const { elements, drift_limits, reporting, ...rest } = method;
  return {
    ...rest,
    elements_json: JSON.stringify(elements),
    drift_limits_json: JSON.stringify(drift_limits),
    reporting_json: JSON.stringify(reporting),
  };
}

export async function findMethod(db: Queryable, id: string): Promise<Method | undefined> {
  const row = await db<MethodRow>('methods').where({ id }).first();
  return row && toMethod(row);
}

export function findMethodByCode(db: Queryable, code: string): Promise<MethodRow | undefined> {
  return db<MethodRow>('methods').whereRaw('lower(code) = ?', [code.toLowerCase()]).first();
}

export async function insertMethod(db: Queryable, method: Method): Promise<void> {
  await db<MethodRow>('methods').insert(toMethodRow(method));
}

export async function updateMethodRow(db: Queryable, method: Method): Promise<void> {
  await db<MethodRow>('methods').where({ id: method.id }).update(toMethodRow(method));
}

const METHOD_KEYSET: KeysetColumn<MethodRow>[] = [{ column: 'code', order: 'asc', key: 'code', valueOf: (row) => row.code }];

/** Methods ordered by code. */
export async function listMethods(db: Queryable, filters: { matrix?: string }, page: PageRequest): Promise<Page<Method>> {
  const query = db<MethodRow>('methods');
  if (filters.matrix) query.where('matrix', filters.matrix);
  return mapPage(await keysetPage(query, METHOD_KEYSET, page), toMethod);
}
