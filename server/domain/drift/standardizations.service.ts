// Standardization runs: the references' burns are parsed like a pushed sample, checked against the
// mode (which references it needs), turned into per-element corrections with flags, and stored as
// a draft. A flagged run records the event standardization.flagged in the same transaction.
import { inTransaction, type Transaction } from '../../db/transaction.ts';
import type { AppContext } from '../../context.ts';
import { type FieldError, NotFoundProblem, UnprocessableProblem, ValidationProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { latestMeasurementTime, nowIso } from '../../lib/time.ts';
import { type Actor, actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { queueAlert } from '../alerts/alerts.service.ts';
import { standardizationAdvice } from '../control/control-advice.ts';
import { recordEvent } from '../events/events.repository.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findMethod, type Method } from '../methods/methods.repository.ts';
import { normalisePushedBurns } from '../samples/pushed-sample.ts';
import type { CorrectionMode } from './correction-math.ts';
import { correctionSetOf } from './correction-timeline.ts';
import { computeRun, type RunMeasurement } from './compute-run.ts';
import { worstFlag } from './correction-flags.ts';
import { findReferenceMaterials, type ReferenceMaterial } from './reference-materials.repository.ts';
import { toStandardizationView } from './standardization-view.ts';
import {
  findSetInForce,
  findStandardizationWithRefs,
  insertStandardization,
  type StandardizationRow,
} from './standardizations.repository.ts';
import type { CreateStandardizationRequestSchema } from './standardizations.schemas.ts';
import type { z } from '../../lib/zod.ts';

export type StandardizationInput = z.output<typeof CreateStandardizationRequestSchema>;

/** A few minutes of clock difference between the instrument PC and the server are tolerated. */

/** Which references each mode needs; every problem becomes one entry of a 422. */
function checkReferences(mode: CorrectionMode, method: Method, references: ReferenceMaterial[], errors: FieldError[]): void {
  const kinds = references.map((r) => r.kind);
  references.forEach((reference, i) => {
    const at = `body.measurements.${i}.reference_material_id`;
    if (reference.matrix !== method.matrix)
      errors.push({
        location: at,
        message: `${reference.code} is a ${reference.matrix}-base material; method ${method.code} measures ${method.matrix}-base alloys`,
        code: 'matrix_mismatch',
      });
    if (reference.kind === 'control')
      errors.push({
        location: at,
        message: `${reference.code} is a control sample: it checks the instrument, it does not standardize it`,
        code: 'wrong_kind',
      });
    if (references.findIndex((r) => r.id === reference.id) !== i)
      errors.push({ location: at, message: `${reference.code} is listed twice`, code: 'duplicate_reference' });
  });
  if (mode === 'two_point') {
    if (references.length !== 2 || !kinds.includes('high') || !kinds.includes('low')) {
      errors.push({
        location: 'body.measurements',
        message: 'two_point needs exactly two references: one of kind "high" and one of kind "low"',
        code: 'wrong_references',
      });
    }
  } else if (references.length !== 1) {
    errors.push({ location: 'body.measurements', message: `${mode} needs exactly one reference`, code: 'wrong_references' });
  } else if (mode === 'type' && kinds[0] !== 'type') {
    errors.push({
      location: 'body.measurements.0.reference_material_id',
      message: `a type standardization needs a reference of kind "type" (similar composition to the samples); ${references[0].code} is "${kinds[0]}"`,
      code: 'wrong_kind',
    });
  }
}

async function resolve(ctx: AppContext, auth: AuthContext, instrumentId: string, input: StandardizationInput) {
  const instrument = await findInstrument(ctx.db, instrumentId);
  if (!instrument) throw new NotFoundProblem(`No instrument ${instrumentId}.`);
  assertInstrumentAllowed(auth, instrumentId);
  const method = await findMethod(ctx.db, input.method_id);
  if (!method)
    throw new UnprocessableProblem('The method does not exist.', [
      { location: 'body.method_id', message: `no method ${input.method_id}`, code: 'unknown_reference' },
    ]);
  const found = await findReferenceMaterials(
    ctx.db,
    input.measurements.map((m) => m.reference_material_id),
  );
  const errors: FieldError[] = [];
  const references = input.measurements.map((m, i) => {
    const reference = found.find((r) => r.id === m.reference_material_id);
    if (!reference)
      errors.push({
        location: `body.measurements.${i}.reference_material_id`,
        message: `no reference material ${m.reference_material_id}`,
        code: 'unknown_reference',
      });
    return reference;
  });
  if (errors.length) throw new UnprocessableProblem('A measurement refers to a reference material that does not exist.', errors);
  checkReferences(input.mode, method, references as ReferenceMaterial[], errors);
  if (errors.length) throw new UnprocessableProblem(`These references cannot make a ${input.mode} standardization; see errors[].`, errors);
  return { method, references: references as ReferenceMaterial[] };
}

export async function createStandardization(
  ctx: AppContext,
  auth: AuthContext,
  instrumentId: string,
  input: StandardizationInput,
  requestId?: string,
) {
  const now = nowIso();
  const measuredAt = input.measured_at ? new Date(input.measured_at).toISOString() : now;
  if (measuredAt > latestMeasurementTime()) {
    throw new ValidationProblem([{ location: 'body.measured_at', message: 'is in the future', code: 'future_time' }]);
  }
  const { method, references } = await resolve(ctx, auth, instrumentId, input);
  const parseErrors: FieldError[] = [];
  const measurements: RunMeasurement[] = input.measurements.map((m, i) => ({
    reference: references[i],
    burns: normalisePushedBurns(
      m.burns,
      input.unit ?? method.default_unit,
      `body.measurements.${i}.burns`,
      `Measurement ${i + 1}`,
      parseErrors,
    ),
  }));
  if (parseErrors.length)
    throw new ValidationProblem(parseErrors, 'Some values cannot be read; see errors[] for each one. Nothing was stored.');

  const id = await inTransaction(ctx.db, (trx) =>
    storeRun(trx, {
      instrumentId,
      method,
      mode: input.mode,
      measurements,
      measuredAt,
      note: input.note ?? null,
      sourceFile: input.source_file ?? null,
      actor: actorOf(auth),
      now,
      requestId,
    }),
  );
  return { ...(await getStandardization(ctx, auth, id)), warnings: await standardizationAdvice(ctx.db, instrumentId, method.id) };
}

export interface StoreRunInput {
  instrumentId: string;
  method: Method;
  mode: CorrectionMode;
  measurements: RunMeasurement[];
  measuredAt: string;
  note: string | null;
  sourceFile?: { name: string; sha256: string } | null;
  actor: Actor;
  now: string;
  requestId?: string;
}

/** Computes and stores a run as a draft, with its audit entry and (when flagged) its event; returns its id. */
export async function storeRun(trx: Transaction, input: StoreRunInput): Promise<string> {
  const { instrumentId, method, measuredAt, actor, now } = input;
  const id = newId('std');
  const inForce = await findSetInForce(trx, instrumentId, method.id, measuredAt);
  const run = computeRun({
    mode: input.mode,
    method,
    measurements: input.measurements,
    inForce: inForce ? correctionSetOf(inForce).corrections : null,
  });
  if (run.errors.length)
    throw new UnprocessableProblem(
      `No correction can be computed for ${run.errors.map((e) => e.location.split('.').pop()).join(', ')}; see errors[].`,
      run.errors,
    );
  const row: StandardizationRow = {
    id,
    instrument_id: instrumentId,
    method_id: method.id,
    mode: input.mode,
    status: 'draft',
    flag: worstFlag(run.corrections.map((c) => c.flag)),
    measured_at: measuredAt,
    note: input.note,
    source_file_json: input.sourceFile ? JSON.stringify(input.sourceFile) : null,
    measurements_json: JSON.stringify(run.measurements),
    corrections_json: JSON.stringify(run.corrections),
    base_set_id: input.mode === 'type' ? (inForce?.id ?? null) : null,
    created_by_label: actor.label,
    created_at: now,
    activated_at: null,
    activated_by_label: null,
    effective_from: null,
    override_reason: null,
  };
  await insertStandardization(trx, row);
  const summary = { id, instrument_id: instrumentId, method_id: method.id, mode: row.mode, flag: row.flag, measured_at: measuredAt };
  await recordAudit(trx, {
    actor,
    requestId: input.requestId,
    action: 'standardization.created',
    targetType: 'standardization',
    targetId: id,
    after: { ...summary, source_file: input.sourceFile ?? null, corrections: run.corrections.map(({ levels: _levels, ...c }) => c) },
  });
  if (row.flag !== 'ok') {
    const flagged = run.corrections.filter((c) => c.flag !== 'ok').map((c) => ({ element: c.element, flag: c.flag, reasons: c.reasons }));
    await recordEvent(trx, 'standardization.flagged', { standardization: summary, elements: flagged }, { occurredAt: now, instrumentId });
    await queueAlert(trx, {
      kind: 'standardization_flagged',
      instrumentId,
      subject: `Standardization ${id} flagged ${row.flag}`,
      lines: flagged.map((f) => `  - ${f.element}: ${f.flag} (${f.reasons.join('; ')})`),
      path: `/standardizations/${id}`,
    });
  }
  return id;
}

export async function getStandardization(ctx: AppContext, auth: AuthContext, id: string) {
  const row = await findStandardizationWithRefs(ctx.db, id);
  if (!row || (auth.instrumentIds && !auth.instrumentIds.includes(row.instrument_id)))
    throw new NotFoundProblem(`No standardization ${id}.`);
  const inForce = await findSetInForce(ctx.db, row.instrument_id, row.method_id, nowIso());
  return toStandardizationView(row, inForce?.id ?? null);
}
