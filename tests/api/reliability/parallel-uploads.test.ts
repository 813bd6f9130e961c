// 20 uploads at once while readers page through samples and poll /health: every upload lands
// exactly once, no client sees a 5xx (a busy database must wait, not fail), nothing is lost.
// The readers' p99 is printed for the note, never asserted (timing belongs to the bench).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { wideCsv } from '../../../bench/generate-wide-file.ts';
import { startLiveServer } from '../../helpers/live-server.ts';
import { signIn } from './server-process.ts';

const UPLOADS = 20;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let cookie: string;
let ids: { instrument: string; method: string };

beforeAll(async () => {
  server = await startLiveServer({ console: false });
  cookie = await signIn(server.url);
  const get = async (path: string) =>
    ((await (await fetch(`${server.url}/api/v1${path}`, { headers: { cookie } })).json()) as { data: { id: string; code: string }[] }).data;
  ids = {
    instrument: (await get('/instruments')).find((i) => i.code === 'OES-2')!.id,
    method: (await get('/methods')).find((m) => m.code === 'FE-LA')!.id,
  };
});
afterAll(() => server?.stop());

function upload(seed: number) {
  const form = new FormData();
  form.set('instrument_id', ids.instrument);
  form.set('method_id', ids.method);
  form.set('file', new Blob([wideCsv(600, { seed })], { type: 'text/csv' }), `parallel-${seed}.csv`);
  return fetch(`${server.url}/api/v1/imports`, { method: 'POST', headers: { cookie }, body: form });
}

const p99 = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length * 0.99)] ?? 0;

describe('parallel uploads with readers', () => {
  it(`stores ${UPLOADS} files exactly once each, with no 5xx to uploaders or readers`, async () => {
    let uploading = true;
    const readerStatuses: number[] = [];
    const readerMs: number[] = [];
    const reader = async (path: string) => {
      while (uploading) {
        const start = performance.now();
        const res = await fetch(`${server.url}${path}`, { headers: { cookie } });
        await res.arrayBuffer();
        readerMs.push(performance.now() - start);
        readerStatuses.push(res.status);
      }
    };
    const readers = [reader('/api/v1/samples?limit=50'), reader('/api/v1/health'), reader('/api/v1/imports?limit=20')];
    const answers = await Promise.all(Array.from({ length: UPLOADS }, (_, i) => upload(1000 + i)));
    uploading = false;
    await Promise.all(readers);

    expect(answers.map((res) => res.status)).toEqual(Array(UPLOADS).fill(201));
    const reports = (await Promise.all(answers.map((res) => res.json()))) as {
      id: string;
      report: { counts: { samples_created: number } };
    }[];
    expect(new Set(reports.map((r) => r.id)).size).toBe(UPLOADS);
    expect(readerStatuses.filter((status) => status >= 500)).toEqual([]);
    expect(new Set(readerStatuses)).toEqual(new Set([200]));

    const stored = await server
      .db('samples')
      .whereIn(
        'import_id',
        reports.map((r) => r.id),
      )
      .count({ n: '*' })
      .first();
    expect(Number(stored?.n)).toBe(reports.reduce((sum, r) => sum + r.report.counts.samples_created, 0));
    console.info(`parallel uploads: ${UPLOADS} × 201, ${readerStatuses.length} reads, reader p99 ${p99(readerMs).toFixed(0)} ms`);
  }, 120_000);
});
