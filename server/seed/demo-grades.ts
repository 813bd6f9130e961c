// The demo's grades: published limits with where they were read (docs/references.md#grade-limits).
// Real labs enter their own from licensed copies of the standards; every source note says so.
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { gradeCodeKey, insertGradeVersion } from '../domain/grades/grades.repository.ts';
import { CreateGradeRequestSchema } from '../domain/grades/grades.schemas.ts';
import { newId } from '../lib/ids.ts';
import { nowIso } from '../lib/time.ts';

const VERIFY = 'Verify against your licensed copy of the standard before relying on it.';
const limits = (text: string) =>
  text.split(', ').map((part) => {
    const [element, range] = part.split(' ');
    const [min, max] = range.includes('–') ? range.split('–') : [undefined, range];
    return { element, ...(min ? { min } : {}), max };
  });

const DEMO_GRADES = [
  {
    code: 'SAE 1045',
    title: 'Medium-carbon steel (long products)',
    standard: 'SAE J403',
    matrix: 'Fe',
    decision_rule: 'rounding',
    limits: limits('C 0.43–0.50, Mn 0.60–0.90, P 0.040, S 0.050'),
    aims: limits('C 0.44–0.48'),
    source_note: `SAE J403, read in an excerpt. ${VERIFY}`,
  },
  {
    code: 'SAE 1018',
    title: 'Low-carbon steel',
    standard: 'SAE J403',
    matrix: 'Fe',
    decision_rule: 'rounding',
    limits: limits('C 0.15–0.20, Mn 0.60–0.90, P 0.040, S 0.050'),
    source_note: `From memory, not read in the standard. ${VERIFY}`,
  },
  {
    code: 'UNS S30400',
    title: 'Austenitic stainless steel 304',
    standard: 'ASTM A240',
    edition: 'older edition',
    matrix: 'Fe',
    decision_rule: 'rounding',
    limits: limits('C 0.08, Mn 2.00, P 0.045, S 0.030, Si 0.75, Cr 18.0–20.0, Ni 8.0–10.5, N 0.10'),
    source_note: `ASTM A240, an older edition (read); newer editions differ. ${VERIFY}`,
  },
  {
    code: 'AA 6061',
    title: 'Wrought aluminium alloy 6061',
    standard: 'Aluminum Association registration',
    matrix: 'Al',
    decision_rule: 'rounding',
    remainder_element: 'Al',
    limits: limits('Si 0.40–0.8, Fe 0.7, Cu 0.15–0.40, Mn 0.15, Mg 0.8–1.2, Cr 0.04–0.35, Zn 0.25, Ti 0.15'),
    others_each: '0.05',
    others_total: '0.15',
    source_note: `Read in secondary reproductions of the registration. ${VERIFY}`,
  },
  {
    code: 'AA 6063',
    title: 'Wrought aluminium alloy 6063',
    standard: 'Aluminum Association registration',
    matrix: 'Al',
    decision_rule: 'rounding',
    remainder_element: 'Al',
    limits: limits('Si 0.20–0.6, Fe 0.35, Cu 0.10, Mn 0.10, Mg 0.45–0.9, Cr 0.10, Zn 0.10, Ti 0.10'),
    others_each: '0.05',
    others_total: '0.15',
    source_note: `Read in secondary reproductions of the registration. ${VERIFY}`,
  },
  {
    code: 'C36000',
    title: 'Free-cutting brass',
    standard: 'ASTM B16',
    matrix: 'Cu',
    decision_rule: 'rounding',
    remainder_element: 'Zn',
    limits: limits('Cu 60.0–63.0, Pb 2.5–3.0, Fe 0.35'),
    source_note: `ASTM B16 (read). ${VERIFY}`,
  },
];

export async function seedDemoGrades(db: Db): Promise<void> {
  const now = nowIso();
  await inTransaction(db, async (trx) => {
    for (const grade of DEMO_GRADES) {
      const { code, ...definition } = CreateGradeRequestSchema.parse(grade);
      await insertGradeVersion(trx, {
        id: newId('grd'),
        code,
        code_key: gradeCodeKey(code),
        version: 1,
        matrix: definition.matrix,
        definition_json: JSON.stringify(definition),
        created_by_label: 'demo seed',
        created_at: now,
      });
    }
  });
}
