// Watches the instrument feeds: once an agent has been silent for AGENT_STALE_MINUTES, the users
// who asked for `feed_stale` alerts are told (once per silence; the next heartbeat re-arms it).
// A timer in start.ts runs the check every minute, on one node at a time (a job lease).
import { startLeasedJob } from '../../cluster/job-lease.ts';
import type { AppContext } from '../../context.ts';
import { inTransaction } from '../../db/transaction.ts';
import { queueAlert } from '../alerts/alerts.service.ts';
import { markStaleAlerted, silentFeedRows } from './feeds.repository.ts';

const CHECK_INTERVAL_MS = 60_000;

/** Queues the alert for every feed that became stale; returns how many did. */
export async function alertStaleFeeds(ctx: Pick<AppContext, 'db' | 'config'>, now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - ctx.config.agentStaleMinutes * 60_000).toISOString();
  const silent = await silentFeedRows(ctx.db, before);
  for (const feed of silent) {
    await inTransaction(ctx.db, async (trx) => {
      await queueAlert(trx, {
        kind: 'feed_stale',
        instrumentId: feed.instrument_id,
        subject: `${feed.instrument_code}: no word from its instrument PC agent since ${feed.reported_at}`,
        lines: [
          `The agent on ${feed.agent_host ?? 'the instrument PC'} last reported at ${feed.reported_at} (more than ${ctx.config.agentStaleMinutes} minutes ago).`,
          `Files waiting then: ${feed.queue_length}. Last file: ${feed.last_file_name ?? 'none'}${feed.last_file_at ? ` at ${feed.last_file_at}` : ''}.`,
          feed.last_error ? `Last error: ${feed.last_error}` : 'No error was reported.',
          'Results may not be reaching Meltwire: check that the PC is on, the agent runs and the network is up.',
        ],
        path: '/',
      });
      await markStaleAlerted(trx, feed.instrument_id, now.toISOString());
    });
  }
  return silent.length;
}

export function startFeedWatch(ctx: Pick<AppContext, 'db' | 'config' | 'logger'>, intervalMs = CHECK_INTERVAL_MS) {
  return startLeasedJob(ctx, 'feed-stale-check', intervalMs, () => alertStaleFeeds(ctx));
}
