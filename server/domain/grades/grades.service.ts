// Grades: create, version, read, evaluate a composition, and find every grade a composition meets.
// A PUT appends a version; verdicts name the version they used. Every change is audited.
import type { AppContext } from '../../context.ts';
import { isUniqueViolation } from '../../db/errors.ts';
import { inTransaction, type Transaction } from '../../db/transaction.ts';
import { prepareDocumentsSoon } from '../samples/prepared-documents.ts';
import { newId } from '../../lib/ids.ts';
import type { Page } from '../../lib/pagination.ts';
import { ConflictProblem, NotFoundProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { decodeResults } from '../samples/results-codec.ts';
import { findDraftSamplesOfGrade, updateSampleConformance } from '../samples/samples.repository.ts';
import { recordOutOfSpec } from '../samples/samples.service.ts';
import { largestElement, parseComposition } from './composition.ts';
import { conformanceOf } from './sample-conformance.ts';
import { evaluateComposition, smallestMargin } from './grade-evaluation.ts';
import type { GradeDefinitionInput } from './grade-types.ts';
import {
  findGradeVersion,
  findLatestGrade,
  gradeCodeKey,
  insertGradeVersion,
  listGradeVersions,
  listLatestGrades,
  listLatestGradesOfMatrix,
  type StoredGrade,
  toStoredGrade,
} from './grades.repository.ts';
import type { CreateGradeRequestSchema, GradeListQuerySchema } from './grades.schemas.ts';

export function listGradesPage(ctx: AppContext, query: z.output<typeof GradeListQuerySchema>): Promise<Page<StoredGrade>> {
  return listLatestGrades(ctx.db, { matrix: query.matrix }, query);
}

export async function getGrade(ctx: AppContext, code: string): Promise<StoredGrade> {
  const grade = await findLatestGrade(ctx.db, code);
  if (!grade) throw new NotFoundProblem(`No grade ${code}.`);
  return grade;
}

export async function getGradeVersions(ctx: AppContext, code: string): Promise<StoredGrade[]> {
  const versions = await listGradeVersions(ctx.db, code);
  if (versions.length === 0) throw new NotFoundProblem(`No grade ${code}.`);
  return versions;
}

export async function getGradeVersion(ctx: AppContext, code: string, version: number): Promise<StoredGrade> {
  const grade = await findGradeVersion(ctx.db, code, version);
  if (!grade) throw new NotFoundProblem(`Grade ${code} has no version ${version}.`);
  return grade;
}

/** Draft samples naming the grade follow its latest version; released ones keep the verdict they were released with. */
async function rejudgeDrafts(trx: Transaction, grade: StoredGrade): Promise<string[]> {
  const now = nowIso();
  const drafts = await findDraftSamplesOfGrade(trx, grade.code);
  for (const sample of drafts) {
    const verdict = conformanceOf(grade, decodeResults(sample.results_json));
    await updateSampleConformance(trx, sample.id, { ...verdict, updated_at: now });
    await recordOutOfSpec(trx, { ...sample, ...verdict }, sample.conforms);
  }
  return drafts.map((sample) => sample.id);
}

async function storeVersion(
  ctx: AppContext,
  auth: AuthContext,
  code: string,
  version: number,
  definition: GradeDefinitionInput,
  requestId?: string,
) {
  const row = {
    id: newId('grd'),
    code,
    code_key: gradeCodeKey(code),
    version,
    matrix: definition.matrix,
    definition_json: JSON.stringify(definition),
    created_by_label: actorOf(auth).label,
    created_at: nowIso(),
  };
  const grade = toStoredGrade(row);
  let rejudged: string[] = [];
  try {
    await inTransaction(ctx.db, async (trx) => {
      await insertGradeVersion(trx, row);
      rejudged = await rejudgeDrafts(trx, grade);
      await recordAudit(trx, {
        actor: actorOf(auth),
        requestId,
        action: version === 1 ? 'grade.created' : 'grade.versioned',
        targetType: 'grade',
        targetId: code,
        after: grade,
      });
    });
  } catch (error) {
    if (isUniqueViolation(error)) {
      throw new ConflictProblem(
        version === 1
          ? `A grade ${code} exists already; PUT /grades/{code} adds a version.`
          : `Grade ${code} changed meanwhile; read it again and retry.`,
      );
    }
    throw error;
  }
  prepareDocumentsSoon(ctx.db, rejudged, (error) => ctx.logger.warn({ err: error, grade: code }, 'preparing re-judged samples failed'));
  return grade;
}

export async function createGrade(
  ctx: AppContext,
  auth: AuthContext,
  input: z.output<typeof CreateGradeRequestSchema>,
  requestId?: string,
) {
  const { code, ...definition } = input;
  if (await findLatestGrade(ctx.db, code)) throw new ConflictProblem(`A grade ${code} exists already; PUT /grades/{code} adds a version.`);
  return storeVersion(ctx, auth, code, 1, definition, requestId);
}

export async function updateGrade(ctx: AppContext, auth: AuthContext, code: string, definition: GradeDefinitionInput, requestId?: string) {
  const current = await getGrade(ctx, code);
  return storeVersion(ctx, auth, current.code, current.version + 1, definition, requestId);
}

export function evaluateGrade(grade: StoredGrade, composition: Record<string, number | string>) {
  return { grade: { code: grade.code, version: grade.version }, ...evaluateComposition(grade, parseComposition(composition)) };
}

/** Every grade of the matrix the composition meets, the most comfortable (largest smallest margin) first. */
export async function matchGrades(ctx: AppContext, composition: Record<string, number | string>, matrix?: string) {
  const parsed = parseComposition(composition);
  const base = matrix ?? largestElement(parsed);
  if (!base) return { matrix: null, data: [] };
  const matches = (await listLatestGradesOfMatrix(ctx.db, base))
    .map((grade) => ({ grade, evaluation: evaluateComposition(grade, parsed) }))
    .filter(({ evaluation }) => evaluation.conforms === true)
    .map(({ grade, evaluation }) => ({
      grade: { code: grade.code, version: grade.version, title: grade.title },
      decision_rule: evaluation.decision_rule,
      smallest_margin: smallestMargin(evaluation),
      warnings: evaluation.warnings,
    }));
  matches.sort((a, b) => Number(b.smallest_margin ?? Infinity) - Number(a.smallest_margin ?? Infinity));
  return { matrix: base, data: matches };
}
