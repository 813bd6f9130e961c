// `npm run bench:api`: the read and push paths of Meltwire as `npm start` runs it (its own process,
// on a SQLite file holding 5,000 samples of 3 burns × 25 elements), each against a floor in the
// same run (bench/floors.ts, also its own process); the load comes from this process:
// - list page `GET /api/v1/samples?limit=100` and single `GET /api/v1/samples/{id}`, autocannon at
//   50 connections for 10 s with an API key (rate limit raised); the floor answers with the same
//   stored bytes (the prepared documents) read by one better-sqlite3 query per request;
// - `POST /api/v1/samples` (3 burns × 25 elements) one after another and from 10 concurrent
//   clients; floor: JSON.parse and one better-sqlite3 transaction writing the sample and its burns.
// The server logs at warn (no line per request). Writes bench/results-api.json; `npm run bench`
// puts these rows in its one table. Compare the ratios, not the figures.
import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signIn, startServerProcess } from '../tests/helpers/server-process.ts';
import { cannon, closeLoadAgent, fill, pushBody, type Target, timedPushes } from './api-load.ts';
import { type BenchRow, printTable } from './bench-table.ts';

const SAMPLES = Number(process.env.BENCH_SAMPLES ?? 5000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PUSHES = Number(process.env.BENCH_PUSHES ?? 300);
const PORT = Number(process.env.BENCH_PORT ?? 4791);

/** Starts bench/floors.ts on the database file; resolves with its URL once it listens. */
function startFloors(databaseFile: string, sampleId: string): Promise<{ url: string; child: ChildProcess }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/floors.ts', databaseFile, sampleId], {
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the floors exited with ${code}`)));
    child.stdout!.on('data', (chunk: Buffer) => {
      const port = /listening (\d+)/.exec(String(chunk))?.[1];
      if (port) resolve({ url: `http://127.0.0.1:${port}`, child });
    });
  });
}

const dir = mkdtempSync(join(tmpdir(), 'meltwire-bench-api-'));
const databaseFile = join(dir, 'bench.db');
const server = await startServerProcess(databaseFile, PORT, { RATE_LIMIT_PER_MINUTE: '1000000000', LOG_LEVEL: 'warn' });
try {
  const cookie = await signIn(server.url);
  const created = await fetch(`${server.url}/api/v1/api-keys`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json' },
    body: JSON.stringify({ name: 'bench', scopes: ['samples:read', 'samples:write'] }),
  });
  const { secret } = (await created.json()) as { secret: string };
  const headers = { authorization: `Bearer ${secret}`, 'content-type': 'application/json' };
  const lookup = async (path: string) =>
    ((await (await fetch(`${server.url}/api/v1/${path}`, { headers })).json()) as { data: { id: string; code: string }[] }).data;
  const instrument = (await lookup('instruments')).find((i) => i.code === 'OES-1')!;
  const method = (await lookup('methods')).find((m) => m.code === 'FE-LA')!;
  const target: Target = { base: server.url, headers, instrumentId: instrument.id, methodId: method.id };
  await fill(target, SAMPLES, 'RB');
  const sampleId = ((await (await fetch(`${server.url}/api/v1/samples?limit=1`, { headers })).json()) as { data: { id: string }[] }).data[0]
    .id;
  const floors = await startFloors(databaseFile, sampleId);
  try {
    const auth = { authorization: headers.authorization };
    const listProduct = await cannon([`${server.url}/api/v1/samples?limit=100`], SECONDS, auth);
    const listFloor = await cannon([`${floors.url}/list`], SECONDS);
    const oneProduct = await cannon([`${server.url}/api/v1/samples/${sampleId}`], SECONDS, auth);
    const oneFloor = await cannon([`${floors.url}/one`], SECONDS);
    const body = (code: string, i: number) => pushBody(target, code, i);
    const pushFloor = await timedPushes([`${floors.url}/push`], headers, PUSHES, body, 'FLOOR');
    const pushProduct = await timedPushes([`${server.url}/api/v1/samples`], headers, PUSHES, body, 'PUSH');
    closeLoadAgent();
    const rows: BenchRow[] = [
      { figure: 'list page req/s', value: listProduct.rps, floor: listFloor.rps, target: { ratioAtLeast: 0.6 } },
      { figure: 'list page p99 ms', value: listProduct.p99, floor: listFloor.p99, target: { below: 100 } },
      { figure: 'single sample req/s', value: oneProduct.rps, floor: oneFloor.rps, target: { ratioAtLeast: 0.7 } },
      { figure: 'push p50 ms (one client)', value: pushProduct.p50, floor: pushFloor.p50, target: null },
      { figure: 'push p99 ms (10 clients)', value: pushProduct.p99, floor: pushFloor.p99, target: { below: 25 } },
      { figure: 'push samples/s (10 clients)', value: pushProduct.perSecond, floor: pushFloor.perSecond, target: { ratioAtLeast: 0.5 } },
    ];
    console.log(`reads and pushes on ${SAMPLES} samples (3 burns × 25 elements), autocannon 50 connections × ${SECONDS} s`);
    printTable(rows);
    writeFileSync(
      new URL('./results-api.json', import.meta.url),
      `${JSON.stringify({ samples: SAMPLES, seconds: SECONDS, rows }, null, 2)}\n`,
    );
  } finally {
    floors.child.kill();
  }
} finally {
  await server.stop();
  rmSync(dir, { recursive: true, force: true });
}
