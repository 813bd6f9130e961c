// Amending a released sample (ISO/IEC 17025 §7.8.8): burns excluded or included again, heat,
// grade or fields corrected, with a reason. The sample stays released at revision n + 1; every
// revision is kept exactly as it was served, with who, when, why and what changed per element.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Transaction } from '../../db/transaction.ts';
import { prepareSampleDocuments } from './prepared-documents.ts';
import { newId } from '../../lib/ids.ts';
import { ConflictProblem, type FieldError, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { recordEvent } from '../events/events.repository.ts';
import { conformanceJudge } from '../grades/sample-conformance.ts';
import { findMethod, type Method } from '../methods/methods.repository.ts';
import { tooFewIncludedBurns } from './burn-exclusion-rules.ts';
import { decodeResults, encodeResults } from './results-codec.ts';
import { type ElementChange, findRevision, insertRevision, listRevisions } from './revisions.repository.ts';
import { loadSampleDetail } from './sample-view.ts';
import { type BurnRow, findBurns, type SampleRowWithRefs, updateAmendedSample, updateBurn } from './samples.repository.ts';
import type { AmendmentRequestSchema } from './samples.schemas.ts';
import { loadSample } from './sample-access.ts';
import { recordOutOfSpec, resultsOfBurns } from './samples.service.ts';

type AmendmentInput = z.output<typeof AmendmentRequestSchema>;
type SampleDocument = Awaited<ReturnType<typeof loadSampleDetail>>;

const reported = (r: { reported: string | null; qualifier: string | null } | undefined) =>
  r?.reported == null ? null : `${r.qualifier ?? ''}${r.reported}`;

function elementChanges(before: SampleDocument['results'], after: SampleDocument['results']): ElementChange[] {
  const elements = [...new Set([...before.map((r) => r.element), ...after.map((r) => r.element)])];
  return elements
    .map((element) => ({
      element,
      before: reported(before.find((r) => r.element === element)),
      after: reported(after.find((r) => r.element === element)),
    }))
    .filter((change) => change.before !== change.after);
}

/** Revision 1 is the document as released; kept at release so that an amendment can never rewrite it. */
export async function recordReleasedRevision(trx: Transaction, document: SampleDocument, byLabel: string, at: string): Promise<void> {
  await insertRevision(trx, {
    id: newId('rev'),
    sample_id: document.id,
    revision: document.revision,
    document_json: JSON.stringify(document),
    reason: null,
    changes_json: '[]',
    created_by_label: byLabel,
    created_at: at,
  });
}

function applyBurnChanges(burns: BurnRow[], input: AmendmentInput, method: Method, errors: FieldError[]): BurnRow[] {
  const wanted = new Map<number, boolean>([
    ...(input.exclude_burns ?? []).map((n) => [n, true] as const),
    ...(input.include_burns ?? []).map((n) => [n, false] as const),
  ]);
  for (const n of wanted.keys())
    if (!burns.some((b) => b.burn_number === n)) errors.push({ location: 'body', message: `There is no burn ${n}.` });
  const next = burns.map((b) => (wanted.has(b.burn_number) ? { ...b, excluded: wanted.get(b.burn_number)! } : b));
  const refusal = tooFewIncludedBurns(next, burns, method);
  if (refusal) errors.push({ location: 'body.exclude_burns', message: refusal, code: 'too_few_included_burns' });
  return next;
}

export async function amendSample(ctx: Pick<AppContext, 'db'>, auth: AuthContext, id: string, input: AmendmentInput, requestId?: string) {
  return inTransaction(ctx.db, async (trx) => {
    const sample: SampleRowWithRefs = await loadSample(trx, auth, id);
    if (sample.status !== 'released')
      throw new ConflictProblem('This sample is a draft: change it directly; amendments are for released results.');
    const before = await loadSampleDetail(trx, auth, id, '%');
    if (!(await findRevision(trx, id, sample.revision)))
      await recordReleasedRevision(trx, before, sample.released_by_label ?? '', sample.released_at ?? nowIso());
    const errors: FieldError[] = [];
    const burns = await findBurns(trx, id);
    const method = (await findMethod(trx, sample.method_id))!;
    const next = applyBurnChanges(burns, input, method, errors);
    if (errors.length > 0) throw new UnprocessableProblem('Nothing was amended; see errors[].', errors);

    const now = nowIso();
    const actor = actorOf(auth);
    for (const burn of next.filter((b, i) => Boolean(b.excluded) !== Boolean(burns[i].excluded))) {
      await updateBurn(trx, burn.id, {
        excluded: burn.excluded,
        exclusion_reason: input.reason,
        excluded_by: actor.label,
        excluded_at: now,
      });
    }
    const { results, flags } = resultsOfBurns(next, method);
    const grade = input.grade === undefined ? sample.grade : input.grade;
    const verdict = await conformanceJudge(trx)(grade, results);
    const revision = sample.revision + 1;
    await updateAmendedSample(trx, id, {
      heat: input.heat === undefined ? sample.heat : input.heat,
      grade,
      fields_json: input.fields === undefined ? sample.fields_json : JSON.stringify(input.fields),
      results_json: encodeResults(results),
      flags_json: JSON.stringify(flags),
      ...verdict,
      revision,
      updated_at: now,
    });
    await prepareSampleDocuments(trx, [id]);
    const after = await loadSampleDetail(trx, auth, id, '%');
    const changes = elementChanges(before.results, after.results);
    await insertRevision(trx, {
      id: newId('rev'),
      sample_id: id,
      revision,
      document_json: JSON.stringify(after),
      reason: input.reason,
      changes_json: JSON.stringify(changes),
      created_by_label: actor.label,
      created_at: now,
    });
    await recordAudit(trx, {
      actor,
      requestId,
      action: 'sample.amended',
      targetType: 'sample',
      targetId: id,
      before: { revision: sample.revision, heat: sample.heat, grade: sample.grade, results: decodeResults(sample.results_json) },
      after: { revision, reason: input.reason, heat: after.heat, grade: after.grade, results },
    });
    await recordEvent(
      trx,
      'sample.amended',
      {
        sample: after,
        from_revision: sample.revision,
        to_revision: revision,
        changed_elements: changes,
      },
      { instrumentId: sample.instrument_id },
    );
    await recordOutOfSpec(trx, { ...sample, ...verdict }, sample.conforms);
    return after;
  });
}

export async function getRevisions(ctx: AppContext, auth: AuthContext, id: string) {
  await loadSample(ctx.db, auth, id);
  const rows = await listRevisions(ctx.db, id);
  return {
    data: rows.map((row) => ({
      revision: row.revision,
      reason: row.reason,
      by: row.created_by_label,
      at: row.created_at,
      changed_elements: JSON.parse(row.changes_json) as ElementChange[],
    })),
  };
}

/** Revision n exactly as it was served. */
export async function getRevision(ctx: AppContext, auth: AuthContext, id: string, revision: number): Promise<SampleDocument> {
  const sample = await loadSample(ctx.db, auth, id);
  const row = await findRevision(ctx.db, id, revision);
  if (!row)
    throw new NotFoundProblem(`Sample ${id} has no revision ${revision}${sample.status === 'draft' ? ' (it is not released)' : ''}.`);
  return JSON.parse(row.document_json) as SampleDocument;
}
