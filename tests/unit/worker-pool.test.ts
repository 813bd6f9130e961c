// The worker thread pool on its own, with a test worker written in TypeScript (run under tsx):
// results and chunks, errors thrown by a task, a thread that dies, the queue, and closing.
import { afterEach, describe, expect, it } from 'vitest';
import { WorkerCrashError, WorkerPool, WorkerTaskError } from '../../server/lib/worker-pool.ts';
import type { TestTask } from '../fixtures/workers/test-tasks-worker.ts';

const WORKER = new URL('../fixtures/workers/test-tasks-worker.ts', import.meta.url);
const pools: WorkerPool<TestTask, unknown, number>[] = [];

function pool(size: number) {
  const created = new WorkerPool<TestTask, unknown, number>({ url: WORKER, size });
  pools.push(created);
  return created;
}

afterEach(async () => {
  await Promise.all(pools.splice(0).map((p) => p.close()));
});

describe('WorkerPool', () => {
  it('runs a task in a worker and streams its chunks before the result', async () => {
    const workers = pool(1);
    expect(await workers.run({ op: 'echo', value: { a: [1, 'two'] } })).toEqual({ echoed: { a: [1, 'two'] } });
    const chunks: number[] = [];
    expect(await workers.run({ op: 'chunks', count: 5 }, { onChunk: (chunk) => chunks.push(chunk) })).toBe('sent');
    expect(chunks).toEqual([0, 1, 2, 3, 4]);
  });

  it('fails only the task that throws, with the original name and message, and keeps the worker', async () => {
    const workers = pool(1);
    const failed = workers.run({ op: 'throw', message: 'no such value' });
    await expect(failed).rejects.toBeInstanceOf(WorkerTaskError);
    await expect(failed).rejects.toMatchObject({ name: 'WorkerTaskError(RangeError)', message: 'no such value' });
    expect(await workers.run({ op: 'echo', value: 1 })).toEqual({ echoed: 1 });
  });

  it('fails the task whose thread dies, and runs the queued tasks on a replacement', async () => {
    const workers = pool(1);
    const crashed = workers.run({ op: 'exit', code: 7 });
    const queued = [workers.run({ op: 'echo', value: 'a' }), workers.run({ op: 'echo', value: 'b' })];
    await expect(crashed).rejects.toBeInstanceOf(WorkerCrashError);
    await expect(crashed).rejects.toThrow(/exit code 7/);
    expect(await Promise.all(queued)).toEqual([{ echoed: 'a' }, { echoed: 'b' }]);
  });

  it('queues tasks beyond its size and runs them all', async () => {
    const workers = pool(2);
    const results = await Promise.all(Array.from({ length: 6 }, (_, i) => workers.run({ op: 'echo', value: i })));
    expect(results).toEqual(Array.from({ length: 6 }, (_, i) => ({ echoed: i })));
  });

  it('refuses tasks once closed and fails the ones still queued', async () => {
    const workers = pool(1);
    const settled = Promise.allSettled([workers.run({ op: 'wait', ms: 5_000 }), workers.run({ op: 'echo', value: 1 })]);
    await workers.close();
    const [running, queued] = await settled;
    expect(running).toMatchObject({ status: 'rejected', reason: { message: 'the worker pool was closed while the task ran' } });
    expect(queued).toMatchObject({ status: 'rejected', reason: { message: 'the worker pool was closed before the task ran' } });
    await expect(workers.run({ op: 'echo', value: 2 })).rejects.toThrow(/closed/);
  });
});
