// Attempts finish many at a time; recording each in its own transaction made the database the
// bottleneck of delivery. Writes queued in the same turn of the event loop share one transaction.
// If it fails, every write in it fails: those deliveries keep their lease and are sent again
// when it runs out (same webhook-id), as after a crash.
import { inTransaction, type Queryable, type Transaction } from '../../db/transaction.ts';

type Write = (trx: Transaction) => Promise<void>;

export function batchedWrites(db: Queryable): (write: Write) => Promise<void> {
  let queue: { write: Write; resolve: () => void; reject: (error: unknown) => void }[] = [];
  const flush = () => {
    const jobs = queue;
    queue = [];
    inTransaction(db, async (trx) => {
      for (const job of jobs) await job.write(trx);
    }).then(
      () => jobs.forEach((job) => job.resolve()),
      (error: unknown) => jobs.forEach((job) => job.reject(error)),
    );
  };
  return (write) =>
    new Promise<void>((resolve, reject) => {
      if (queue.length === 0) setImmediate(flush);
      queue.push({ write, resolve, reject });
    });
}
