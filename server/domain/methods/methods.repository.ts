// The only code that touches the methods table.
import type { Knex } from 'knex';
import type { OutputUnit } from '../chemistry/units.ts';

type Queryable = Knex | Knex.Transaction;

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
  created_at: string;
  updated_at: string;
}

export interface Method extends Omit<MethodRow, 'elements_json'> {
  elements: MethodElement[];
}

export function toMethod(row: MethodRow): Method {
  const { elements_json, ...rest } = row;
  return { ...rest, elements: JSON.parse(elements_json) as MethodElement[] };
}

export function toMethodRow(method: Method): MethodRow {
  const { elements, ...rest } = method;
  return { ...rest, elements_json: JSON.stringify(elements) };
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

export async function listMethods(db: Queryable, filters: { matrix?: string; afterCode?: string; limit: number }): Promise<Method[]> {
  const query = db<MethodRow>('methods').orderBy('code').limit(filters.limit + 1);
  if (filters.matrix) query.where('matrix', filters.matrix);
  if (filters.afterCode) query.where('code', '>', filters.afterCode);
  return (await query).map(toMethod);
}
