// One attempt of one claimed delivery: the Standard Webhooks message (webhook-id = the event id,
// the same on every retry; a fresh timestamp and signatures per attempt), sent, then recorded with
// what it means for the delivery (retry when, failed, delivered) and for the endpoint (410 or five
// days of failures disable it).
import type { AppContext } from '../../context.ts';
import type { Queryable, Transaction } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { type EventRow, findEventRows } from '../events/events.repository.ts';
import { type DeliveryRow, insertAttempt, releaseDeliveries, updateDelivery } from './deliveries.repository.ts';
import { endpointAfterAttempt } from './endpoint-health.ts';
import { nextStep } from './retry-policy.ts';
import type { Sender, SendResult } from './sender.ts';
import { signedHeaders } from './signature.ts';
import type { WebhookEndpointRow } from './webhooks.repository.ts';

/** Runs a write in a transaction shared with others queued at the same time (batched-writes.ts). */
export type WriteBatch = (write: (trx: Transaction) => Promise<void>) => Promise<void>;

/**
 * The body every attempt sends: `{ type, timestamp, sequence, data }`, data as stored with the
 * event; `sequence` is the event's place in the feed, for a receiver that needs feed order back.
 */
export function messageBody(event: { type: string; occurred_at: string; sequence: number | string; data_json: string }): string {
  const head = `"type":${JSON.stringify(event.type)},"timestamp":${JSON.stringify(event.occurred_at)}`;
  return `{${head},"sequence":${Number(event.sequence)},"data":${event.data_json}}`;
}

/** The secrets to sign with: the current one, and the previous one during a rotation's overlap. */
export function signingSecrets(endpoint: WebhookEndpointRow, now: string): string[] {
  const overlap = endpoint.previous_secret && endpoint.previous_secret_expires_at && endpoint.previous_secret_expires_at > now;
  return overlap ? [endpoint.secret, endpoint.previous_secret!] : [endpoint.secret];
}

async function record(
  ctx: AppContext,
  write: WriteBatch,
  delivery: DeliveryRow,
  endpoint: WebhookEndpointRow,
  result: SendResult,
  startedAt: string,
) {
  const finishedAt = new Date();
  const attempts = delivery.attempt_count + 1;
  const { outcome, nextAt } = nextStep(result, attempts, ctx.config.webhookRetryDelays, finishedAt);
  await write(async (trx) => {
    const now = finishedAt.toISOString();
    const updated = await updateDelivery(trx, delivery.id, {
      status: outcome === 'delivered' ? 'delivered' : outcome === 'retry' ? 'pending' : 'failed',
      attempt_count: attempts,
      next_attempt_at: nextAt,
      locked_until: null,
      locked_by: null,
      last_status_code: result.status ?? null,
      last_error: result.error ?? (outcome === 'delivered' ? null : `HTTP ${result.status}`),
      updated_at: now,
      delivered_at: outcome === 'delivered' ? now : null,
    });
    // Deleted meanwhile (with its endpoint): nothing to record.
    if (updated === 0) return;
    await insertAttempt(trx, {
      id: newId('wha'),
      delivery_id: delivery.id,
      number: attempts,
      started_at: startedAt,
      duration_ms: Math.round(result.durationMs * 10) / 10,
      status_code: result.status ?? null,
      response_excerpt: result.excerpt,
      error: result.error ?? null,
      outcome,
      next_attempt_at: nextAt,
    });
    await endpointAfterAttempt(ctx, trx, endpoint, outcome, now);
  });
}

/** A claimed delivery with its endpoint (as loaded with the claim) and event. */
export interface ClaimedDelivery {
  delivery: DeliveryRow;
  endpoint: WebhookEndpointRow;
  /** Undefined once the event is past its retention. */
  event: EventRow | undefined;
}

/** The events of a claimed batch, loaded at once, by id. */
export async function loadEvents(db: Queryable, deliveries: DeliveryRow[]): Promise<Map<string, EventRow>> {
  const rows = await findEventRows(db, [...new Set(deliveries.map((d) => d.event_id))]);
  return new Map(rows.map((e) => [e.id, e]));
}

/**
 * Sends one claimed delivery and records the attempt; a stop mid-attempt gives the lease back
 * instead. `onSent` is called when the HTTP exchange is over, before the attempt is recorded (the
 * worker frees the endpoint's slot then: recording waits for the database, not for the receiver).
 */
export async function attemptDelivery(
  ctx: AppContext,
  sender: Sender,
  write: WriteBatch,
  claimed: ClaimedDelivery,
  signal: AbortSignal,
  onSent: () => void = () => undefined,
): Promise<void> {
  const { delivery, endpoint, event } = claimed;
  const startedAt = nowIso();
  let result: SendResult;
  if (event) {
    const body = messageBody(event);
    const timestamp = Math.floor(Date.now() / 1000);
    const headers = signedHeaders(signingSecrets(endpoint, startedAt), event.id, timestamp, body);
    result = await sender.send(endpoint.url, headers, body, signal).finally(onSent);
  } else {
    onSent();
    result = { durationMs: 0, excerpt: null, permanent: true, error: 'the event is past EVENT_RETENTION_DAYS and was deleted' };
  }
  if (result.aborted) return releaseDeliveries(ctx.db, [delivery.id]);
  await record(ctx, write, delivery, endpoint, result, startedAt);
}
