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
 * Runs `job` every `intervalMs` on an unref'd timer, on whichever node claims it first each time;
 * stop() ends the timer and waits for a run in progress.
 */
export function startLeasedJob(
  ctx: { db: Queryable; logger: Logger },
  job: string,
  intervalMs: number,
  run: () => Promise<unknown>,
): { stop(): Promise<void> } {
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = claimJobRun(ctx.db, job, intervalMs)
      .then((mine) => (mine ? run() : undefined))
      .catch((error: unknown) => ctx.logger.error({ err: error, job }, `${job} failed`));
  }, intervalMs);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
