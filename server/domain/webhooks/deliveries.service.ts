// The delivery log and what a user does with it: list an endpoint's deliveries, read one with every
// attempt, send one again, send a test event, re-queue what failed since a time. Each is audited.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { mapPage } from '../../lib/pagination.ts';
import { ConflictProblem, NotFoundProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { recordTestEvent, TEST_EVENT_TYPE } from '../events/events.repository.ts';
import {
  type AttemptRow,
  deleteDeliveriesBefore,
  type DeliveryRow,
  findDelivery,
  insertDeliveries,
  listAttempts,
  listDeliveryRows,
  requeueFailedSince,
  updateDelivery,
} from './deliveries.repository.ts';
import type { WebhookDeliveryListQuerySchema } from './deliveries.schemas.ts';
import { signalDeliveriesQueued } from './delivery-signal.ts';
import { newDelivery } from './fan-out.ts';
import { loadEndpoint } from './webhooks.service.ts';

export function toDelivery(row: DeliveryRow) {
  return {
    id: row.id,
    endpoint_id: row.endpoint_id,
    event_id: row.event_id,
    event_type: row.event_type,
    status: row.status,
    attempts: Number(row.attempt_count),
    next_attempt_at: row.next_attempt_at,
    last_status_code: row.last_status_code,
    last_error: row.last_error,
    created_at: row.created_at,
    updated_at: row.updated_at,
    delivered_at: row.delivered_at,
  };
}

function toAttempt(row: AttemptRow) {
  const { id: _id, delivery_id: _delivery, ...attempt } = row;
  return { ...attempt, duration_ms: Number(row.duration_ms) };
}

async function loadDelivery(db: Queryable, id: string): Promise<DeliveryRow> {
  const row = await findDelivery(db, id);
  if (!row) throw new NotFoundProblem(`No webhook delivery ${id}.`);
  return row;
}

export async function listEndpointDeliveriesPage(
  ctx: AppContext,
  endpointId: string,
  query: z.output<typeof WebhookDeliveryListQuerySchema>,
) {
  await loadEndpoint(ctx.db, endpointId);
  return mapPage(await listDeliveryRows(ctx.db, { endpointId, status: query.status }, query), toDelivery);
}

export async function getDelivery(ctx: AppContext, id: string) {
  const row = await loadDelivery(ctx.db, id);
  return { ...toDelivery(row), attempt_log: (await listAttempts(ctx.db, id)).map(toAttempt) };
}

/** Sends a delivery again now (delivered or failed ones too), keeping its webhook-id. */
export async function retryDelivery(ctx: AppContext, auth: AuthContext, id: string, requestId?: string) {
  const row = await inTransaction(ctx.db, async (trx) => {
    const before = await loadDelivery(trx, id);
    const now = nowIso();
    if (before.locked_until && before.locked_until > now)
      throw new ConflictProblem('An attempt of this delivery is under way; look again in a moment.');
    const changes = { status: 'pending' as const, next_attempt_at: now, updated_at: now };
    await updateDelivery(trx, id, changes);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_delivery.retried',
      targetType: 'webhook_delivery',
      targetId: id,
      before: { status: before.status, attempts: before.attempt_count },
    });
    return { ...before, ...changes };
  });
  signalDeliveriesQueued();
  return toDelivery(row);
}

/** Records a `meltwire.test` event for this endpoint only and queues its delivery. */
export async function sendTestEvent(ctx: AppContext, auth: AuthContext, endpointId: string, requestId?: string) {
  const delivery = await inTransaction(ctx.db, async (trx) => {
    const endpoint = await loadEndpoint(trx, endpointId);
    if (!endpoint.enabled) throw new ConflictProblem('This endpoint is disabled; enable it to send a test event.');
    const now = nowIso();
    const data = {
      message: 'A test event from Meltwire: your endpoint is reachable and verifies signatures.',
      endpoint_id: endpointId,
      sent_by: auth.label,
    };
    const eventId = await recordTestEvent(trx, endpointId, data, now);
    const row = newDelivery(endpointId, { id: eventId, type: TEST_EVENT_TYPE }, now, 0);
    await insertDeliveries(trx, [row]);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.test_sent',
      targetType: 'webhook_endpoint',
      targetId: endpointId,
      after: { delivery_id: row.id },
    });
    return row;
  });
  signalDeliveriesQueued();
  return toDelivery(delivery);
}

/** Re-queues every failed delivery to the endpoint created since `since`. */
export async function recoverDeliveries(ctx: AppContext, auth: AuthContext, endpointId: string, since: string, requestId?: string) {
  const requeued = await inTransaction(ctx.db, async (trx) => {
    await loadEndpoint(trx, endpointId);
    const count = await requeueFailedSince(trx, endpointId, since, nowIso());
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.recovered',
      targetType: 'webhook_endpoint',
      targetId: endpointId,
      after: { since, requeued: count },
    });
    return count;
  });
  signalDeliveriesQueued();
  return { requeued };
}

/** Deletes deliveries (with their attempts) older than `days` days (EVENT_RETENTION_DAYS); returns how many. */
export function purgeDeliveries(db: Queryable, days: number, now = new Date()): Promise<number> {
  return deleteDeliveriesBefore(db, new Date(now.getTime() - days * 24 * 60 * 60_000).toISOString());
}
