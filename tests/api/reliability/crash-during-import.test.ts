// kill -9 while a 20,000-burn file is being imported, then restart: the import is wholly there or
// wholly absent (never some of its samples), and uploading the file again works.
import { describe, expect, it } from 'vitest';
import { wideCsv } from '../../../bench/generate-wide-file.ts';
import { readDatabaseFile, signIn, startServerProcess, useTemporaryDatabaseFile } from './server-process.ts';

const TRIALS = 4;
const PORT = 4390;
const file = Buffer.from(wideCsv(20_000, { seed: 77 }));
const database = useTemporaryDatabaseFile('meltwire-crash-');

async function upload(url: string, cookie: string, ids: { instrument: string; method: string }) {
  const form = new FormData();
  form.set('instrument_id', ids.instrument);
  form.set('method_id', ids.method);
  form.set('file', new Blob([file], { type: 'text/csv' }), 'crash.csv');
  return fetch(`${url}/api/v1/imports`, { method: 'POST', headers: { cookie }, body: form });
}

/** What the database holds, read directly: every import's samples complete, no sample without its import. */
function inspect() {
  return readDatabaseFile(database.file, (db) => {
    const imports = db.prepare('select id, report_json from imports').all() as { id: string; report_json: string }[];
    const perImport = imports.map(({ id, report_json }) => ({
      expected: (JSON.parse(report_json) as { counts: { samples_created: number } }).counts.samples_created,
      stored: (db.prepare('select count(*) as n from samples where import_id = ?').get(id) as { n: number }).n,
    }));
    const orphans = (
      db.prepare('select count(*) as n from samples where import_id is not null and import_id not in (select id from imports)').get() as {
        n: number;
      }
    ).n;
    return { imports: imports.length, perImport, orphans };
  });
}

// The server process runs on SQLite; the PostgreSQL pass of the API suite has nothing to add here.
describe.skipIf(process.env.TEST_DATABASE_URL)('kill -9 during an import', () => {
  it(`leaves each import wholly present or wholly absent (${TRIALS} trials), and the file imports after a restart`, async () => {
    let server = await startServerProcess(database.file, PORT);
    const lookups = async (cookie: string) => {
      const get = async (path: string) =>
        ((await (await fetch(`${server.url}/api/v1${path}`, { headers: { cookie } })).json()) as { data: { id: string; code: string }[] })
          .data;
      return {
        instrument: (await get('/instruments')).find((i) => i.code === 'OES-1')!.id,
        method: (await get('/methods')).find((m) => m.code === 'FE-LA')!.id,
      };
    };
    let cookie = await signIn(server.url);
    const ids = await lookups(cookie);
    const outcomes: string[] = [];
    for (let trial = 0; trial < TRIALS; trial++) {
      const pending = upload(server.url, cookie, ids).catch(() => undefined);
      await new Promise((r) => setTimeout(r, 300 + trial * 600));
      await server.kill();
      await pending;
      const state = inspect();
      expect(state.orphans).toBe(0);
      for (const { expected, stored } of state.perImport) expect(stored).toBe(expected);
      outcomes.push(state.imports === 0 ? 'absent' : 'present');
      server = await startServerProcess(database.file, PORT);
      cookie = await signIn(server.url);
      if (state.imports > 0) break; // it got through before the kill: the file is in, nothing more to crash
    }
    const again = await upload(server.url, cookie, ids);
    expect([200, 201]).toContain(again.status);
    const body = (await again.json()) as { report: { counts: { samples_created: number } } };
    expect(body.report.counts.samples_created).toBe(6667);
    await server.stop();
    const final = inspect();
    expect(final.imports).toBe(1);
    expect(final.perImport).toEqual([{ expected: 6667, stored: 6667 }]);
    console.info(`crash trials: ${outcomes.join(', ')}; re-upload answered ${again.status}`);
  }, 180_000);
});
