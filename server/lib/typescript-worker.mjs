// Entry of every worker thread whose module is TypeScript source (see worker-pool.ts). Node 20
// does not apply `--import tsx` to a worker's own entry module, so tsx is registered here and the
// module named in workerData is imported after it.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
