// The only code that touches the events table: an append-only record of what happened, written in
// the caller's transaction so that an event exists exactly when its change was committed. Any
// feature records its events here; the change feed and webhook delivery will read them.
import type { Knex } from 'knex';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';

/** Event types (also the future webhook types), `resource.happening`. */
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

export interface EventRow {
  id: string;
  type: string;
  occurred_at: string;
  data_json: string;
}

export interface DomainEvent<T = unknown> {
  id: string;
  type: EventType;
  occurred_at: string;
  data: T;
}

/** Appends one event inside the caller's transaction and returns it. */
export async function recordEvent<T>(trx: Knex.Transaction, type: EventType, data: T, occurredAt = nowIso()): Promise<DomainEvent<T>> {
  const event = { id: newId('evt'), type, occurred_at: occurredAt, data };
  await trx<EventRow>('events').insert({ id: event.id, type, occurred_at: occurredAt, data_json: JSON.stringify(data) });
  return event;
}
