// A small pool of worker threads for CPU-heavy work that must not hold the event loop. Tasks
// queue until a worker is free; workers start on first use and, while idle, do not keep the
// process alive. A task may stream partial results (chunks) before its result, so that a large
// answer arrives as many small messages instead of one long deserialisation. A worker that dies
// fails only the task it was running; the next task starts a replacement. The worker side of the
// protocol is serveWorkerTasks (worker-task.ts).
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { WorkerReply, WorkerRequest } from './worker-task.ts';

/** The task threw inside the worker; `name` and `message` are the original error's. */
export class WorkerTaskError extends Error {
  constructor(name: string, message: string, stack?: string) {
    super(message);
    this.name = `WorkerTaskError(${name})`;
    if (stack) this.stack = stack;
  }
}

/** The worker died (crashed, ran out of memory, exited) while running the task. */
export class WorkerCrashError extends Error {
  constructor(detail: string) {
    super(`a worker thread stopped while running a task: ${detail}`);
    this.name = 'WorkerCrashError';
  }
}

export interface WorkerPoolOptions {
  /** The worker's entry module; a `.ts` module runs under tsx, like the server itself. */
  url: URL;
  /** Default: one less than the available cores, at least 1. */
  size?: number;
}

/** Registers tsx in the worker, then imports the TypeScript entry module. */
const TYPESCRIPT_ENTRY = new URL('./typescript-worker.mjs', import.meta.url);

export interface RunOptions<Chunk> {
  onChunk?: (chunk: Chunk) => void;
}

interface Job {
  id: number;
  task: unknown;
  onChunk?: (chunk: unknown) => void;
  resolve(result: unknown): void;
  reject(error: Error): void;
}

interface Slot {
  worker: Worker;
  job?: Job;
}

export function defaultPoolSize(): number {
  return Math.max(1, availableParallelism() - 1);
}

export class WorkerPool<Task, Result, Chunk = never> {
  readonly size: number;
  private readonly slots = new Set<Slot>();
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(private readonly options: WorkerPoolOptions) {
    this.size = options.size ?? defaultPoolSize();
  }

  /** Runs the task on the next free worker. */
  run(task: Task, options: RunOptions<Chunk> = {}): Promise<Result> {
    if (this.closed) return Promise.reject(new Error('the worker pool is closed'));
    return new Promise<Result>((resolve, reject) => {
      const job: Job = {
        id: this.nextId++,
        task,
        onChunk: options.onChunk as ((chunk: unknown) => void) | undefined,
        resolve: resolve as (result: unknown) => void,
        reject,
      };
      this.queue.push(job);
      this.dispatch();
    });
  }

  /** Stops every worker; queued tasks fail. Safe to call more than once. */
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.reject(new Error('the worker pool was closed before the task ran'));
    const slots = [...this.slots];
    this.slots.clear();
    for (const slot of slots) slot.job?.reject(new Error('the worker pool was closed while the task ran'));
    await Promise.all(slots.map((slot) => slot.worker.terminate()));
  }

  private dispatch(): void {
    while (this.queue.length > 0 && !this.closed) {
      let slot = [...this.slots].find((s) => !s.job);
      if (!slot) {
        if (this.slots.size >= this.size) return;
        slot = this.spawn();
      }
      const job = this.queue.shift()!;
      slot.job = job;
      slot.worker.ref();
      slot.worker.postMessage({ id: job.id, task: job.task } satisfies WorkerRequest);
    }
  }

  private spawn(): Slot {
    const { url } = this.options;
    const worker = url.pathname.endsWith('.ts')
      ? new Worker(TYPESCRIPT_ENTRY, { workerData: { entry: url.href }, execArgv: [] })
      : new Worker(url, { execArgv: [] });
    const slot: Slot = { worker };
    this.slots.add(slot);
    worker.unref();
    worker.on('message', (reply: WorkerReply) => this.onReply(slot, reply));
    worker.on('messageerror', (error) => this.fail(slot, new WorkerCrashError(`a message could not be read (${error.message})`)));
    worker.on('error', (error) => this.fail(slot, new WorkerCrashError(error.message)));
    worker.on('exit', (code) => this.fail(slot, new WorkerCrashError(`exit code ${code}`)));
    return slot;
  }

  private onReply(slot: Slot, reply: WorkerReply): void {
    const job = slot.job;
    if (!job || reply.id !== job.id) return;
    if ('chunk' in reply) {
      try {
        job.onChunk?.(reply.chunk);
      } catch (error) {
        // The task's own chunk handler failed: the task fails, the worker is still sound.
        job.onChunk = undefined;
        job.reject(error as Error);
      }
      return;
    }
    slot.job = undefined;
    slot.worker.unref();
    if ('failure' in reply) job.reject(new WorkerTaskError(reply.failure.name, reply.failure.message, reply.failure.stack));
    else job.resolve(reply.result);
    this.dispatch();
  }

  /** The worker is unusable: fail its task, drop it, and let the queue start a replacement. */
  private fail(slot: Slot, error: WorkerCrashError): void {
    if (!this.slots.delete(slot)) return;
    const job = slot.job;
    slot.job = undefined;
    void slot.worker.terminate();
    job?.reject(error);
    this.dispatch();
  }
}
