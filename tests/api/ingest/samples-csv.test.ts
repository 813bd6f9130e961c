// GET /samples.csv over many pages: the same bytes as one CSV built from the JSON list of the same
// samples (columns in order of first appearance, formula cells guarded, units converted), streamed;
// and more than CSV_MAX_ROWS matching samples refused with 422 after a count, before any sample is read.
import { stringify } from 'csv-stringify/sync';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { wideCsv } from '../../../bench/generate-wide-file.ts';
import { bulkInsert } from '../../../server/db/bulk-insert.ts';
import { inTransaction } from '../../../server/db/transaction.ts';
import { CSV_MAX_ROWS } from '../../../server/domain/samples/sample-lists.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, expectProblem, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  const upload = async (csv: string) => {
    const res = await analyst
      .post('/api/v1/imports')
      .field('instrument_id', lab.foundry.id)
      .field('method_id', lab.feMethod.id)
      .attach('file', Buffer.from(csv), 'results.csv');
    if (res.status !== 201) throw new Error(`import: ${res.status} ${res.text}`);
  };
  // The oldest samples (exported last) bring a field and an element no other sample has, and text
  // a spreadsheet would evaluate; the 2,400 newer ones fill more than two pages of the export.
  await upload(
    [
      'Sample,Heat,Furnace,Burn,Mn %,Ta [ppm]',
      '=SUM(A1:A9),K24-0001,EAF-2,1,0.75,120',
      '@cmd,K24-0002,"-1+1",1,0.70,<5',
      'K24-0003-F1,K24-0003,,1,0.72,',
      '',
    ].join('\n'),
  );
  await upload(wideCsv(7_200));
});
afterAll(() => t.close());

interface Summary {
  id: string;
  sample_code: string;
  heat: string | null;
  grade: string | null;
  kind: string | null;
  status: string;
  instrument: { code: string };
  method: { code: string };
  fields: Record<string, string>;
  flags: string[];
  conformance: { conforms: boolean | null } | null;
  created_at: string;
  updated_at: string;
  results: { element: string; reported: string | null; qualifier: string | null }[];
}

/** The export as it is specified, built independently from the JSON list of the same samples. */
async function expectedCsv(query: Record<string, string>): Promise<string> {
  const unit = query.unit ?? '%';
  const samples: Summary[] = [];
  let cursor: string | undefined;
  do {
    const res = await analyst.get('/api/v1/samples').query({ ...query, limit: 200, ...(cursor ? { cursor } : {}) });
    samples.push(...res.body.data);
    cursor = res.body.next_cursor ?? undefined;
  } while (cursor);
  const elements = [...new Set(samples.flatMap((s) => s.results.map((r) => r.element)))];
  const fields = [...new Set(samples.flatMap((s) => Object.keys(s.fields)))];
  const guard = (text: string) => (/^[=+\-@\t\r]/.test(text) ? `'${text}` : text);
  const header = [
    'id',
    'sample_code',
    'heat',
    'grade',
    'kind',
    'status',
    'instrument',
    'method',
    ...fields,
    'created_at',
    'updated_at',
    'flags',
    'conforms',
  ];
  const rows = samples.map((s) => [
    ...[s.id, s.sample_code, s.heat ?? '', s.grade ?? '', s.kind ?? '', s.status, s.instrument.code, s.method.code]
      .concat(
        fields.map((f) => s.fields[f] ?? ''),
        [s.created_at, s.updated_at, s.flags.join(' '), s.conformance ? String(s.conformance.conforms ?? 'undecided') : ''],
      )
      .map(guard),
    ...elements.map((e) => {
      const r = s.results.find((result) => result.element === e);
      return r?.reported == null ? '' : `${r.qualifier ?? ''}${r.reported}`;
    }),
  ]);
  return stringify([[...header, ...elements.map((e) => `${e} [${unit}]`)].map(guard), ...rows]);
}

describe('GET /api/v1/samples.csv', () => {
  it('streams every sample over several pages, byte for byte the CSV of the same samples built at once', async () => {
    for (const unit of ['%', 'ppm']) {
      const res = await analyst.get('/api/v1/samples.csv').query({ unit });
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename=samples-\d{4}-\d{2}-\d{2}\.csv$/);
      expect(res.headers['transfer-encoding']).toBe('chunked');
      const expected = await expectedCsv({ unit });
      expect(res.text.split('\n')).toHaveLength(2_400 + 3 + 2);
      expect(res.text).toBe(expected);
    }
    const [header] = (await analyst.get('/api/v1/samples.csv')).text.split('\n');
    expect(
      header.startsWith('id,sample_code,heat,grade,kind,status,instrument,method,Furnace,created_at,updated_at,flags,conforms,C [%],'),
    ).toBe(true);
    // Ta comes last: only the oldest samples, on the last page, have it.
    expect(header.endsWith(',W [%],Zr [%],Ta [%]')).toBe(true);
  });

  it('exports the filtered samples only, and a header alone when none match', async () => {
    const one = await analyst.get('/api/v1/samples.csv').query({ heat: 'K24-0002' });
    expect(one.text).toBe(await expectedCsv({ heat: 'K24-0002' }));
    expect(one.text.split('\n')[1]).toMatch(/^smp_\w+,'@cmd,K24-0002,,,draft,OES-1,FE-LA,'-1\+1,/);
    const none = await analyst.get('/api/v1/samples.csv').query({ heat: 'K99-9999' });
    expect(none.text).toBe('id,sample_code,heat,grade,kind,status,instrument,method,created_at,updated_at,flags,conforms\n');
  });
});

describe('GET /api/v1/samples.csv with more than CSV_MAX_ROWS matching samples', () => {
  let big: TestApp;
  beforeAll(async () => {
    big = await createTestApp();
    const bigLab = await seedDemoLab(big.db);
    const now = new Date().toISOString();
    const rows = Array.from({ length: CSV_MAX_ROWS + 1 }, (_, i) => ({
      id: `smp_${String(i).padStart(26, '0')}`,
      sample_code: `S-${i}`,
      instrument_id: bigLab.foundry.id,
      method_id: bigLab.feMethod.id,
      fields_json: '{}',
      status: 'draft',
      source: 'push',
      results_json: '[]',
      flags_json: '[]',
      created_by_label: 'test',
      created_at: now,
      updated_at: now,
    }));
    await inTransaction(big.db, (trx) => bulkInsert(trx, 'samples', rows));
  });
  afterAll(() => big.close());

  it('refuses with 422 after counting, before reading a single sample', async () => {
    const viewer = (await signedInAgent(big, 'viewer')).agent;
    const queries: string[] = [];
    const record = (query: { sql: string }) => queries.push(query.sql);
    big.db.on('query', record);
    const res = await viewer.get('/api/v1/samples.csv');
    big.db.off('query', record);
    expectProblem(res, 422);
    expect(problemBody(res).detail).toBe(`More than ${CSV_MAX_ROWS} samples match: narrow the filters (e.g. created_from/created_to).`);
    const onSamples = queries.filter((sql) => /from .samples./.test(sql));
    expect(onSamples).toEqual([expect.stringMatching(/^select count\(\*\) as .n. from .samples./)]);
  });
});
