// One run of a periodic job across every node sharing the database: before each run a node claims
// the job's lease row in one UPDATE that succeeds only if no node has run it within the interval,
// so of two nodes ticking at once exactly one runs the job (the database decides). A node that
// stops simply stops claiming; another takes over at its next tick.
import { hostname } from 'node:os';
import type { Logger } from 'pino';
import type { Queryable } from '../db/transaction.ts';
import { takeJobLease } from './cluster.repository.ts';

/** This process as lease holders and logs name it. */
export const NODE_ID = `${hostname()}:${process.pid}`;

/** A run is due when the last one started at least this share of the interval ago (timers drift). */
const DUE_SHARE = 0.9;

/** True when this node may run `job` now (and has recorded that it does). */
export async function claimJobRun(db: Queryable, job: string, intervalMs: number, now = new Date()): Promise<boolean> {
  const dueBefore = new Date(now.getTime() - intervalMs * DUE_SHARE).toISOString();
  return takeJobLease(db, job, NODE_ID, now.toISOString(), dueBefore);
}

/**
 * Runs `job` every `intervalMs` on an unref'd timer (and once at start with `atStart`), on
 * whichever node claims it first each time; `firstRun` settles when the start-up run is over.
 * stop() ends the timer and waits for a run in progress.
 */
export function startLeasedJob(
  ctx: { db: Queryable; logger: Logger },
  job: string,
  intervalMs: number,
  run: () => Promise<unknown>,
  options: { atStart?: boolean } = {},
): { firstRun: Promise<void>; stop(): Promise<void> } {
  let running: Promise<unknown> = Promise.resolve();
  const tick = () => {
    running = claimJobRun(ctx.db, job, intervalMs)
      .then((mine) => (mine ? run() : ctx.logger.debug({ job }, `${job} ran on another node this time`)))
      .catch((error: unknown) => ctx.logger.error({ err: error, job }, `${job} failed`));
    return running;
  };
  const firstRun = options.atStart ? tick().then(() => undefined) : Promise.resolve();
  const timer = setInterval(tick, intervalMs);
  timer.unref();
  return {
    firstRun,
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
