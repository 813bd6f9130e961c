// `npm run bench:api`: the read and push paths of the real app over HTTP on a SQLite file holding
// 5,000 samples (3 burns × 25 elements), each against a floor measured in the same run:
// - list page `GET /api/v1/samples?limit=100` and single `GET /api/v1/samples/{id}`, autocannon at
//   50 connections for 10 s with an API key; floor: node:http answering with the same stored rows
//   read by one better-sqlite3 query per request and JSON.stringify (no conversion, no checks);
// - `POST /api/v1/samples` (3 burns × 25 elements) sequentially and from 10 concurrent clients;
//   floor: node:http + JSON.parse + one better-sqlite3 transaction writing the sample and its burns.
// Prints one table and writes bench/results-api.json. Compare the ratios, not the figures.
import { writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Database from 'better-sqlite3';
import { createApiKey } from '../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../server/domain/auth/auth.service.ts';
import { findUserByEmail } from '../server/domain/users/users.repository.ts';
import { DEMO_USERS } from '../server/seed/demo-users.ts';
import { startLiveServer } from '../tests/helpers/live-server.ts';
import { cannon, closeLoadAgent, fill, pushBody, type Target, timedPushes } from './api-load.ts';

const SAMPLES = Number(process.env.BENCH_SAMPLES ?? 5000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PUSHES = Number(process.env.BENCH_PUSHES ?? 300);

const server = await startLiveServer({ console: false, validateResponses: false, config: { rateLimitPerMinute: 1_000_000_000 } });
const admin = await findUserByEmail(server.db, DEMO_USERS[0].email);
const { secret } = await createApiKey(server.ctx, sessionAuthContext(admin!, 'bench'), {
  name: 'bench',
  scopes: ['samples:read', 'samples:write'],
});
const headers = { authorization: `Bearer ${secret}`, 'content-type': 'application/json' };
const [instrument] = (await (await fetch(`${server.url}/api/v1/instruments`, { headers })).json()).data as { id: string }[];
const method = ((await (await fetch(`${server.url}/api/v1/methods`, { headers })).json()).data as { id: string; code: string }[]).find(
  (m) => m.code === 'FE-LA',
)!;
const target: Target = { base: server.url, headers, instrumentId: instrument.id, methodId: method.id };
await fill(target, SAMPLES, 'RB');
const databaseFile = server.ctx.config.databaseFile;
const sampleId = ((await (await fetch(`${server.url}/api/v1/samples?limit=1`, { headers })).json()).data as { id: string }[])[0].id;

/** The read floor: the same stored rows, one query per request, sent as JSON without any work on them. */
function readFloor(): Promise<Server> {
  const db = new Database(databaseFile, { readonly: true });
  const list = db.prepare('select * from samples order by id limit 100');
  const one = db.prepare('select * from samples where id = ?');
  const burns = db.prepare('select * from burns where sample_id = ? order by burn_number');
  const floor = createServer((req, res) => {
    const body = req.url!.startsWith('/one') ? { ...(one.get(sampleId) as object), burns: burns.all(sampleId) } : { data: list.all() };
    res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(body));
  });
  return new Promise((resolve) => floor.listen(0, '127.0.0.1', () => resolve(floor)));
}

/** The push floor: JSON.parse and one transaction writing the sample and its burns. */
function pushFloor(): Promise<Server> {
  const db = new Database(databaseFile.replace(/\.db$/, '-floor.db'));
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = NORMAL');
  db.exec(
    'create table if not exists s (id integer primary key, code text, body text); create table if not exists b (s integer, n integer, v text)',
  );
  const insertSample = db.prepare('insert into s (code, body) values (?, ?)');
  const insertBurn = db.prepare('insert into b (s, n, v) values (?, ?, ?)');
  const write = db.transaction((parsed: { sample_code: string; burns: { values: unknown }[] }, text: string) => {
    const id = insertSample.run(parsed.sample_code, text).lastInsertRowid;
    parsed.burns.forEach((burn, n) => insertBurn.run(id, n + 1, JSON.stringify(burn.values)));
    return id;
  });
  const floor = createServer((req, res) => {
    let text = '';
    req.on('data', (chunk: Buffer) => (text += chunk));
    req.on('end', () => {
      const id = write(JSON.parse(text), text);
      res.writeHead(201, { 'content-type': 'application/json' }).end(JSON.stringify({ id: String(id) }));
    });
  });
  return new Promise((resolve) => floor.listen(0, '127.0.0.1', () => resolve(floor)));
}

const floorRead = await readFloor();
const floorReadUrl = `http://127.0.0.1:${(floorRead.address() as AddressInfo).port}`;
const auth = { authorization: headers.authorization };
const listProduct = await cannon([`${server.url}/api/v1/samples?limit=100`], SECONDS, auth);
const listFloor = await cannon([`${floorReadUrl}/list`], SECONDS);
const oneProduct = await cannon([`${server.url}/api/v1/samples/${sampleId}`], SECONDS, auth);
const oneFloor = await cannon([`${floorReadUrl}/one`], SECONDS);
floorRead.close();

const floorPush = await pushFloor();
const body = (code: string, i: number) => pushBody(target, code, i);
const pushFloorFigures = await timedPushes(
  [`http://127.0.0.1:${(floorPush.address() as AddressInfo).port}/`],
  headers,
  PUSHES,
  body,
  'FLOOR',
);
const pushProduct = await timedPushes([`${server.url}/api/v1/samples`], headers, PUSHES, body, 'PUSH');
floorPush.close();
closeLoadAgent();

const rows = [
  { figure: 'list page req/s', value: listProduct.rps, floor: listFloor.rps, ratio: listProduct.rps / listFloor.rps, target: '≥ 0.60' },
  { figure: 'list page p99 ms', value: listProduct.p99, floor: listFloor.p99, ratio: listProduct.p99 / listFloor.p99, target: '< 100 ms' },
  { figure: 'single sample req/s', value: oneProduct.rps, floor: oneFloor.rps, ratio: oneProduct.rps / oneFloor.rps, target: '≥ 0.70' },
  {
    figure: 'push p50 ms (sequential)',
    value: pushProduct.p50,
    floor: pushFloorFigures.p50,
    ratio: pushProduct.p50 / pushFloorFigures.p50,
    target: '—',
  },
  {
    figure: 'push p99 ms (10 clients)',
    value: pushProduct.p99,
    floor: pushFloorFigures.p99,
    ratio: pushProduct.p99 / pushFloorFigures.p99,
    target: '< 25 ms',
  },
  {
    figure: 'push samples/s (10 clients)',
    value: pushProduct.perSecond,
    floor: pushFloorFigures.perSecond,
    ratio: pushProduct.perSecond / pushFloorFigures.perSecond,
    target: '≥ 0.50',
  },
];
const pass = [rows[0].ratio >= 0.6, rows[1].value < 100, rows[2].ratio >= 0.7, true, rows[4].value < 25, rows[5].ratio >= 0.5];
console.log(`reads and pushes on ${SAMPLES} samples (3 burns × 25 elements), autocannon 50 connections × ${SECONDS} s`);
console.log('figure                        product      floor   ratio  target    ');
rows.forEach((row, i) =>
  console.log(
    `${row.figure.padEnd(28)} ${row.value.toFixed(1).padStart(9)} ${row.floor.toFixed(1).padStart(10)} ${row.ratio.toFixed(2).padStart(7)}  ${row.target.padEnd(9)} ${pass[i] ? 'pass' : 'MISS'}`,
  ),
);
writeFileSync(
  new URL('./results-api.json', import.meta.url),
  `${JSON.stringify({ samples: SAMPLES, seconds: SECONDS, rows, pass }, null, 2)}\n`,
);
await server.stop();
