// The delivery log and what a user does with it: list an endpoint's deliveries, read one with every
// attempt, send one again, send a test event, re-queue what failed since a time.
import type { Queryable } from '../../db/transaction.ts';
import { deleteDeliveriesBefore } from './deliveries.repository.ts';

/** Deletes deliveries (with their attempts) older than `days` days (EVENT_RETENTION_DAYS); returns how many. */
export function purgeDeliveries(db: Queryable, days: number, now = new Date()): Promise<number> {
  return deleteDeliveriesBefore(db, new Date(now.getTime() - days * 24 * 60 * 60_000).toISOString());
}
