// Activation: a draft run becomes the correction set in force for its instrument and method from
// effective_from (default: now) until a later activation takes over. Rules:
// - only drafts (409 otherwise), and only when no run measured later is already activated (409):
//   activating an older run by mistake would roll the instrument back;
// - with the method's second_person_activation rule, not by the one who ran it (409);
// - an element flagged `fail` needs override_reason (409 without it), which is recorded;
// - effective_from may be later than now (scheduled), never earlier (422): results already stored
//   are never changed by an activation — recompute them explicitly instead.
// The activation, its audit entry and the event standardization.activated land in one transaction.
import { inTransaction, type Transaction } from '../../db/transaction.ts';
import type { AppContext } from '../../context.ts';
import { ConflictProblem, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { nowIso } from '../../lib/time.ts';
import { type Actor, actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { recordEvent } from '../events/events.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findMethod } from '../methods/methods.repository.ts';
import type { ElementCorrection, StandardizationRow } from './standardizations.repository.ts';
import {
  findSetInForce,
  findStandardization,
  latestActivatedMeasuredAt,
  updateStandardizationActivation,
} from './standardizations.repository.ts';
import { getStandardization } from './standardizations.service.ts';
import type { ActivateStandardizationRequestSchema } from './standardizations.schemas.ts';
import type { z } from '../../lib/zod.ts';

export type ActivationInput = z.output<typeof ActivateStandardizationRequestSchema>;

export async function activateStandardization(ctx: AppContext, auth: AuthContext, id: string, input: ActivationInput, requestId?: string) {
  await inTransaction(ctx.db, async (trx) => {
    const row = await findStandardization(trx, id);
    if (!row || (auth.instrumentIds && !auth.instrumentIds.includes(row.instrument_id)))
      throw new NotFoundProblem(`No standardization ${id}.`);
    assertInstrumentAllowed(auth, row.instrument_id);
    await applyActivation(trx, row, input, { actor: actorOf(auth), now: nowIso(), requestId });
  });
  return getStandardization(ctx, auth, id);
}

/** The activation rules and records, inside the caller's transaction (also used by the demo seed). */
export async function applyActivation(
  trx: Transaction,
  row: StandardizationRow,
  input: ActivationInput,
  context: { actor: Actor; now: string; requestId?: string },
): Promise<void> {
  const { actor, now, requestId } = context;
  const { id } = row;
  if (row.status !== 'draft') throw new ConflictProblem(`Standardization ${id} was already activated on ${row.activated_at}.`);
  const latest = await latestActivatedMeasuredAt(trx, row.instrument_id, row.method_id);
  if (latest && latest > row.measured_at) {
    throw new ConflictProblem(
      `A standardization measured later (${latest}) is already activated for this instrument and method; activating this older one would roll the correction back. Run a new standardization instead.`,
    );
  }
  const method = await findMethod(trx, row.method_id);
  if (method?.drift_limits.second_person_activation && actor.label === row.created_by_label) {
    throw new ConflictProblem(
      `Method ${method.code} needs a second person to activate a standardization: ${actor.label} ran this one, so someone else activates it.`,
      { rule: 'second_person_activation' },
    );
  }
  const corrections = JSON.parse(row.corrections_json) as ElementCorrection[];
  const failing = corrections.filter((c) => c.flag === 'fail');
  if (failing.length && !input.override_reason) {
    throw new ConflictProblem(
      `${failing.map((c) => c.element).join(', ')} ${failing.length === 1 ? 'is' : 'are'} flagged fail. Activate only with an override_reason saying why this correction is acceptable; it is recorded.`,
      { failing_elements: failing.map((c) => ({ element: c.element, reasons: c.reasons })) },
    );
  }
  const effectiveFrom = input.effective_from ? new Date(input.effective_from).toISOString() : now;
  if (effectiveFrom < now) {
    throw new UnprocessableProblem(
      'effective_from is in the past. Activation never changes stored results: recompute those samples explicitly instead.',
      [{ location: 'body.effective_from', message: `must be ${now} or later`, code: 'backdated' }],
    );
  }
  const previous = await findSetInForce(trx, row.instrument_id, row.method_id, effectiveFrom);
  const changes = {
    status: 'activated' as const,
    activated_at: now,
    activated_by_label: actor.label,
    effective_from: effectiveFrom,
    override_reason: input.override_reason ?? null,
  };
  await updateStandardizationActivation(trx, id, changes);
  const summary = {
    id,
    instrument_id: row.instrument_id,
    method_id: row.method_id,
    mode: row.mode,
    flag: row.flag,
    effective_from: effectiveFrom,
    override_reason: changes.override_reason,
    replaces: previous?.id ?? null,
  };
  await recordAudit(trx, {
    actor,
    requestId,
    action: 'standardization.activated',
    targetType: 'standardization',
    targetId: id,
    before: { status: row.status, set_in_force: previous?.id ?? null },
    after: { ...changes, failing_elements: failing.map((c) => c.element), replaces: previous?.id ?? null },
  });
  await recordEvent(
    trx,
    'standardization.activated',
    { standardization: summary, activated_by: actor.label },
    { occurredAt: now, instrumentId: row.instrument_id },
  );
}
