// The only code that touches the events table: an append-only record of what happened, written in
// the caller's transaction so that an event exists exactly when its change was committed (a
// transactional outbox). The change feed reads it through listFeedRows; webhook delivery fans out
// from that same feed, so both carry the same events in the same order.
import type { Knex } from 'knex';
import { bulkInsert } from '../../db/bulk-insert.ts';
import { isPostgres } from '../../db/dialect.ts';
import { type KeysetColumn, keysetPage } from '../../db/keyset.ts';
import type { Queryable } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { type CursorValues, decodeCursor, encodeCursor } from '../../lib/pagination.ts';
import { ValidationProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import { signalEventsCommitted } from './event-signal.ts';

/** Event types (also the webhook types), `resource.happening`. */
export const EVENT_TYPES = [
  'sample.created',
  'sample.released',
  'sample.amended',
  'sample.out_of_spec',
  'import.completed',
  'import.failed',
  'standardization.flagged',
  'standardization.activated',
  'control.out_of_control',
] as const;

export type EventType = (typeof EVENT_TYPES)[number];

/** Sent to one endpoint on request; never in the feed. */
export const TEST_EVENT_TYPE = 'meltwire.test';

export interface EventRow {
  sequence: number | string;
  id: string;
  type: string;
  occurred_at: string;
  instrument_id: string | null;
  endpoint_id: string | null;
  data_json: string;
  /** PostgreSQL only: the writing transaction (xid8, as text). */
  txid?: string;
}

export interface NewEvent<T = unknown> {
  type: EventType;
  data: T;
  occurredAt?: string;
  /** The instrument the event is about, when there is one: restricted keys see only theirs. */
  instrumentId?: string | null;
}

function toRow(event: NewEvent | (Omit<NewEvent, 'type'> & { type: string; endpointId: string })) {
  return {
    id: newId('evt'),
    type: event.type,
    occurred_at: event.occurredAt ?? nowIso(),
    instrument_id: event.instrumentId ?? null,
    endpoint_id: 'endpointId' in event ? event.endpointId : null,
    data_json: JSON.stringify(event.data),
  };
}

/** Appends one event inside the caller's transaction; returns its id. */
export async function recordEvent<T>(
  trx: Knex.Transaction,
  type: EventType,
  data: T,
  options: { occurredAt?: string; instrumentId?: string | null } = {},
): Promise<string> {
  return (await recordEvents(trx, [{ type, data, ...options }]))[0];
}

/** Appends events in order inside the caller's transaction (a file import records thousands). */
export async function recordEvents(trx: Knex.Transaction, events: NewEvent[]): Promise<string[]> {
  const rows = events.map(toRow);
  await bulkInsert(trx, 'events', rows);
  trx.executionPromise?.then(signalEventsCommitted, () => undefined);
  return rows.map((r) => r.id);
}

/** A `meltwire.test` event for one endpoint only: delivered to it, never in the feed. */
export async function recordTestEvent(db: Queryable, endpointId: string, data: unknown, occurredAt?: string): Promise<string> {
  const row = toRow({ type: TEST_EVENT_TYPE, data, endpointId, occurredAt });
  await db('events').insert(row);
  return row.id;
}

/**
 * The feed's order. On SQLite (one writer) the sequence alone. On PostgreSQL the writing
 * transaction first, then the sequence: a transaction that began earlier may take its sequence
 * later, so "sequence below the horizon" alone could hand out 5 while 3 is still uncommitted and
 * then never return 3; ordering by transaction id cannot (see docs/decisions/0007-event-feed.md).
 */
function feedKeyset(db: Queryable): KeysetColumn<EventRow>[] {
  const sequence: KeysetColumn<EventRow> = { column: 'events.sequence', order: 'asc', key: 's', valueOf: (row) => Number(row.sequence) };
  if (!isPostgres(db)) return [sequence];
  return [{ column: 'events.txid', order: 'asc', key: 'x', valueOf: (row) => String(row.txid) }, sequence];
}

function checkedCursor(db: Queryable, cursor: string | undefined): string | undefined {
  if (!cursor) return undefined;
  const keys = feedKeyset(db).map((c) => c.key);
  const values = decodeCursor<CursorValues>(cursor, keys);
  const valid = Number.isSafeInteger(values.s) && (!keys.includes('x') || /^\d{1,20}$/.test(String(values.x)));
  if (!valid) throw new ValidationProblem([{ location: 'query.after', message: 'Not a cursor returned by this API.' }]);
  return cursor;
}

export interface FeedFilters {
  types?: string[];
  onlyInstrumentIds?: string[] | null;
}

export interface FeedPage {
  /** Without data_json when asked withData: false. */
  data: EventRow[];
  /** Where to resume: after the last event returned, or the cursor given when nothing new is safe yet. */
  next_cursor: string | null;
  has_more: boolean;
}

/**
 * Events after the cursor that are safe to hand out. On PostgreSQL only events whose transaction
 * id is below the oldest still-running transaction (pg_snapshot_xmin): every transaction below it
 * has committed or rolled back, so nothing can later appear before an event handed out.
 */
export async function listFeedRows(
  db: Queryable,
  filters: FeedFilters,
  page: { after?: string; limit: number },
  options: { withData: boolean } = { withData: true },
): Promise<FeedPage> {
  const keyset = feedKeyset(db);
  const columns = options.withData
    ? ['events.*']
    : ['sequence', 'id', 'type', 'occurred_at', 'instrument_id', ...(isPostgres(db) ? ['txid'] : [])];
  const query = db<EventRow>('events').select(columns).whereNull('events.endpoint_id');
  if (isPostgres(db)) query.whereRaw('events.txid < pg_snapshot_xmin(pg_current_snapshot())');
  if (filters.types?.length) query.whereIn('events.type', filters.types);
  if (filters.onlyInstrumentIds) query.whereIn('events.instrument_id', filters.onlyInstrumentIds);
  const after = checkedCursor(db, page.after);
  const result = await keysetPage(query, keyset, { cursor: after, limit: page.limit });
  const last = result.data[result.data.length - 1];
  const next = last ? encodeCursor(Object.fromEntries(keyset.map((c) => [c.key, c.valueOf(last)]))) : (after ?? null);
  return { data: result.data, next_cursor: next, has_more: result.next_cursor !== null };
}

export function findEventRow(db: Queryable, id: string): Promise<EventRow | undefined> {
  return db<EventRow>('events').where({ id }).first();
}

export function findEventRows(db: Queryable, ids: string[]): Promise<EventRow[]> {
  return db<EventRow>('events').whereIn('id', ids);
}

/** Deletes events that occurred before `before`; returns how many. */
export function deleteEventsBefore(db: Queryable, before: string): Promise<number> {
  return db('events').where('occurred_at', '<', before).delete();
}
