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
 * Leases up to `limit` due deliveries of enabled endpoints to this worker until `lockedUntil`.
 * On PostgreSQL several nodes claim at once: FOR UPDATE SKIP LOCKED gives each row to one of them.
 * On SQLite one worker runs per process and the single writer serialises claims.
 */
export async function claimDueDeliveries(trx: Transaction, now: string, lockedUntil: string, limit: number): Promise<DeliveryRow[]> {
  const due = trx('webhook_deliveries as d')
    .join('webhook_endpoints as e', 'e.id', 'd.endpoint_id')
    .where('d.status', 'pending')
    .where('d.next_attempt_at', '<=', now)
    .where((q) => q.whereNull('d.locked_until').orWhere('d.locked_until', '<', now))
    .where('e.enabled', true)
    .orderBy([{ column: 'd.next_attempt_at' }, { column: 'd.id' }])
    .limit(limit)
    .select('d.id');
  if (isPostgres(trx)) due.forUpdate('d').skipLocked();
  const ids = ((await due) as { id: string }[]).map((r) => r.id);
  if (ids.length === 0) return [];
  await trx('webhook_deliveries').whereIn('id', ids).update({ locked_until: lockedUntil });
  const rows = (await trx<DeliveryRow>('webhook_deliveries').whereIn('id', ids)) as DeliveryRow[];
  const order = new Map(ids.map((id, i) => [id, i]));
  return rows.sort((a, b) => order.get(a.id)! - order.get(b.id)!);
}

/** Gives claimed deliveries back at once (a worker stopping mid-attempt): they are sent again. */
export async function releaseDeliveries(db: Queryable, ids: string[]): Promise<void> {
  if (ids.length) await db('webhook_deliveries').whereIn('id', ids).update({ locked_until: null });
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
    .update({ status: 'pending', next_attempt_at: now, locked_until: null, updated_at: now });
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
