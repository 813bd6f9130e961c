// The worker threads that read result files and compute their samples' results, so that an
// import never holds the event loop (one less than the cores, at least one).
import { WorkerPool } from '../../lib/worker-pool.ts';
import type { BuiltSample, ImportOutcome, ImportTask } from './import-work.ts';

export type ImportWorkers = WorkerPool<ImportTask, ImportOutcome, BuiltSample[]>;

export const IMPORT_WORKER_URL = new URL('./import-worker.ts', import.meta.url);

export function createImportWorkers(options: { url?: URL; size?: number } = {}): ImportWorkers {
  return new WorkerPool({ url: options.url ?? IMPORT_WORKER_URL, size: options.size });
}

/** Runs the task; for an upload, the built samples arrive in chunks and are collected here. */
export async function runImportWork(workers: ImportWorkers, task: ImportTask): Promise<{ outcome: ImportOutcome; built: BuiltSample[] }> {
  const built: BuiltSample[] = [];
  const outcome = await workers.run(task, { onChunk: (chunk) => built.push(...chunk) });
  return { outcome, built };
}
