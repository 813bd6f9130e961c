// The only code that touches the reference_materials table.
import type { Unit } from '../chemistry/units.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';

export const REFERENCE_KINDS = ['high', 'low', 'type', 'control'] as const;
export type ReferenceKind = (typeof REFERENCE_KINDS)[number];

/** One certified value: exact % string, plus the value and unit as given. */
export interface NominalValue {
  element: string;
  nominal: string;
  given: string;
  unit: Unit;
}

export interface ReferenceMaterialRow {
  id: string;
  code: string;
  code_key: string;
  name: string;
  matrix: string;
  kind: ReferenceKind;
  values_json: string;
  certificate: string | null;
  created_by_label: string;
  created_at: string;
}

export interface ReferenceMaterial extends Omit<ReferenceMaterialRow, 'values_json' | 'code_key'> {
  values: NominalValue[];
}

export function toReferenceMaterial(row: ReferenceMaterialRow): ReferenceMaterial {
  const { values_json, code_key: _key, ...rest } = row;
  return { ...rest, values: JSON.parse(values_json) as NominalValue[] };
}

export function codeKey(code: string): string {
  return code.trim().toLowerCase();
}

export async function insertReferenceMaterial(db: Queryable, row: ReferenceMaterialRow): Promise<void> {
  await db<ReferenceMaterialRow>('reference_materials').insert(row);
}

export async function findReferenceMaterial(db: Queryable, id: string): Promise<ReferenceMaterial | undefined> {
  const row = await db<ReferenceMaterialRow>('reference_materials').where({ id }).first();
  return row && toReferenceMaterial(row);
}

export function findReferenceMaterialByCode(db: Queryable, code: string): Promise<ReferenceMaterialRow | undefined> {
  return db<ReferenceMaterialRow>('reference_materials')
    .where({ code_key: codeKey(code) })
    .first();
}

export async function findReferenceMaterials(db: Queryable, ids: string[]): Promise<ReferenceMaterial[]> {
  if (ids.length === 0) return [];
  return (await db<ReferenceMaterialRow>('reference_materials').whereIn('id', ids)).map(toReferenceMaterial);
}

const REFERENCE_KEYSET: KeysetColumn<ReferenceMaterialRow>[] = [
  { column: 'code_key', order: 'asc', key: 'code', valueOf: (row) => row.code_key },
];

/** Ordered by code, ignoring case. */
export async function listReferenceMaterials(
  db: Queryable,
  filters: { matrix?: string; kind?: ReferenceKind },
  page: PageRequest,
): Promise<Page<ReferenceMaterial>> {
  const query = db<ReferenceMaterialRow>('reference_materials');
  if (filters.matrix) query.where('matrix', filters.matrix);
  if (filters.kind) query.where('kind', filters.kind);
  return mapPage(await keysetPage(query, REFERENCE_KEYSET, page), toReferenceMaterial);
}

/** Every reference material of one matrix (a lab holds tens of them, not thousands). */
export async function listReferenceMaterialsOfMatrix(db: Queryable, matrix: string): Promise<ReferenceMaterial[]> {
  return (await db<ReferenceMaterialRow>('reference_materials').where({ matrix }).orderBy('code_key')).map(toReferenceMaterial);
}
