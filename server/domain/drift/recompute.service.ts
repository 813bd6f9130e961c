// Recomputing a sample against another correction set, or none, on request and with a reason.
// The burns' measured values are never touched; their corrected values, the results and the
// correction record are replaced, and the audit trail keeps both versions (before/after).
// Stored results are never changed any other way by drift correction: activation leaves them alone.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, UnprocessableProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { findMethod } from '../methods/methods.repository.ts';
import { computeSampleResults } from '../samples/sample-results.ts';
import { loadSample } from '../samples/sample-access.ts';
import { recordOutOfSpec } from '../samples/samples.service.ts';
import { findBurns, type StoredCell, updateBurn, updateSampleResults } from '../samples/samples.repository.ts';
import { correctBurn, correctionSetOf, type CorrectionSet, distinctSetIds, type SampleCorrection } from './correction-timeline.ts';
import { findStandardization } from './standardizations.repository.ts';
import { decodeResults, encodeResults } from '../samples/results-codec.ts';
import { inTransaction } from '../../db/transaction.ts';
import { prepareSampleDocuments } from '../samples/prepared-documents.ts';
import type { RecomputeSampleRequestSchema } from './recompute.schemas.ts';
import type { z } from '../../lib/zod.ts';
import { conformanceJudge } from '../grades/sample-conformance.ts';

export type RecomputeInput = z.output<typeof RecomputeSampleRequestSchema>;

export async function recomputeSample(
  ctx: AppContext,
  auth: AuthContext,
  sampleId: string,
  input: RecomputeInput,
  requestId?: string,
): Promise<void> {
  await inTransaction(ctx.db, async (trx) => {
    const sample = await loadSample(trx, auth, sampleId);
    if (sample.status === 'released')
      throw new ConflictProblem(`This sample is released; change it with an amendment: POST /api/v1/samples/${sampleId}/amendments.`);
    let set: CorrectionSet | null = null;
    if (input.correction_set_id !== null) {
      const row = await findStandardization(trx, input.correction_set_id);
      const problem = (message: string) =>
        new UnprocessableProblem(message, [{ location: 'body.correction_set_id', message, code: 'unusable_set' }]);
      if (!row) throw problem(`no correction set ${input.correction_set_id}`);
      if (row.instrument_id !== sample.instrument_id || row.method_id !== sample.method_id)
        throw problem(
          `${row.id} belongs to another instrument or method than this sample (${sample.instrument_code}, ${sample.method_code})`,
        );
      if (row.status !== 'activated') throw problem(`${row.id} is a draft: only an activated (reviewed) correction set can be applied`);
      set = correctionSetOf(row);
    }
    const method = await findMethod(trx, sample.method_id);
    const burns = await findBurns(trx, sampleId);
    const corrected = burns.map((b) => correctBurn(JSON.parse(b.values_json) as Record<string, StoredCell>, set));
    const { results, flags } = computeSampleResults(
      burns.map((b, i) => ({ excluded: Boolean(b.excluded), values: JSON.parse(b.values_json), corrected: corrected[i].corrected })),
      method!,
    );
    const actor = actorOf(auth);
    const now = nowIso();
    const correction: SampleCorrection = {
      applied_to: 'concentration',
      set_ids: distinctSetIds(corrected),
      selection: 'requested',
      reason: input.reason,
      recomputed_by: actor.label,
      recomputed_at: now,
    };
    for (const [i, burn] of burns.entries()) {
      await updateBurn(trx, burn.id, {
        correction_set_id: corrected[i].correction_set_id,
        corrected_json: corrected[i].corrected && JSON.stringify(corrected[i].corrected),
      });
    }
    const verdict = await conformanceJudge(trx)(sample.grade, results);
    await updateSampleResults(trx, sampleId, {
      results_json: encodeResults(results),
      flags_json: JSON.stringify(flags),
      correction_json: JSON.stringify(correction),
      updated_at: now,
      ...verdict,
    });
    await recordOutOfSpec(trx, { ...sample, ...verdict }, sample.conforms);
    await prepareSampleDocuments(trx, [sampleId]);
    await recordAudit(trx, {
      actor,
      requestId,
      action: 'sample.recomputed',
      targetType: 'sample',
      targetId: sampleId,
      before: {
        correction: sample.correction_json ? JSON.parse(sample.correction_json) : null,
        results: decodeResults(sample.results_json),
      },
      after: { correction, results, reason: input.reason },
    });
  });
}
