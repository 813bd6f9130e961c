// The pull change feed: events in feed order, resumable from a cursor, never skipping one (the
// horizon is kept by listFeedRows), limited to a restricted key's instruments.
import type { AppContext } from '../../context.ts';
import type { Queryable } from '../../db/transaction.ts';
import { NotFoundProblem } from '../../lib/problems.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { deleteEventsBefore, type EventRow, type EventType, findEventRow, listFeedRows } from './events.repository.ts';
import type { EventFeedQuerySchema } from './events.schemas.ts';

export function toEventView(row: EventRow) {
  return {
    id: row.id,
    sequence: Number(row.sequence),
    type: row.type as EventType,
    occurred_at: row.occurred_at,
    instrument_id: row.instrument_id,
    data: JSON.parse(row.data_json) as Record<string, unknown>,
  };
}

export type EventView = ReturnType<typeof toEventView>;

export async function listEventFeed(ctx: AppContext, auth: AuthContext, query: z.output<typeof EventFeedQuerySchema>) {
  const page = await listFeedRows(
    ctx.db,
    { types: query.types, onlyInstrumentIds: auth.instrumentIds },
    { after: query.after, limit: query.limit },
  );
  return { data: page.data.map(toEventView), next_cursor: page.next_cursor, has_more: page.has_more };
}

export async function getEvent(ctx: AppContext, auth: AuthContext, id: string): Promise<EventView> {
  const row = await findEventRow(ctx.db, id);
  const visible =
    row && !row.endpoint_id && (!auth.instrumentIds || (row.instrument_id !== null && auth.instrumentIds.includes(row.instrument_id)));
  if (!visible) throw new NotFoundProblem(`No event ${id}.`);
  return toEventView(row);
}

/** Deletes events older than `days` days (EVENT_RETENTION_DAYS); returns how many. */
export function purgeEvents(db: Queryable, days: number, now = new Date()): Promise<number> {
  return deleteEventsBefore(db, new Date(now.getTime() - days * 24 * 60 * 60_000).toISOString());
}
