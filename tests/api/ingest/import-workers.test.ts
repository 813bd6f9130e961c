// Imports are read and built in worker threads: the event loop stays free while a large file is
// in the worker, preview takes the same path, a worker that throws or dies fails only its own
// request (500) and is replaced, and samples are rebuilt when a correction set is activated
// between building them and storing them.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { wideCsv } from '../../../bench/generate-wide-file.ts';
import type { ImportTask } from '../../../server/domain/imports/import-work.ts';
import { createImportWorkers, type ImportWorkers } from '../../../server/domain/imports/import-workers.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { countRows, createTestApp, expectProblem, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from '../drift/drift-setup.ts';

function upload(agent: request.Agent, instrumentId: string, methodId: string, bytes: string, path = '/api/v1/imports') {
  return agent
    .post(path)
    .field('instrument_id', instrumentId)
    .field('method_id', methodId)
    .attach('file', Buffer.from(bytes), 'results.csv');
}

/** Wraps the pool's run: `around` is called with each task and the real run. */
function aroundRun(
  pool: ImportWorkers,
  around: (task: ImportTask, run: () => ReturnType<ImportWorkers['run']>) => ReturnType<ImportWorkers['run']>,
) {
  const original = pool.run.bind(pool);
  return vi.spyOn(pool, 'run').mockImplementation((task, options) => around(task, () => original(task, options)));
}

// Burns measured after any set these tests activate, so that the set in force applies to them:
// four minutes ahead of the clock, within the five minutes of skew a burn time may be ahead.
const later = (seconds: number) => new Date(Date.now() + 4 * 60_000 + seconds * 1000).toISOString();
const LATER_FILE = [
  'Sample,Heat,Burn,Time,C %,Mn %,Cr %',
  `K24-0901-F1,K24-0901,1,${later(0)},0.452,0.744,0.11`,
  `K24-0901-F1,K24-0901,2,${later(40)},0.449,0.751,0.12`,
  '',
].join('\n');

describe('imports in worker threads', () => {
  const s = useDriftSetup();

  it('keeps the event loop free: a health check started once the upload is in the worker finishes before the upload', async () => {
    let reachedWorker!: () => void;
    const inWorker = new Promise<void>((resolve) => (reachedWorker = resolve));
    const spy = aroundRun(s.t.ctx.importWorkers, (_task, run) => {
      reachedWorker();
      return run();
    });
    const finished: string[] = [];
    const uploading = upload(s.analyst, s.lab.foundry.id, s.lab.feMethod.id, wideCsv(10_000)).then((res) => {
      finished.push('upload');
      return res;
    });
    await inWorker;
    const health = await request(s.t.app).get('/api/v1/health');
    finished.push('health');
    const res = await uploading;
    spy.mockRestore();
    expect(health.status).toBe(200);
    expect(res.status).toBe(201);
    expect(res.body.report.counts.samples_created).toBe(Math.ceil(10_000 / 3));
    expect(finished).toEqual(['health', 'upload']);
  });

  it('previews through the same workers', async () => {
    const kinds: string[] = [];
    const spy = aroundRun(s.t.ctx.importWorkers, (task, run) => (kinds.push(task.kind), run()));
    const res = await upload(s.analyst, s.lab.foundry.id, s.method.id, LATER_FILE, '/api/v1/imports/preview');
    spy.mockRestore();
    expect(res.status).toBe(200);
    expect(res.body.counts).toEqual({ rows: 2, samples: 1, burns: 2, values: 6, samples_with_rejected_lines: 0 });
    expect(kinds).toEqual(['preview']);
  });

  it('builds the samples again when a correction set is activated after they were built and before they are stored', async () => {
    let activated: string | undefined;
    let builds = 0;
    const spy = aroundRun(s.t.ctx.importWorkers, async (_task, run) => {
      builds += 1;
      const outcome = await run();
      if (!activated) {
        const set = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.95)));
        await activate(s, set.id);
        activated = set.id;
      }
      return outcome;
    });
    const res = await upload(s.analyst, s.lab.foundry.id, s.method.id, LATER_FILE);
    spy.mockRestore();
    expect(res.status).toBe(201);
    expect(builds).toBe(2);
    const burns = await s.t.db('burns').where({ sample_id: res.body.report.sample_ids[0] });
    expect(burns.map((b) => b.correction_set_id)).toEqual([activated, activated]);
  });

  it('gives up with 409 and stores nothing when sets keep being activated during the import', async () => {
    const before = await countRows(s.t.db('samples'));
    let builds = 0;
    const spy = aroundRun(s.t.ctx.importWorkers, async (_task, run) => {
      builds += 1;
      const outcome = await run();
      await activate(s, (await createRun(s, twoPointRun(s, burnsAt('high', 0.98), burnsAt('low', 0.96)))).id);
      return outcome;
    });
    const res = await upload(s.analyst, s.lab.foundry.id, s.method.id, LATER_FILE.replaceAll('K24-0901', 'K24-0902'));
    spy.mockRestore();
    expectProblem(res, 409);
    expect(builds).toBe(3);
    expect(await countRows(s.t.db('samples'))).toBe(before);
  });
});

describe('a worker that fails', () => {
  let t: TestApp;
  let lab: DemoLab;
  let analyst: request.Agent;
  beforeAll(async () => {
    const importWorkers = createImportWorkers({
      url: new URL('../../fixtures/workers/failing-import-worker.ts', import.meta.url),
      size: 1,
    });
    t = await createTestApp({}, { importWorkers });
    lab = await seedDemoLab(t.db);
    analyst = (await signedInAgent(t, 'analyst')).agent;
  });
  afterAll(() => t.close());

  const file = (code: string) => `Sample,Burn,Mn %\n${code},1,0.75\n`;

  it('answers 500 for the request whose worker died, stores nothing, and serves the next upload with a new worker', async () => {
    const crashed = await upload(analyst, lab.foundry.id, lab.feMethod.id, file('CRASH-WORKER'));
    expectProblem(crashed, 500);
    expect(await countRows(t.db('imports'))).toBe(0);
    expect((await request(t.app).get('/api/v1/health')).status).toBe(200);
    const next = await upload(analyst, lab.foundry.id, lab.feMethod.id, file('K24-0950-F1'));
    expect(next.status).toBe(201);
  });

  it('answers 500 for an unexpected error thrown in the worker, and 422 for an unreadable file, as before', async () => {
    expectProblem(await upload(analyst, lab.foundry.id, lab.feMethod.id, file('THROW-IN-WORKER')), 500);
    const unreadable = await upload(analyst, lab.foundry.id, lab.feMethod.id, 'Sample,Burn\nK24-0951-F1,1\n');
    expectProblem(unreadable, 422);
    expect(unreadable.body.issues[0].code).toBe('no_element_columns');
    expect((await upload(analyst, lab.foundry.id, lab.feMethod.id, file('K24-0952-F1'))).status).toBe(201);
  });
});
