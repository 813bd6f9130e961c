// The worker side of WorkerPool (worker-pool.ts): a worker's entry module calls serveWorkerTasks
// with its handler. The handler may send chunks before it returns; whatever it throws goes back
// to the caller as a WorkerTaskError, and the worker stays up for the next task.
import { parentPort } from 'node:worker_threads';

export interface WorkerRequest {
  id: number;
  task: unknown;
}

export type WorkerReply =
  | { id: number; chunk: unknown }
  | { id: number; result: unknown }
  | { id: number; failure: { name: string; message: string; stack?: string } };

export type TaskHandler<Task, Result, Chunk> = (task: Task, sendChunk: (chunk: Chunk) => void) => Result | Promise<Result>;

export function serveWorkerTasks<Task, Result, Chunk = never>(handler: TaskHandler<Task, Result, Chunk>): void {
  const port = parentPort;
  if (!port) throw new Error('serveWorkerTasks runs inside a worker thread');
  port.on('message', async ({ id, task }: WorkerRequest) => {
    const reply = (message: WorkerReply) => port.postMessage(message);
    try {
      const result = await handler(task as Task, (chunk) => reply({ id, chunk }));
      reply({ id, result });
    } catch (error) {
      const e = error instanceof Error ? error : new Error(String(error));
      reply({ id, failure: { name: e.name, message: e.message, stack: e.stack } });
    }
  });
}
