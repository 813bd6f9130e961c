// The delivery worker: fans out new feed events into deliveries, claims due deliveries (a lease,
// FOR UPDATE SKIP LOCKED on PostgreSQL so several nodes share the work; one worker per process on
// SQLite) and sends up to `concurrency` at once. It polls, and is nudged when events commit in this
// process. Everything lives in the database, so pending deliveries survive a restart; a process
// killed mid-attempt leaves a lease that runs out, and the delivery is sent again (same webhook-id).
import { setMaxListeners } from 'node:events';
import type { AppContext } from '../../context.ts';
import { inTransaction } from '../../db/transaction.ts';
import { nowIso } from '../../lib/time.ts';
import { onEventsCommitted } from '../events/event-signal.ts';
import { attemptDelivery, loadClaimed } from './attempt.ts';
import { batchedWrites } from './batched-writes.ts';
import { claimDueDeliveries } from './deliveries.repository.ts';
import { onDeliveriesQueued } from './delivery-signal.ts';
import { fanOutOnce } from './fan-out.ts';
import { createSender, DELIVERY_TIMEOUT_MS, type Sender } from './sender.ts';

export interface DeliveryWorker {
  /** Look for work now instead of at the next poll. */
  wake(): void;
  /** Stops claiming, abandons attempts in flight (their leases are given back, so they are sent again) and waits for them. */
  stop(): Promise<void>;
}

export interface DeliveryWorkerOptions {
  pollMs?: number;
  concurrency?: number;
  /** How long a claimed delivery stays with this worker; longer than one attempt can take. */
  leaseMs?: number;
  sender?: Sender;
}

export function startDeliveryWorker(ctx: AppContext, options: DeliveryWorkerOptions = {}): DeliveryWorker {
  const pollMs = options.pollMs ?? 500;
  const concurrency = options.concurrency ?? 32;
  const leaseMs = options.leaseMs ?? DELIVERY_TIMEOUT_MS * 2;
  const sender =
    options.sender ?? createSender({ allowPrivate: ctx.config.webhookAllowPrivate, userAgent: `Meltwire-Webhooks/${ctx.config.version}` });
  const stopping = new AbortController();
  // Every attempt in flight listens for the stop.
  setMaxListeners(0, stopping.signal);
  const inFlight = new Set<Promise<void>>();
  const write = batchedWrites(ctx.db);
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<void> | undefined;
  let again = false;
  let fanOutWanted = true;

  async function claim(): Promise<number> {
    const free = concurrency - inFlight.size;
    if (free <= 0) return 0;
    const now = nowIso();
    const lockedUntil = new Date(Date.parse(now) + leaseMs).toISOString();
    const deliveries = await inTransaction(ctx.db, (trx) => claimDueDeliveries(trx, now, lockedUntil, free));
    const claimed = deliveries.length ? await loadClaimed(ctx.db, deliveries) : [];
    for (const one of claimed) {
      const attempt = attemptDelivery(ctx, sender, write, one, stopping.signal)
        .catch((error: unknown) => ctx.logger.error({ err: error, delivery: one.delivery.id }, 'webhook attempt failed to record'))
        .finally(() => {
          inFlight.delete(attempt);
          // Claim again once a quarter of the slots are free (or none is busy): one claim serves many attempts.
          if (concurrency - inFlight.size >= Math.max(1, concurrency / 4) || inFlight.size === 0) run(false);
        });
      inFlight.add(attempt);
    }
    return claimed.length;
  }

  /** A step: fan out (when asked: polls, commits, queued deliveries), then claim into the free slots. */
  async function step(): Promise<void> {
    const fanOut = fanOutWanted;
    fanOutWanted = false;
    try {
      for (let round = 0; fanOut && round < 20 && !stopping.signal.aborted; round++) {
        if (!(await fanOutOnce(ctx)).more) break;
      }
      // Claimed a full batch: more may be due.
      if (!stopping.signal.aborted && (await claim()) > 0 && inFlight.size < concurrency) again = true;
    } catch (error) {
      ctx.logger.error({ err: error }, 'webhook delivery worker step failed');
    }
    if (fanOut && !stopping.signal.aborted) {
      clearTimeout(timer);
      timer = setTimeout(() => run(true), pollMs);
      timer.unref();
    }
  }

  function run(fanOut: boolean): void {
    if (fanOut) fanOutWanted = true;
    if (stopping.signal.aborted) return;
    if (running) {
      again = true;
      return;
    }
    running = step().finally(() => {
      running = undefined;
      if (again) {
        again = false;
        run(false);
      }
    });
  }

  const wake = () => run(true);
  const unsubscribe = [onEventsCommitted(wake), onDeliveriesQueued(wake)];
  wake();
  return {
    wake,
    async stop() {
      stopping.abort();
      clearTimeout(timer);
      unsubscribe.forEach((off) => off());
      await running;
      await Promise.all([...inFlight]);
      sender.close();
    },
  };
}
