// The delivery worker: fans out new feed events into deliveries, claims due deliveries (a lease,
// FOR UPDATE SKIP LOCKED on PostgreSQL so several nodes share the work; one worker per process on
// SQLite) and sends up to `concurrency` at once. It polls, and is nudged when events commit in this
// process. Everything lives in the database, so pending deliveries survive a restart; a process
// killed mid-attempt leaves a lease that runs out, and the delivery is sent again (same webhook-id).
import type { AppContext } from '../../context.ts';
import { inTransaction } from '../../db/transaction.ts';
import { nowIso } from '../../lib/time.ts';
import { onEventsCommitted } from '../events/event-signal.ts';
import { attemptDelivery } from './attempt.ts';
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
  const concurrency = options.concurrency ?? 16;
  const leaseMs = options.leaseMs ?? DELIVERY_TIMEOUT_MS * 2;
  const sender =
    options.sender ?? createSender({ allowPrivate: ctx.config.webhookAllowPrivate, userAgent: `Meltwire-Webhooks/${ctx.config.version}` });
  const stopping = new AbortController();
  const inFlight = new Set<Promise<void>>();
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<void> | undefined;
  let again = false;

  const schedule = (ms: number) => {
    if (stopping.signal.aborted) return;
    clearTimeout(timer);
    timer = setTimeout(wake, ms);
    timer.unref();
  };

  async function claim(): Promise<number> {
    const free = concurrency - inFlight.size;
    if (free <= 0) return 0;
    const now = nowIso();
    const lockedUntil = new Date(Date.parse(now) + leaseMs).toISOString();
    const claimed = await inTransaction(ctx.db, (trx) => claimDueDeliveries(trx, now, lockedUntil, free));
    for (const delivery of claimed) {
      const attempt = attemptDelivery(ctx, sender, delivery, stopping.signal)
        .catch((error: unknown) => ctx.logger.error({ err: error, delivery: delivery.id }, 'webhook attempt failed to record'))
        .finally(() => {
          inFlight.delete(attempt);
          wake();
        });
      inFlight.add(attempt);
    }
    return claimed.length;
  }

  async function tick(): Promise<void> {
    let busy = false;
    try {
      for (let round = 0; round < 20 && !stopping.signal.aborted; round++) {
        const fanned = await fanOutOnce(ctx);
        if (!fanned.more) break;
      }
      if (!stopping.signal.aborted) busy = (await claim()) > 0;
    } catch (error) {
      ctx.logger.error({ err: error }, 'webhook delivery worker step failed');
    }
    schedule(busy ? 0 : pollMs);
  }

  function wake(): void {
    if (stopping.signal.aborted) return;
    if (running) {
      again = true;
      return;
    }
    running = tick().finally(() => {
      running = undefined;
      if (again) {
        again = false;
        wake();
      }
    });
  }

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
