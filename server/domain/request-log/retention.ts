import type { Db } from '../../db/knex.ts';
import { deleteRequestLogBefore } from './request-log.repository.ts';

/** Deletes request log entries older than `days` days; returns how many. */
export function purgeRequestLog(db: Db, days: number, now = new Date()): Promise<number> {
  return deleteRequestLogBefore(db, new Date(now.getTime() - days * 24 * 60 * 60_000).toISOString());
}
