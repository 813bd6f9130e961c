// The only code that touches webhook_deliveries, webhook_attempts and webhook_dispatch.
import { isPostgres } from '../../db/dialect.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Queryable, Transaction } from '../../db/transaction.ts';
import type { Page } from '../../lib/pagination.ts';

export type DeliveryStatus = 'pending' | 'delivered' | 'failed';

export interface DeliveryRow {
  id: string;
  endpoint_id: string;
  event_id: string;
  event_type: string;
  status: DeliveryStatus;
  attempt_count: number;
  next_attempt_at: string | null;
  locked_until: string | null;
  /** The worker holding the lease (server/domain/webhooks/delivery-worker.ts). */
  locked_by: string | null;
  last_status_code: number | null;
  last_error: string | null;
  created_at: string;
  updated_at: string;
  delivered_at: string | null;
}

export interface AttemptRow {
  id: string;
  delivery_id: string;
  number: number;
  started_at: string;
  duration_ms: number;
  status_code: number | null;
  response_excerpt: string | null;
  error: string | null;
  outcome: 'delivered' | 'retry' | 'failed' | 'gone';
  next_attempt_at: string | null;
}

const CHUNK = 200;

/** Inserts deliveries; one that exists already (same endpoint and event) is left as it is. */
export async function insertDeliveries(db: Queryable, rows: DeliveryRow[]): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) {
    await db('webhook_deliveries')
      .insert(rows.slice(i, i + CHUNK))
      .onConflict(['endpoint_id', 'event_id'])
      .ignore();
  }
}

/**
 * Leases up to `limit` of one endpoint's due deliveries to worker `lockedBy` until `lockedUntil`,
 * in one statement, oldest due first and then in fan-out (feed) order. On PostgreSQL several nodes
 * claim at once: FOR UPDATE SKIP LOCKED gives each row to one of them. On SQLite one process owns
 * the file and the single writer serialises claims.
 */
export async function claimDueForEndpoint(
  db: Queryable,
  endpointId: string,
  lease: { now: string; lockedUntil: string; lockedBy: string },
  limit: number,
): Promise<DeliveryRow[]> {
  const due = db('webhook_deliveries')
    .select('id')
    .where({ endpoint_id: endpointId, status: 'pending' })
    .where('next_attempt_at', '<=', lease.now)
    .where((q) => q.whereNull('locked_until').orWhere('locked_until', '<', lease.now))
    .orderBy([{ column: 'next_attempt_at' }, { column: 'id' }])
    .limit(limit);
  if (isPostgres(db)) due.forUpdate().skipLocked();
  const rows = (await db('webhook_deliveries')
    .whereIn('id', due)
    .update({ locked_until: lease.lockedUntil, locked_by: lease.lockedBy })
    .returning('*')) as DeliveryRow[];
  const key = (row: DeliveryRow) => `${row.next_attempt_at} ${row.id}`;
  return rows.sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0));
}

/** Gives claimed deliveries back at once (a worker stopping mid-attempt): they are sent again. */
export async function releaseDeliveries(db: Queryable, ids: string[]): Promise<void> {
  if (ids.length) await db('webhook_deliveries').whereIn('id', ids).update({ locked_until: null, locked_by: null });
}

/**
 * Gives back every lease not held by one of `liveWorkers`; returns how many. Only for SQLite, where
 * one process owns the database: a lease held by no worker of this process was left by a run that
 * died, and waiting for it to run out would only delay the delivery.
 */
export function releaseLeasesExcept(db: Queryable, liveWorkers: string[]): Promise<number> {
  return db('webhook_deliveries')
    .whereNotNull('locked_until')
    .where((q) => q.whereNull('locked_by').orWhereNotIn('locked_by', liveWorkers))
    .update({ locked_until: null, locked_by: null });
}

export function findDelivery(db: Queryable, id: string): Promise<DeliveryRow | undefined> {
  return db<DeliveryRow>('webhook_deliveries').where({ id }).first();
}

/** Returns how many rows changed (0: the delivery is gone). */
export function updateDelivery(db: Queryable, id: string, changes: Partial<DeliveryRow>): Promise<number> {
  return db<DeliveryRow>('webhook_deliveries').where({ id }).update(changes);
}

export async function insertAttempt(db: Queryable, row: AttemptRow): Promise<void> {
  await db<AttemptRow>('webhook_attempts').insert(row);
}

export function listAttempts(db: Queryable, deliveryId: string): Promise<AttemptRow[]> {
  return db<AttemptRow>('webhook_attempts').where({ delivery_id: deliveryId }).orderBy('number');
}

const DELIVERY_KEYSET: KeysetColumn<DeliveryRow>[] = [{ column: 'id', order: 'desc', key: 'id', valueOf: (row) => row.id }];

/** One endpoint's deliveries, newest first. */
export function listDeliveryRows(db: Queryable, filters: { endpointId: string; status?: DeliveryStatus }, page: PageRequest) {
  const query = db<DeliveryRow>('webhook_deliveries').select('*').where('endpoint_id', filters.endpointId);
  if (filters.status) query.where('status', filters.status);
  return keysetPage(query, DELIVERY_KEYSET, page) as Promise<Page<DeliveryRow>>;
}

/** Puts an endpoint's failed deliveries created since `since` back in the queue; returns how many. */
export function requeueFailedSince(db: Queryable, endpointId: string, since: string, now: string): Promise<number> {
  return db('webhook_deliveries')
    .where({ endpoint_id: endpointId, status: 'failed' })
    .where('created_at', '>=', since)
    .update({ status: 'pending', next_attempt_at: now, locked_until: null, locked_by: null, updated_at: now });
}

/** Deletes deliveries (and their attempts) created before `before`; returns how many. */
export function deleteDeliveriesBefore(db: Queryable, before: string): Promise<number> {
  return db('webhook_deliveries').where('created_at', '<', before).delete();
}

/** The feed cursor the fan-out has reached. */
export async function readDispatchCursor(db: Queryable): Promise<string | null> {
  const row = await db('webhook_dispatch').where({ name: 'fan-out' }).first();
  return (row?.cursor as string | null) ?? null;
}

/**
 * Locks the fan-out row for this transaction and returns its cursor, or undefined when another
 * node holds it (PostgreSQL: that node is fanning out now; this one skips its turn).
 */
export async function lockDispatchCursor(trx: Transaction): Promise<{ cursor: string | null } | undefined> {
  const query = trx('webhook_dispatch').where({ name: 'fan-out' }).select('cursor');
  if (isPostgres(trx)) query.forUpdate().skipLocked();
  const [row] = (await query) as { cursor: string | null }[];
  return row;
}

export async function saveDispatchCursor(trx: Transaction, cursor: string | null, now: string): Promise<void> {
  await trx('webhook_dispatch').where({ name: 'fan-out' }).update({ cursor, updated_at: now });
}
