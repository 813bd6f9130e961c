// Ages out what is kept only for a while: request log entries (REQUEST_LOG_RETENTION_DAYS),
// Idempotency-Key records (24 hours), events and webhook deliveries (EVENT_RETENTION_DAYS). Runs
// once at start, then hourly on an unref'd timer so it never keeps the process alive; stop() ends
// it on shutdown. With several nodes on one database, each hour's run happens on one node only
// (a job lease, cluster/job-lease.ts).
import { NODE_ID, startLeasedJob } from './cluster/job-lease.ts';
import type { AppContext } from './context.ts';
import { purgeEvents } from './domain/events/events.service.ts';
import { purgeExpiredIdempotencyKeys } from './domain/idempotency/idempotency.repository.ts';
import { purgeRequestLog } from './domain/request-log/retention.ts';
import { purgeDeliveries } from './domain/webhooks/deliveries.service.ts';

const HOUSEKEEPING_INTERVAL_MS = 60 * 60_000;

export interface Housekeeping {
  /** The sweep started at start; resolves when it is done. */
  firstRun: Promise<void>;
  /** Stops the timer and waits for a sweep in progress, so the database can be closed after it. */
  stop(): Promise<void>;
}

export async function sweepOnce(
  ctx: Pick<AppContext, 'db' | 'config' | 'logger'>,
  now = new Date(),
): Promise<{ requestLog: number; idempotencyKeys: number; events: number; deliveries: number }> {
  const requestLog = await purgeRequestLog(ctx.db, ctx.config.requestLogRetentionDays, now);
  const idempotencyKeys = await purgeExpiredIdempotencyKeys(ctx.db, now);
  const events = await purgeEvents(ctx.db, ctx.config.eventRetentionDays, now);
  const deliveries = await purgeDeliveries(ctx.db, ctx.config.eventRetentionDays, now);
  ctx.logger.info({ job: 'housekeeping', node: NODE_ID, requestLog, idempotencyKeys, events, deliveries }, 'housekeeping ran');
  return { requestLog, idempotencyKeys, events, deliveries };
}

export function startHousekeeping(ctx: Pick<AppContext, 'db' | 'config' | 'logger'>, intervalMs = HOUSEKEEPING_INTERVAL_MS): Housekeeping {
  return startLeasedJob(ctx, 'housekeeping', intervalMs, () => sweepOnce(ctx), { atStart: true });
}
