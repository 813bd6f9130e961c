// `npm run bench:ingest`: a generated 20,000-burn wide file (3 burns per sample, 25 elements)
// uploaded through the real API over HTTP, against a floor measured in the same run:
// csv-parse plus one better-sqlite3 transaction inserting the same values (one row per burn,
// values as a JSON text column). Figures are medians; compare the ratio, not the seconds.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { parse } from 'csv-parse/sync';
import { Decimal } from 'decimal.js';
import { createApp } from '../server/app.ts';
import { testConfig } from '../server/config.ts';
import { createDb } from '../server/db/knex.ts';
import { migrateLatest } from '../server/db/migrate.ts';
import { createApiKey } from '../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../server/domain/auth/auth.service.ts';
import { listen } from '../server/index.ts';
import { createLogger } from '../server/logger.ts';
import { seedDemoLab } from '../server/seed/demo-lab.ts';
import { seedDemoUsers } from '../server/seed/demo-users.ts';
import { createImportWorkers } from '../server/domain/imports/import-workers.ts';
import { insertMethod } from '../server/domain/methods/methods.repository.ts';
import { newId } from '../server/lib/ids.ts';
import { WIDE_FILE_ELEMENTS, wideCsv } from './generate-wide-file.ts';
import { activateBenchSet } from './bench-correction-set.ts';
import type { BenchRow } from './bench-table.ts';

