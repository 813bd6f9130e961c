// Samples: JSON push (one or a batch, all in one transaction), burn exclusion with a reason,
// results recomputed whenever burns change. Every change is audited with before/after.
import { inTransaction, type Queryable, type Transaction } from '../../db/transaction.ts';
import type { AppContext } from '../../context.ts';
import { ConflictProblem, type FieldError, NotFoundProblem, UnprocessableProblem, ValidationProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { parseJsonColumn } from '../../lib/json.ts';
import { nowIso } from '../../lib/time.ts';
import { type Actor, actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findInstrument, type InstrumentRow } from '../instruments/instruments.repository.ts';
import { findMethod, type Method } from '../methods/methods.repository.ts';
import { timelineLoader } from '../drift/correction-timeline.ts';
import { normalisePushedBurns } from './pushed-sample.ts';
import { buildSampleRows } from './sample-builder.ts';
import { computeSampleResults } from './sample-results.ts';
import { minimumBurnsExtension, tooFewIncludedBurns } from './burn-exclusion-rules.ts';
import {
  type BurnRow,
  findBurns,
  insertSamples,
  type NewSampleRow,
  type SampleRow,
  updateBurn,
  updateSampleResults,
} from './samples.repository.ts';
import { decodeResults, encodeResults } from './results-codec.ts';
import { loadSample } from './sample-access.ts';
import { type DocumentCodes, documentsOfNewSample, prepareSampleDocuments } from './prepared-documents.ts';
import { recordSamplesCreated } from './sample-events.ts';
import type { PushSampleRequestSchema } from './samples.schemas.ts';
import type { z } from '../../lib/zod.ts';
import { conformanceJudge } from '../grades/sample-conformance.ts';
import { recordEvent } from '../events/events.repository.ts';
import { queueAlert } from '../alerts/alerts.service.ts';
import { linkControlMeasurements, rejudgeControlPoint, resolveControlLinks } from '../control/control-judge.ts';

export type PushedSample = z.output<typeof PushSampleRequestSchema>;

/** Loads each referenced method once; unknown or forbidden references become errors. */
async function resolveReferences(
  db: Queryable,
  auth: AuthContext,
  samples: PushedSample[],
  location: (i: number) => string,
  errors: FieldError[],
) {
  const methods = new Map<string, Method | undefined>();
  const instruments = new Map<string, InstrumentRow | undefined>();
  for (const [i, sample] of samples.entries()) {
    if (!instruments.has(sample.instrument_id)) instruments.set(sample.instrument_id, await findInstrument(db, sample.instrument_id));
    if (!instruments.get(sample.instrument_id))
      errors.push({
        location: `${location(i)}.instrument_id`,
        message: `no instrument ${sample.instrument_id}`,
        code: 'unknown_reference',
      });
    else assertInstrumentAllowed(auth, sample.instrument_id);
    if (!methods.has(sample.method_id)) methods.set(sample.method_id, await findMethod(db, sample.method_id));
    if (!methods.get(sample.method_id))
      errors.push({ location: `${location(i)}.method_id`, message: `no method ${sample.method_id}`, code: 'unknown_reference' });
  }
  return { methods, instruments };
}

/** Stores pushed samples in one transaction; returns their ids and single-sample documents, in request order. */
export async function pushSamples(
  ctx: AppContext,
  auth: AuthContext,
  samples: PushedSample[],
  batch: boolean,
  requestId?: string,
): Promise<{ id: string; document: string }[]> {
  const location = (i: number) => (batch ? `body.samples.${i}` : 'body');
  const referenceErrors: FieldError[] = [];
  const { methods, instruments } = await resolveReferences(ctx.db, auth, samples, location, referenceErrors);
  if (referenceErrors.length)
    throw new UnprocessableProblem('A sample refers to an instrument or method that does not exist.', referenceErrors);

  const errors: FieldError[] = [];
  const now = nowIso();
  const actor = actorOf(auth);
  const normalised = samples.map((sample, i) => {
    const method = methods.get(sample.method_id)!;
    return {
      sample,
      method,
      burns: normalisePushedBurns(
        sample.burns,
        sample.unit ?? method.default_unit,
        `${location(i)}.burns`,
        `Sample ${sample.sample_code}`,
        errors,
      ),
    };
  });
  if (errors.length) throw new ValidationProblem(errors, 'Some values cannot be read; see errors[] for each one. Nothing was stored.');

  return inTransaction(ctx.db, async (trx) => {
    // The correction sets are read in the storing transaction: an activation lands wholly before or after.
    const timelineOf = timelineLoader(trx);
    const built = [];
    for (const { sample, method, burns } of normalised) {
      const corrections = await timelineOf(sample.instrument_id, method.id);
      built.push(buildSampleRows({ ...sample, method, source: 'push', created_by_label: actor.label, burns, corrections }, now));
    }
    const stored = await storeNewSamples(trx, built, actor, requestId, {
      userId: auth.userId,
      controlSampleIds: samples.map((s) => s.control_sample_id),
      batch,
      documentCodes: { instrumentCode: (id) => instruments.get(id)!.code, methodCode: (id) => methods.get(id)!.code },
    });
    return stored.map((sample) => ({ id: sample.id, document: sample.detail_doc! }));
  });
}

/**
 * Inserts built samples and audits each one; runs inside the caller's transaction. With
 * `documentCodes` the samples are stored with their prepared documents (a push answers with them);
 * otherwise the caller prepares them (an import does so after its transaction).
 */
export async function storeNewSamples(
  trx: Transaction,
  built: ReturnType<typeof buildSampleRows>[],
  actor: Actor,
  requestId?: string,
  options: {
    auditEach?: boolean;
    userId?: string;
    controlSampleIds?: (string | undefined)[];
    batch?: boolean;
    documentCodes?: DocumentCodes;
  } = {},
): Promise<NewSampleRow[]> {
  // Control links first: a sample linked by its code is stored as kind control.
  const controlLinks = await resolveControlLinks(trx, built, options.controlSampleIds, options.batch);
  const judge = conformanceJudge(trx);
  for (const { sample } of built) {
    Object.assign(sample, await judge(sample.grade, decodeResults(sample.results_json)), { changed_by_user_id: options.userId ?? null });
  }
  const codes = options.documentCodes;
  const rows: NewSampleRow[] = built.map((b) => (codes ? { ...b.sample, ...documentsOfNewSample(b.sample, b.burns, codes) } : b.sample));
  await insertSamples(
    trx,
    rows,
    built.flatMap((b) => b.burns),
  );
  // One sample.created event per sample, whatever the path (push, batch, import, seed).
  await recordSamplesCreated(trx, built);
  for (const { sample } of built) await recordOutOfSpec(trx, sample, null);
  await linkControlMeasurements(trx, built, controlLinks);
  // A file import is audited once, as import.completed, naming the import that holds the samples.
  if (options.auditEach === false) return rows;
  for (const { sample } of built) {
    await recordAudit(trx, {
      actor,
      requestId,
      action: 'sample.created',
      targetType: 'sample',
      targetId: sample.id,
      after: {
        sample_code: sample.sample_code,
        heat: sample.heat,
        source: sample.source,
        import_id: sample.import_id,
        results: decodeResults(sample.results_json),
      },
    });
  }
  return rows;
}

/** Records sample.out_of_spec when a verdict has just become "does not conform". */
export async function recordOutOfSpec(
  trx: Transaction,
  sample: Pick<SampleRow, 'id' | 'sample_code' | 'heat' | 'grade' | 'instrument_id' | 'conforms' | 'conformance_json'>,
  before: SampleRow['conforms'],
): Promise<void> {
  if (sample.conforms !== 'false' || before === 'false') return;
  await recordEvent(
    trx,
    'sample.out_of_spec',
    {
      sample: {
        id: sample.id,
        sample_code: sample.sample_code,
        heat: sample.heat,
        grade: sample.grade,
        instrument_id: sample.instrument_id,
      },
      conformance: JSON.parse(sample.conformance_json!) as unknown,
    },
    { instrumentId: sample.instrument_id },
  );
  await queueAlert(trx, {
    kind: 'out_of_spec',
    instrumentId: sample.instrument_id,
    subject: `${sample.sample_code} does not conform to ${sample.grade}`,
    lines: [`Sample ${sample.sample_code}${sample.heat ? ` (heat ${sample.heat})` : ''} does not conform to grade ${sample.grade}.`],
    path: `/samples/${sample.id}`,
  });
}

/** The results of a sample's burns as they stand (excluded ones left out), each with the correction it was stored with. */
export function resultsOfBurns(burns: readonly BurnRow[], method: Method) {
  return computeSampleResults(
    burns.map((b) => ({ excluded: Boolean(b.excluded), values: JSON.parse(b.values_json), corrected: parseJsonColumn(b.corrected_json) })),
    method,
  );
}

function burnState(burn: BurnRow) {
  return { number: burn.burn_number, excluded: Boolean(burn.excluded), reason: burn.exclusion_reason };
}

/** Excludes or re-includes one burn, recomputes the results and records who, when and why. */
export async function setBurnExclusion(
  ctx: AppContext,
  auth: AuthContext,
  sampleId: string,
  burnNumber: number,
  change: { excluded: boolean; reason: string },
  requestId?: string,
): Promise<void> {
  await inTransaction(ctx.db, async (trx) => {
    const sample = await loadSample(trx, auth, sampleId);
    if (sample.status === 'released')
      throw new ConflictProblem(`This sample is released; change it with an amendment: POST /api/v1/samples/${sampleId}/amendments.`);
    const burns = await findBurns(trx, sampleId);
    const burn = burns.find((b) => b.burn_number === burnNumber);
    if (!burn) throw new NotFoundProblem(`Sample ${sampleId} has no burn ${burnNumber}.`);
    if (Boolean(burn.excluded) === change.excluded) return;
    const method = (await findMethod(trx, sample.method_id))!;
    const now = nowIso();
    const actor = actorOf(auth);
    const updated: BurnRow = {
      ...burn,
      excluded: change.excluded,
      exclusion_reason: change.reason,
      excluded_by: actor.label,
      excluded_at: now,
    };
    const next = burns.map((b) => (b.id === burn.id ? updated : b));
    const refusal = tooFewIncludedBurns(next, burns, method);
    if (refusal) throw new ConflictProblem(refusal, minimumBurnsExtension(burns, method));
    // The burns keep the correction they were stored with: excluding one never changes the set applied.
    const { results, flags } = resultsOfBurns(next, method);
    await updateBurn(trx, burn.id, {
      excluded: change.excluded,
      exclusion_reason: change.reason,
      excluded_by: actor.label,
      excluded_at: now,
    });
    const verdict = await conformanceJudge(trx)(sample.grade, results);
    await updateSampleResults(trx, sampleId, {
      results_json: encodeResults(results),
      flags_json: JSON.stringify(flags),
      updated_at: now,
      changed_by_user_id: auth.userId,
      ...verdict,
    });
    await recordOutOfSpec(trx, { ...sample, ...verdict }, sample.conforms);
    await rejudgeControlPoint(trx, sampleId);
    await prepareSampleDocuments(trx, [sampleId]);
    await recordAudit(trx, {
      actor,
      requestId,
      action: change.excluded ? 'sample.burn_excluded' : 'sample.burn_included',
      targetType: 'sample',
      targetId: sampleId,
      before: { burn: burnState(burn), results: decodeResults(sample.results_json) },
      after: { burn: burnState(updated), results, reason: change.reason },
    });
  });
}

export type { SampleRow };
