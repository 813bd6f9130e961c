// The control status of an instrument for a method: `verify` from the first rule violation until
// someone records a disposition (cause, action), then `in_control`. Kept as a history.
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import type { AppContext } from '../../context.ts';
import { newId } from '../../lib/ids.ts';
import { parseJsonColumn } from '../../lib/json.ts';
import { ConflictProblem, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed, getInstrument } from '../instruments/instruments.service.ts';
import type { RunRule } from './run-rules.ts';
import { type ControlStatusRow, firstBurnMeasuredAt, insertStatusChange, statusHistory } from './control.repository.ts';

export interface StatusViolation {
  element: string;
  rule: RunRule;
  title: string;
  source: string;
}

export function toStatusChange(row: ControlStatusRow) {
  return {
    id: row.id,
    method_id: row.method_id,
    status: row.status,
    control_sample_id: row.control_sample_id,
    sample_id: row.sample_id,
    measured_at: row.measured_at,
    violations: (parseJsonColumn(row.violations_json) as StatusViolation[] | null) ?? [],
    cause: row.cause,
    action: row.action,
    created_by: row.created_by_label,
    created_at: row.created_at,
  };
}

/** The status now: in_control unless the latest change is a violation; `since` is that violation. */
export async function currentStatus(db: Queryable, instrumentId: string, methodId: string) {
  const history = await statusHistory(db, instrumentId, methodId);
  const latest = history[0];
  if (latest?.status !== 'verify') return { status: 'in_control' as const, since: null, history };
  // The first violation since the last disposition: samples measured after it need checking.
  const disposition = history.findIndex((h) => h.status === 'in_control');
  const open = disposition === -1 ? history : history.slice(0, disposition);
  return { status: 'verify' as const, since: open.at(-1)!, history };
}

/** Per method the instrument has a status for: status, the reason and the history (newest first). */
export async function instrumentControl(db: Queryable, instrumentId: string) {
  const all = await statusHistory(db, instrumentId);
  const methods = [...new Set(all.map((row) => row.method_id))];
  return Promise.all(
    methods.map(async (methodId) => {
      const { status, since, history } = await currentStatus(db, instrumentId, methodId);
      return { method_id: methodId, status, reason: since && toStatusChange(since), history: history.map(toStatusChange) };
    }),
  );
}

/** GET /instruments/{id}: the instrument with its control status per method. */
export async function getInstrumentDetail(ctx: AppContext, auth: AuthContext, id: string) {
  const instrument = await getInstrument(ctx, auth, id);
  return { ...instrument, control: await instrumentControl(ctx.db, id) };
}

export async function recordDisposition(
  ctx: Pick<AppContext, 'db'>,
  auth: AuthContext,
  instrumentId: string,
  input: { method_id: string; cause: string; action: string },
  requestId?: string,
) {
  assertInstrumentAllowed(auth, instrumentId);
  return inTransaction(ctx.db, async (trx) => {
    if (!(await findInstrument(trx, instrumentId))) throw new NotFoundProblem(`No instrument ${instrumentId}.`);
    const { status, since } = await currentStatus(trx, instrumentId, input.method_id);
    if (status !== 'verify')
      throw new ConflictProblem('This instrument is in control for this method; there is no violation to dispose of.');
    const row: ControlStatusRow = {
      id: newId('cst'),
      instrument_id: instrumentId,
      method_id: input.method_id,
      status: 'in_control',
      control_sample_id: since!.control_sample_id,
      sample_id: null,
      measured_at: null,
      violations_json: null,
      cause: input.cause,
      action: input.action,
      created_by_label: actorOf(auth).label,
      created_at: nowIso(),
    };
    await insertStatusChange(trx, row);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'control.disposition',
      targetType: 'instrument',
      targetId: instrumentId,
      before: toStatusChange(since!),
      after: row,
    });
    return toStatusChange(row);
  });
}

/**
 * Release guard: while the sample's instrument is `verify` for its method, a sample measured after
 * the violation is released only with an acknowledgement (comment). Returns what to record, or null.
 */
export async function controlAcknowledgement(
  db: Queryable,
  sample: { id: string; sample_code: string; instrument_id: string; method_id: string; created_at: string },
  acknowledgement: { comment: string } | undefined,
) {
  const { status, since } = await currentStatus(db, sample.instrument_id, sample.method_id);
  if (status !== 'verify' || !since) return null;
  const measuredAt = (await firstBurnMeasuredAt(db, sample.id)) ?? sample.created_at;
  if (measuredAt < since.measured_at!) return null;
  const violation = toStatusChange(since);
  if (!acknowledgement) {
    const rules = violation.violations.map((v) => `${v.element}: ${v.title}`).join('; ');
    throw new UnprocessableProblem(
      `${sample.sample_code} was measured after a control violation on its instrument (${rules}, control point ${violation.sample_id} at ${violation.measured_at}) and the instrument is in verify: check the result and release with acknowledge_control: { comment }.`,
    );
  }
  return { comment: acknowledgement.comment, violation_id: violation.id, violations: violation.violations };
}
