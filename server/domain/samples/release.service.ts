// Releasing results: a person with samples:release authorises a draft sample's results
// (ISO/IEC 17025 §7.8.1.1). A sample that does not conform, or could not be judged, is released only
// as a concession with a comment. With the lab's independent-release setting, whoever created the
// sample or last changed its burns may not release it. Several samples (a heat) go all or none.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Transaction } from '../../db/transaction.ts';
import { prepareSampleDocuments } from './prepared-documents.ts';
import { ConflictProblem, ForbiddenProblem, UnprocessableProblem, type FieldError } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { recordEvent } from '../events/events.repository.ts';
import { controlAcknowledgement } from '../control/control-status.ts';
import { recordReleasedRevision } from './amendments.service.ts';
import { isSampleVisible, loadSample } from './sample-access.ts';
import { loadSampleDetail } from './sample-view.ts';
import { findSample, markSampleReleased, type SampleRowWithRefs } from './samples.repository.ts';
import type { ReleaseBatchRequestSchema, ReleaseRequestSchema } from './samples.schemas.ts';

type ReleaseInput = z.output<typeof ReleaseRequestSchema>;
/** What releasing needs from the application: the database and the lab's independent-release setting. */
export type ReleaseContext = Pick<AppContext, 'db'> & { config: Pick<AppContext['config'], 'releaseRequiresSecondPerson'> };

/** Why this caller may not release this sample now, or null. */
function refusal(
  ctx: ReleaseContext,
  auth: AuthContext,
  sample: SampleRowWithRefs,
  input: ReleaseInput,
): { status: 403 | 409 | 422; message: string } | null {
  if (sample.status === 'released')
    return {
      status: 409,
      message: `${sample.sample_code} is released already; change it with POST /api/v1/samples/${sample.id}/amendments.`,
    };
  if (ctx.config.releaseRequiresSecondPerson && sample.changed_by_user_id === auth.userId) {
    return {
      status: 403,
      message: `${sample.sample_code} was created or last changed by you; this lab requires another person to release it.`,
    };
  }
  if (sample.conforms !== 'true' && !(input.accept_nonconforming && input.comment)) {
    const why =
      sample.conforms === 'false'
        ? 'does not conform to its grade'
        : sample.conforms === 'undecided'
          ? 'could not be judged against its grade'
          : 'has no verdict (its grade is not defined here)';
    return {
      status: 422,
      message: `${sample.sample_code} ${why}: release it as a concession with accept_nonconforming: true and a comment.`,
    };
  }
  return null;
}

/** The control guard's refusal as a batch error, or null. */
async function controlRefusal(trx: Transaction, sample: SampleRowWithRefs, input: ReleaseInput) {
  try {
    await controlAcknowledgement(trx, sample, input.acknowledge_control);
    return null;
  } catch (error) {
    if (error instanceof UnprocessableProblem) return { status: 422 as const, message: error.message };
    throw error;
  }
}

async function release(
  trx: Transaction,
  ctx: ReleaseContext,
  auth: AuthContext,
  sample: SampleRowWithRefs,
  input: ReleaseInput,
  requestId?: string,
) {
  const acknowledged = await controlAcknowledgement(trx, sample, input.acknowledge_control);
  const now = nowIso();
  const concession = sample.conforms !== 'true';
  const actor = actorOf(auth);
  await markSampleReleased(trx, sample.id, {
    released_by_user_id: auth.userId,
    released_by_label: actor.label,
    released_at: now,
    release_comment: input.comment ?? null,
    concession,
    updated_at: now,
  });
  await prepareSampleDocuments(trx, [sample.id]);
  const document = await loadSampleDetail(trx, auth, sample.id, '%');
  await recordReleasedRevision(trx, document, actor.label, now);
  await recordAudit(trx, {
    actor,
    requestId,
    action: 'sample.released',
    targetType: 'sample',
    targetId: sample.id,
    after: { revision: sample.revision, concession, comment: input.comment ?? null, control_acknowledgement: acknowledged },
  });
  await recordEvent(trx, 'sample.released', { sample: document }, { instrumentId: sample.instrument_id });
  return document;
}

export async function releaseSample(ctx: ReleaseContext, auth: AuthContext, id: string, input: ReleaseInput, requestId?: string) {
  return inTransaction(ctx.db, async (trx) => {
    const sample = await loadSample(trx, auth, id);
    const refused = refusal(ctx, auth, sample, input);
    if (refused?.status === 409) throw new ConflictProblem(refused.message);
    if (refused?.status === 403) throw new ForbiddenProblem(refused.message);
    if (refused) throw new UnprocessableProblem(refused.message);
    return release(trx, ctx, auth, sample, input, requestId);
  });
}

/** Releases every listed sample in one transaction, or none: each refusal is named in errors[]. */
export async function releaseSamples(
  ctx: ReleaseContext,
  auth: AuthContext,
  input: z.output<typeof ReleaseBatchRequestSchema>,
  requestId?: string,
) {
  return inTransaction(ctx.db, async (trx) => {
    const errors: FieldError[] = [];
    const samples: SampleRowWithRefs[] = [];
    for (const [i, id] of input.sample_ids.entries()) {
      const sample = await findSample(trx, id);
      if (!sample || !isSampleVisible(auth, sample)) {
        errors.push({ location: `body.sample_ids.${i}`, message: `No sample ${id}.` });
        continue;
      }
      const refused = refusal(ctx, auth, sample, input) ?? (await controlRefusal(trx, sample, input));
      if (refused) errors.push({ location: `body.sample_ids.${i}`, message: refused.message, code: String(refused.status) });
      else samples.push(sample);
    }
    if (errors.length > 0) throw new UnprocessableProblem('No sample was released; see errors[] for each one that cannot be.', errors);
    const data = [];
    for (const sample of samples) data.push(await release(trx, ctx, auth, sample, input, requestId));
    return { data };
  });
}