const BURNS = Number(process.env.BENCH_BURNS ?? 20_000);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const VALUES = BURNS * WIDE_FILE_ELEMENTS.length;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** The floor: parse the same text and insert one row per burn in one prepared transaction. */
function floorRun(text: string, dir: string, run: number): number {
  const started = performance.now();
  const db = new Database(join(dir, `floor-${run}.db`));
  db.pragma('journal_mode = WAL');
  db.exec('create table burns (id integer primary key, sample text, burn integer, measured_at text, values_json text)');
  const rows = parse(text, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
  const insert = db.prepare('insert into burns (sample, burn, measured_at, values_json) values (?, ?, ?, ?)');
  db.transaction(() => {
    for (const row of rows) {
      const values: Record<string, string> = {};
      for (const element of WIDE_FILE_ELEMENTS) values[element] = row[`${element} %`];
      insert.run(row.Sample, Number(row.Burn), row.Time, JSON.stringify(values));
    }
  })();
  db.close();
  return performance.now() - started;
}

/** The product: the same file uploaded to POST /api/v1/imports on a fresh database. */
/** Independent check of a few stored samples: decimal.js means, half-even to 4 decimals, from the file text. */
async function verify(url: string, secret: string, text: string, sampleIds: string[]): Promise<string> {
  const lines = text
    .trim()
    .split('\n')
    .map((line) => line.split(','));
  const header = lines[0];
  const picks = [0, Math.floor(sampleIds.length / 2), sampleIds.length - 1];
  let checked = 0;
  for (const index of picks) {
    const burns = lines.slice(1 + index * 3, 4 + index * 3);
    const res = await fetch(`${url}/api/v1/samples/${sampleIds[index]}`, { headers: { authorization: `Bearer ${secret}` } });
    const sample = (await res.json()) as { sample_code: string; results: { element: string; reported: string }[] };
    if (sample.sample_code !== burns[0][0]) throw new Error(`sample ${index}: expected ${burns[0][0]}, got ${sample.sample_code}`);
    for (const element of WIDE_FILE_ELEMENTS) {
      const column = header.indexOf(`${element} %`);
      const mean = burns.reduce((sum, cells) => sum.plus(cells[column]), new Decimal(0)).div(burns.length);
      const expected = mean.toDecimalPlaces(4, Decimal.ROUND_HALF_EVEN).toFixed(4);
      const got = sample.results.find((r) => r.element === element)?.reported;
      if (got !== expected) throw new Error(`${sample.sample_code} ${element}: API ${got}, decimal.js ${expected}`);
      checked += 1;
    }
  }
  return `${checked} reported values in ${picks.length} samples agree with decimal.js`;
}

async function apiRun(text: string, dir: string, run: number, withSet: boolean): Promise<{ ms: number; samples: number; check?: string }> {
  const config = testConfig({
    databaseFile: join(dir, `api-${run}${withSet ? '-set' : ''}.db`),
    rateLimitPerMinute: 1_000_000,
    importMaxBytes: 100 * 1024 * 1024,
  });
  const db = createDb(config);
  await migrateLatest(db);
  await seedDemoUsers(db);
  const lab = await seedDemoLab(db);
  const method = {
    ...lab.feMethod,
    id: newId('mth'),
    code: 'FE-BENCH',
    elements: WIDE_FILE_ELEMENTS.map((element) => ({
      element,
      decimals: 4,
      working_range_low: null,
      working_range_high: null,
      detection_limit: null,
      repeatability_sd: '0.01',
    })),
  };
  await insertMethod(db, method);
  // The file's burns start on 2024-03-04; the set is activated the day before.
  if (withSet) await activateBenchSet(db, lab.foundry.id, method, new Date(Date.UTC(2024, 2, 4)));
  const admin = await db('users').where({ role: 'admin' }).first();
  const key = await createApiKey(
    {
      db,
      config,
      logger: createLogger('silent'),
      mailer: { send: async () => ({ delivered: false }), close() {} },
      importWorkers: createImportWorkers(),
    },
    sessionAuthContext(admin, 'bench'),
    { name: 'bench', scopes: ['imports:write', 'samples:read'] },
  );
  const logger = createLogger('silent');
  const running = await listen(createApp({ db, config, logger, consoleDir: '/nonexistent' }), db, logger, 0);
  try {
    const form = new FormData();
    form.set('instrument_id', lab.foundry.id);
    form.set('method_id', method.id);
    form.set('file', new Blob([text], { type: 'text/csv' }), 'bench.csv');
    const started = performance.now();
    const res = await fetch(`${running.url}/api/v1/imports`, {
      method: 'POST',
      body: form,
      headers: { authorization: `Bearer ${key.secret}` },
    });
    const body = (await res.json()) as { report?: { counts: { samples_created: number }; sample_ids: string[] }; detail?: string };
    const ms = performance.now() - started;
    if (res.status !== 201 || !body.report) throw new Error(`upload failed: ${res.status} ${JSON.stringify(body).slice(0, 500)}`);
    const check = run === 0 && !withSet ? await verify(running.url, key.secret, text, body.report.sample_ids) : undefined;
    if (withSet) {
      const first = await fetch(`${running.url}/api/v1/samples/${body.report.sample_ids[0]}`, {
        headers: { authorization: `Bearer ${key.secret}` },
      });
      if (!((await first.json()) as { correction: unknown }).correction) throw new Error('the correction set was not applied');
    }
    return { ms, samples: body.report.counts.samples_created, check };
  } finally {
    await running.stop();
  }
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'meltwire-bench-'));
  try {
    const text = wideCsv(BURNS);
    console.log(
      `file: ${BURNS} burns × ${WIDE_FILE_ELEMENTS.length} elements = ${VALUES} values, ${(Buffer.byteLength(text) / 1e6).toFixed(1)} MB; ${RUNS} runs each, medians`,
    );
    const floor: number[] = [];
    const api: number[] = [];
    const apiWithSet: number[] = [];
    let samples = 0;
    let check = '';
    for (let run = 0; run < RUNS; run++) {
      floor.push(floorRun(text, dir, run));
      const result = await apiRun(text, dir, run, false);
      api.push(result.ms);
      apiWithSet.push((await apiRun(text, dir, run, true)).ms);
      samples = result.samples;
      check ||= result.check ?? '';
    }
    const floorMs = median(floor);
    const apiMs = median(api);
    const setMs = median(apiWithSet);
    const rate = (ms: number) => `${Math.round(VALUES / (ms / 1000)).toLocaleString('en')} values/s`;
    console.log(`floor  csv-parse + one better-sqlite3 transaction: ${floorMs.toFixed(0)} ms  (${rate(floorMs)})`);
    console.log(`api    POST /api/v1/imports (${samples} samples):    ${apiMs.toFixed(0)} ms  (${rate(apiMs)})`);
    console.log(`ratio  api / floor = ${(apiMs / floorMs).toFixed(2)}  (target ≤ 2)`);
    console.log(
      `set    the same with a correction set in force:  ${setMs.toFixed(0)} ms, ratio ${(setMs / floorMs).toFixed(2)}  (target ≤ 2.5)`,
    );
    console.log(`check  ${check}`);
    const rows: BenchRow[] = [
      { figure: `ingest ${BURNS} burns ms`, value: apiMs, floor: floorMs, target: { ratioAtMost: 2 } },
      { figure: `ingest ${BURNS} burns ms, set in force`, value: setMs, floor: floorMs, target: { ratioAtMost: 2.5 } },
    ];
    writeFileSync(
      new URL('./results-ingest.json', import.meta.url),
      `${JSON.stringify({ burns: BURNS, runs: RUNS, check, rows }, null, 2)}\n`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
