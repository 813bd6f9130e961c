// Fan-out: reads the change feed after the stored cursor and creates one delivery per event and
// subscribed endpoint, then moves the cursor, all in one transaction. Deliveries are made here
// rather than in each event's transaction so that webhooks carry exactly the feed's events in the
// feed's order (the feed's horizon already guarantees none is skipped), a file import does not
// also write events × endpoints rows under SQLite's single writer, and an endpoint created later
// receives nothing recorded before it (docs/decisions/0007-event-feed.md).
import type { AppContext } from '../../context.ts';
import { inTransaction } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { type EventRow, listFeedRows } from '../events/events.repository.ts';
import { type DeliveryRow, insertDeliveries, lockDispatchCursor, readDispatchCursor, saveDispatchCursor } from './deliveries.repository.ts';
import { listEnabledEndpoints, type WebhookEndpointRow } from './webhooks.repository.ts';

const FAN_OUT_BATCH = 500;

export function newDelivery(endpointId: string, event: Pick<EventRow, 'id' | 'type'>, now: string, firstDelaySeconds: number): DeliveryRow {
  return {
    id: newId('whd'),
    endpoint_id: endpointId,
    event_id: event.id,
    event_type: event.type,
    status: 'pending',
    attempt_count: 0,
    next_attempt_at: new Date(Date.parse(now) + firstDelaySeconds * 1000).toISOString(),
    locked_until: null,
    locked_by: null,
    last_status_code: null,
    last_error: null,
    created_at: now,
    updated_at: now,
    delivered_at: null,
  };
}

function subscribers(endpoints: WebhookEndpointRow[]) {
  return endpoints.map((e) => ({ id: e.id, createdAt: e.created_at, types: new Set(JSON.parse(e.event_types_json) as string[]) }));
}

/** One batch of fan-out; returns how many events it read (0 = caught up, or another node is at it). */
export async function fanOutOnce(ctx: Pick<AppContext, 'db' | 'config'>): Promise<{ events: number; deliveries: number; more: boolean }> {
  // The feed is read outside the transaction: it then has no transaction id of its own to hold
  // back the horizon. The cursor is re-read under lock; if another node moved it, this turn is skipped.
  const cursor = await readDispatchCursor(ctx.db);
  const page = await listFeedRows(ctx.db, {}, { after: cursor ?? undefined, limit: FAN_OUT_BATCH }, { withData: false });
  if (page.data.length === 0) return { events: 0, deliveries: 0, more: false };
  const endpoints = subscribers(await listEnabledEndpoints(ctx.db));
  const now = nowIso();
  const firstDelay = ctx.config.webhookRetryDelays[0] ?? 0;
  const rows = page.data.flatMap((event) =>
    endpoints
      .filter((e) => e.types.has(event.type) && e.createdAt <= event.occurred_at)
      .map((e) => newDelivery(e.id, event, now, firstDelay)),
  );
  const moved = await inTransaction(ctx.db, async (trx) => {
    const locked = await lockDispatchCursor(trx);
    if (!locked || locked.cursor !== cursor) return false;
    await insertDeliveries(trx, rows);
    await saveDispatchCursor(trx, page.next_cursor, now);
    return true;
  });
  return moved ? { events: page.data.length, deliveries: rows.length, more: page.has_more } : { events: 0, deliveries: 0, more: false };
}
