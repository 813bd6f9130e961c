// The only code that touches the grade_versions table. Versions are appended, never changed.
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Queryable } from '../../db/transaction.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import type { GradeDefinitionInput } from './grade-types.ts';

export interface GradeVersionRow {
  id: string;
  code: string;
  code_key: string;
  version: number;
  matrix: string;
  definition_json: string;
  created_by_label: string;
  created_at: string;
}

export interface StoredGrade extends GradeDefinitionInput {
  code: string;
  version: number;
  created_by: string;
  created_at: string;
}

export function gradeCodeKey(code: string): string {
  return code.trim().toLowerCase();
}

export function toStoredGrade(row: GradeVersionRow): StoredGrade {
  return {
    code: row.code,
    version: row.version,
    ...(JSON.parse(row.definition_json) as GradeDefinitionInput),
    created_by: row.created_by_label,
    created_at: row.created_at,
  };
}

export async function insertGradeVersion(db: Queryable, row: GradeVersionRow): Promise<void> {
  await db<GradeVersionRow>('grade_versions').insert(row);
}

/** Rows that are the latest version of their grade. */
function latest(db: Queryable) {
  return db<GradeVersionRow>('grade_versions as g').whereRaw(
    'g.version = (select max(v.version) from grade_versions as v where v.code_key = g.code_key)',
  );
}

export async function findLatestGrade(db: Queryable, code: string): Promise<StoredGrade | undefined> {
  const row = await latest(db).where('g.code_key', gradeCodeKey(code)).first();
  return row && toStoredGrade(row);
}

export async function findGradeVersion(db: Queryable, code: string, version: number): Promise<StoredGrade | undefined> {
  const row = await db<GradeVersionRow>('grade_versions')
    .where({ code_key: gradeCodeKey(code), version })
    .first();
  return row && toStoredGrade(row);
}

/** Oldest first. */
export async function listGradeVersions(db: Queryable, code: string): Promise<StoredGrade[]> {
  const rows = await db<GradeVersionRow>('grade_versions')
    .where({ code_key: gradeCodeKey(code) })
    .orderBy('version');
  return rows.map(toStoredGrade);
}

const GRADE_KEYSET: KeysetColumn<GradeVersionRow>[] = [{ column: 'g.code_key', order: 'asc', key: 'code', valueOf: (row) => row.code_key }];

/** The latest version of each grade, ordered by code ignoring case. */
export async function listLatestGrades(db: Queryable, filters: { matrix?: string }, page: PageRequest): Promise<Page<StoredGrade>> {
  const query = latest(db).select('g.*');
  if (filters.matrix) query.where('g.matrix', filters.matrix);
  return mapPage(await keysetPage(query, GRADE_KEYSET, page), toStoredGrade);
}

/** Every grade of a matrix (latest versions), for regrading: a lab has tens, not thousands. */
export async function listLatestGradesOfMatrix(db: Queryable, matrix: string): Promise<StoredGrade[]> {
  const rows = await latest(db).select('g.*').where('g.matrix', matrix).orderBy('g.code_key').limit(1000);
  return rows.map(toStoredGrade);
}
