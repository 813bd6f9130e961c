// A sample's verdict against the grade it names, from its results: the drift-corrected mean at
// full precision (rounded once, by the grade's rule), or the reported bound of a qualified result.
// A result that reports nothing (withheld, conflicting, outside the method) counts as not measured,
// and a balance computed by difference is left to the grade's own remainder rule.
import type { Queryable } from '../../db/transaction.ts';
import type { MeasuredValue } from '../chemistry/measured-value.ts';
import { evaluateComposition } from './grade-evaluation.ts';
import { findLatestGrade, type StoredGrade } from './grades.repository.ts';

export type ConformsColumn = 'true' | 'false' | 'undecided';

interface ResultForConformance {
  element: string;
  mean: string | null;
  reported: string | null;
  qualifier: '<' | '>' | null;
  flags: readonly string[];
}

export interface SampleConformance {
  conformance_json: string | null;
  conforms: ConformsColumn | null;
}

const NONE: SampleConformance = { conformance_json: null, conforms: null };

function compositionOf(results: readonly ResultForConformance[]): Map<string, MeasuredValue> {
  const composition = new Map<string, MeasuredValue>();
  for (const r of results) {
    if (r.reported === null || r.flags.includes('balance_by_difference')) continue;
    if (r.qualifier) composition.set(r.element, { kind: 'qualified', value: r.reported, qualifier: r.qualifier });
    else if (r.mean !== null) composition.set(r.element, { kind: 'value', value: r.mean, qualifier: null });
  }
  return composition;
}

export function conformanceOf(grade: StoredGrade | undefined, results: readonly ResultForConformance[]): SampleConformance {
  if (!grade) return NONE;
  const evaluation = { grade: { code: grade.code, version: grade.version }, ...evaluateComposition(grade, compositionOf(results)) };
  const conforms: ConformsColumn = evaluation.conforms === null ? 'undecided' : evaluation.conforms ? 'true' : 'false';
  return { conformance_json: JSON.stringify(evaluation), conforms };
}

/** Judges samples inside one transaction, reading each grade once. */
export function conformanceJudge(db: Queryable) {
  const grades = new Map<string, Promise<StoredGrade | undefined>>();
  return async (gradeCode: string | null, results: readonly ResultForConformance[]): Promise<SampleConformance> => {
    if (!gradeCode) return NONE;
    const key = gradeCode.trim().toLowerCase();
    if (!grades.has(key)) grades.set(key, findLatestGrade(db, gradeCode));
    return conformanceOf(await grades.get(key), results);
  };
}
