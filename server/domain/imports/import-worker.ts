// Entry module of an import worker thread (started by import-workers.ts): runs import tasks.
import { serveWorkerTasks } from '../../lib/worker-task.ts';
import { type BuiltSample, type ImportOutcome, type ImportTask, runImportTask } from './import-work.ts';

serveWorkerTasks<ImportTask, ImportOutcome, BuiltSample[]>(runImportTask);
