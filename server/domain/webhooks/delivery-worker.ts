// The delivery worker: fans out new feed events into deliveries, claims due deliveries per endpoint
// (a lease; FOR UPDATE SKIP LOCKED on PostgreSQL so several nodes share the work, one process per
// SQLite file) and sends up to `perEndpoint` at once to each endpoint, `concurrency` in all, so a
// slow receiver cannot hold every slot. It polls, and is nudged when events commit in this process.
// Everything lives in the database, so pending deliveries survive a restart. A process killed
// mid-attempt leaves its leases behind: on PostgreSQL they run out (another node may be the one
// holding them), on SQLite the next start gives them back at once. Either way the delivery is sent
// again with the same webhook-id.
import { randomUUID } from 'node:crypto';
import { setMaxListeners } from 'node:events';
import type { AppContext } from '../../context.ts';
import { isPostgres } from '../../db/dialect.ts';
import { inTransaction } from '../../db/transaction.ts';
import { nowIso } from '../../lib/time.ts';
import { onEventsCommitted } from '../events/event-signal.ts';
import { attemptDelivery, loadEvents } from './attempt.ts';
import { batchedWrites } from './batched-writes.ts';
import { claimDueForEndpoint, type DeliveryRow, releaseLeasesExcept } from './deliveries.repository.ts';
import { onDeliveriesQueued } from './delivery-signal.ts';
import { fanOutOnce } from './fan-out.ts';
import { createSender, DELIVERY_TIMEOUT_MS, type Sender } from './sender.ts';
import { listEnabledEndpoints, type WebhookEndpointRow } from './webhooks.repository.ts';

export interface DeliveryWorker {
  /** Look for work now instead of at the next poll. */
  wake(): void;
  /** Stops claiming, abandons attempts in flight (their leases are given back, so they are sent again) and waits for them. */
  stop(): Promise<void>;
}

export interface DeliveryWorkerOptions {
  pollMs?: number;
  /** Attempts in flight at once, over all endpoints. */
  concurrency?: number;
  /** Attempts in flight at once to one endpoint. */
  perEndpoint?: number;
  /** How long a claimed delivery stays with this worker; longer than one attempt can take. */
  leaseMs?: number;
  sender?: Sender;
}

/** The workers running in this process, by the id their leases carry. */
const liveWorkers = new Set<string>();

export function startDeliveryWorker(ctx: AppContext, options: DeliveryWorkerOptions = {}): DeliveryWorker {
  const pollMs = options.pollMs ?? 500;
  const concurrency = options.concurrency ?? 128;
  const perEndpoint = Math.min(options.perEndpoint ?? 16, concurrency);
  const leaseMs = options.leaseMs ?? DELIVERY_TIMEOUT_MS * 2;
  const sender =
    options.sender ??
    createSender({
      allowPrivate: ctx.config.webhookAllowPrivate,
      userAgent: `Meltwire-Webhooks/${ctx.config.version}`,
      maxSocketsPerHost: perEndpoint,
    });
  const workerId = `${process.pid}-${randomUUID()}`;
  liveWorkers.add(workerId);
  const stopping = new AbortController();
  // Every attempt in flight listens for the stop.
  setMaxListeners(0, stopping.signal);
  /** Attempts not finished (sent or being recorded), for stop() to wait for. */
  const inFlight = new Set<Promise<void>>();
  /** HTTP exchanges under way, in all and per endpoint: the slots. */
  let sending = 0;
  const busy = new Map<string, number>();
  const write = batchedWrites(ctx.db);
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<void> | undefined;
  let again = false;
  let fanOutWanted = true;
  let rotation = 0;
  const ready = isPostgres(ctx.db)
    ? Promise.resolve()
    : releaseLeasesExcept(ctx.db, [...liveWorkers]).then((released) => {
        if (released > 0) ctx.logger.info({ released }, 'webhook deliveries left mid-attempt by the previous run are sent again');
      });

  /** One transaction: for each enabled endpoint with free slots, its due deliveries (endpoints taken in turn). */
  async function claimBatch(): Promise<{ delivery: DeliveryRow; endpoint: WebhookEndpointRow }[]> {
    let free = concurrency - sending;
    if (free <= 0) return [];
    const now = nowIso();
    const lease = { now, lockedUntil: new Date(Date.parse(now) + leaseMs).toISOString(), lockedBy: workerId };
    return inTransaction(ctx.db, async (trx) => {
      const endpoints = await listEnabledEndpoints(trx);
      const first = rotation++ % Math.max(1, endpoints.length);
      const claimed: { delivery: DeliveryRow; endpoint: WebhookEndpointRow }[] = [];
      for (const endpoint of [...endpoints.slice(first), ...endpoints.slice(0, first)]) {
        const limit = Math.min(free, perEndpoint - (busy.get(endpoint.id) ?? 0));
        if (limit <= 0) continue;
        const rows = await claimDueForEndpoint(trx, endpoint.id, lease, limit);
        for (const delivery of rows) claimed.push({ delivery, endpoint });
        free -= rows.length;
        if (free <= 0) break;
      }
      return claimed;
    });
  }

  async function claim(): Promise<void> {
    const batch = await claimBatch();
    if (batch.length === 0) return;
    const events = await loadEvents(
      ctx.db,
      batch.map((c) => c.delivery),
    );
    for (const { delivery, endpoint } of batch) {
      sending++;
      busy.set(endpoint.id, (busy.get(endpoint.id) ?? 0) + 1);
      let slotFree = false;
      // The slot is the HTTP exchange; recording the attempt goes on without it.
      const freeSlot = () => {
        if (slotFree) return;
        slotFree = true;
        sending--;
        busy.set(endpoint.id, busy.get(endpoint.id)! - 1);
        // Runs coalesce: a burst of finished exchanges makes one or two claims.
        run(false);
      };
      const claimed = { delivery, endpoint, event: events.get(delivery.event_id) };
      const attempt = attemptDelivery(ctx, sender, write, claimed, stopping.signal, freeSlot)
        .catch((error: unknown) => ctx.logger.error({ err: error, delivery: delivery.id }, 'webhook attempt failed to record'))
        .finally(() => {
          inFlight.delete(attempt);
          freeSlot();
        });
      inFlight.add(attempt);
    }
  }

  /** A step: fan out (when asked: polls, commits, queued deliveries), then claim into the free slots. */
  async function step(): Promise<void> {
    const fanOut = fanOutWanted;
    fanOutWanted = false;
    try {
      await ready;
      for (let round = 0; fanOut && round < 20 && !stopping.signal.aborted; round++) {
        if (!(await fanOutOnce(ctx)).more) break;
      }
      if (!stopping.signal.aborted) await claim();
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
      liveWorkers.delete(workerId);
      sender.close();
    },
  };
}
